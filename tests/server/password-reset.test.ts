import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { statementPreparerOf } from '../../server/db/database';
import { client, createTestContext, ON_POSTGRES, demoEmail, linkPath, mailsTo, signedIn, type TestContext } from './helpers/test-context';

describe('password reset by e-mail', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should answer the same whether or not the address has an account', async () => {
    const c = await client(ctx);
    const known = await c.post('/api/auth/password-reset', { email: demoEmail('moderator') }).expect(202);
    const unknown = await c.post('/api/auth/password-reset', { email: 'nobody@falsetrace.test' }).expect(202);
    expect(unknown.body).toEqual(known.body);
    expect(await mailsTo(ctx, 'nobody@falsetrace.test')).toHaveLength(0);
  });

  it('should reset through the mailed link once, and end the other sessions', async () => {
    const email = demoEmail('engineer');
    const other = await signedIn(ctx, 'engineer');
    const c = await client(ctx);
    await c.post('/api/auth/password-reset', { email }).expect(202);
    const [mail] = await mailsTo(ctx, email);
    expect(mail.subject).toMatch(/reset/i);
    expect(mail.html).toMatch(/<a href="http:\/\/falsetrace\.local\/reset-password\//);
    const token = linkPath(mail.text, ctx.config.publicUrl).split('/').pop()!;

    await c.post('/api/auth/password-reset/confirm', { token, password: 'compensate-the-probe' }).expect(200);
    expect((await other.get('/api/auth/me')).body.user).toBeNull();
    await (await client(ctx)).login(email).expect(401);
    await (await client(ctx)).login(email, 'compensate-the-probe').expect(200);

    const again = await c.post('/api/auth/password-reset/confirm', { token, password: 'yet-another-password' }).expect(410);
    expect(again.body.error).toMatch(/already used/i);
  });

  it('should refuse an expired reset link', async () => {
    const email = demoEmail('admin');
    const c = await client(ctx);
    await c.post('/api/auth/password-reset', { email }).expect(202);
    const [mail] = await mailsTo(ctx, email);
    const token = linkPath(mail.text, ctx.config.publicUrl).split('/').pop()!;
    await ctx.db.updateTable('auth_tokens').set({ expires_at: new Date(Date.now() - 1).toISOString() }).where('email', '=', email).execute();
    const res = await c.post('/api/auth/password-reset/confirm', { token, password: 'too-late-password' }).expect(410);
    expect(res.body.error).toMatch(/expired/i);
    await (await client(ctx)).login(email).expect(200);
  });

  it('should end every older reset link once one of them is used', async () => {
    const email = demoEmail('moderator');
    const c = await client(ctx);
    await c.post('/api/auth/password-reset', { email }).expect(202);
    await c.post('/api/auth/password-reset', { email }).expect(202);
    const links = (await mailsTo(ctx, email)).filter((m) => /reset/i.test(m.subject)).map((m) => linkPath(m.text, ctx.config.publicUrl).split('/').pop()!);
    expect(links.length).toBeGreaterThanOrEqual(2);
    const [older, newer] = links.slice(-2);
    await c.post('/api/auth/password-reset/confirm', { token: newer, password: 'newest-link-password' }).expect(200);
    const res = await c.post('/api/auth/password-reset/confirm', { token: older, password: 'older-link-password' }).expect(410);
    expect(res.body.error).toMatch(/already used/i);
    await (await client(ctx)).login(email, 'newest-link-password').expect(200);
  });
});

// counts the statements Kysely prepares (cached or not); the service code is the same on PostgreSQL
describe.skipIf(ON_POSTGRES)('password reset: the same work for a known and an unknown address (statement count read from SQLite; skipped on PostgreSQL)', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
    // no background sweeps: what is recorded is the request's own work, and mail goes out only on flush
    ctx.mail.stop();
  });
  afterAll(() => ctx.close());

  /** Every SQL statement the server runs while answering one reset request. */
  async function statementsFor(email: string) {
    const c = await client(ctx);
    const prepare = vi.spyOn(statementPreparerOf(ctx.db), 'prepare');
    try {
      const res = await c.post('/api/auth/password-reset', { email }).expect(202);
      return { body: res.body, sql: prepare.mock.calls.map(([sql]) => sql) };
    } finally {
      prepare.mockRestore();
    }
  }

  it('should run the same statements for an active account, an unknown address and a deactivated account', async () => {
    const leaver = 'leaver@falsetrace.test';
    await ctx.db.insertInto('users').values({ email: leaver, name: 'Left the team', role: 'engineer', password_hash: null, active: 0, created_at: '2026-01-01T00:00:00.000Z', updated_at: '2026-01-01T00:00:00.000Z' }).execute();
    const known = await statementsFor(demoEmail('engineer'));
    const unknown = await statementsFor('nobody@falsetrace.test');
    const inactive = await statementsFor(leaver);

    expect(known.sql.some((q) => /insert into "password_reset_requests"/.test(q))).toBe(true);
    expect(known.sql.some((q) => /"users"|"auth_tokens"|"mail_queue"/.test(q))).toBe(false);
    expect(unknown.sql).toEqual(known.sql);
    expect(inactive.sql).toEqual(known.sql);
    expect(unknown.body).toEqual(known.body);
    expect(inactive.body).toEqual(known.body);

    // the background sender then mails only the active account, and forgets every request
    expect(await mailsTo(ctx, demoEmail('engineer'))).toHaveLength(1);
    expect(await mailsTo(ctx, 'nobody@falsetrace.test')).toHaveLength(0);
    expect(await mailsTo(ctx, leaver)).toHaveLength(0);
    expect(await ctx.db.selectFrom('password_reset_requests').selectAll().execute()).toEqual([]);
    expect(await ctx.db.selectFrom('auth_tokens').select('email').where('kind', '=', 'password_reset').execute()).toEqual([{ email: demoEmail('engineer') }]);
  });
});
