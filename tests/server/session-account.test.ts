import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { updateUser } from '../../server/db/repositories/users';
import { StatementCounter } from './helpers/statement-counter';
import { client, createTestContext, demoEmail, type TestContext } from './helpers/test-context';

describe('the account read with the session', () => {
  let ctx: TestContext;
  const counter = new StatementCounter();
  counter.counting = false;
  let app: ReturnType<typeof createApp>;
  beforeAll(async () => {
    ctx = await createTestContext();
    // the same world, its statements counted
    app = createApp({ db: ctx.db.withPlugin(counter), mailer: ctx.mailer, mail: ctx.mail, config: ctx.config, search: ctx.search });
  });
  afterAll(async () => {
    (app.locals.sessionStore as { close(): void }).close();
    await ctx.close();
  });

  const signedIn = async () => {
    const c = await client({ ...ctx, app });
    await c.login(demoEmail('engineer')).expect(200);
    return c;
  };

  it('should answer a signed-in request after one statement, the session and its account together', async () => {
    const c = await signedIn();
    await c.get('/api/auth/me').expect(200);
    counter.statements = 0;
    counter.counting = true;
    const me = await c.get('/api/auth/me').expect(200);
    counter.counting = false;
    expect(me.body.user.email).toBe(demoEmail('engineer'));
    // before: one for the session row, one for the user behind it
    expect(counter.statements).toBe(1);
  });

  it('should see a rename, a new role and a deactivation on the next request', async () => {
    const c = await signedIn();
    const { id } = (await c.get('/api/auth/me').expect(200)).body.user;
    await updateUser(ctx.db, id, { name: 'Renamed Engineer', role: 'moderator' });
    const after = (await c.get('/api/auth/me').expect(200)).body.user;
    expect(after).toMatchObject({ name: 'Renamed Engineer', role: 'moderator' });
    await updateUser(ctx.db, id, { active: 0 });
    expect((await c.get('/api/auth/me').expect(200)).body.user).toBeNull();
    await c.get('/api/cases').expect(401);
    await updateUser(ctx.db, id, { active: 1, name: 'Demo Engineer', role: 'engineer' });
  });

  it('should look the account up itself when the session row does not name it', async () => {
    const c = await signedIn();
    // a row whose account column is empty (the session data still names the user): the store cannot say, passport asks
    await ctx.db.updateTable('sessions').set({ user_id: null }).execute();
    expect((await c.get('/api/auth/me').expect(200)).body.user.email).toBe(demoEmail('engineer'));
  });
});
