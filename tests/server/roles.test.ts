import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '../../shared/auth/roles';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

const ROUTES = [
  { method: 'get', url: '/api/admin/people' },
  { method: 'get', url: '/api/dev/outbox' },
] as const;

describe('role matrix over the People and Outbox routes', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  for (const route of ROUTES) {
    it(`should answer ${route.url} with 401 to anonymous callers`, async () => {
      await request(ctx.app)[route.method](route.url).expect(401);
    });
    for (const [role, status] of [
      ['engineer', 403],
      ['moderator', 403],
      ['admin', 200],
    ] as [Role, number][]) {
      it(`should answer ${route.url} with ${status} to a signed-in ${role}`, async () => {
        const c = await signedIn(ctx, role);
        await c.get(route.url).expect(status);
      });
    }
  }

  it('should refuse invitations and role changes from a moderator with 403', async () => {
    const c = await signedIn(ctx, 'moderator');
    await c.post('/api/admin/people/invitations', { email: 'x@falsetrace.test', role: 'engineer' }).expect(403);
    await c.patch('/api/admin/people/1', { role: 'admin' }).expect(403);
  });

  it('should let an admin change a role and deactivate, but not demote themself', async () => {
    const c = await signedIn(ctx, 'admin');
    const { people } = (await c.get('/api/admin/people').expect(200)).body;
    const eng = people.find((p: { role: string }) => p.role === 'engineer');
    const me = people.find((p: { role: string }) => p.role === 'admin');
    expect((await c.patch(`/api/admin/people/${eng.id}`, { role: 'moderator' }).expect(200)).body.person.role).toBe('moderator');
    await c.patch(`/api/admin/people/${eng.id}`, { role: 'engineer' }).expect(200);
    const res = await c.patch(`/api/admin/people/${me.id}`, { active: false }).expect(400);
    expect(res.body.error).toMatch(/yourself/);
    await c.patch(`/api/admin/people/${eng.id}`, {}).expect(400);
    await c.patch(`/api/admin/people/99999`, { active: false }).expect(404);
    await c.patch(`/api/admin/people/${eng.id}`, { role: 'superuser' }).expect(400);
  });

  it('should hide the outbox when a real SMTP server is configured', async () => {
    const real = { ...ctx.mailer, usesLocalFake: false };
    const { createApp } = await import('../../server/app');
    const app = createApp({ db: ctx.db, mailer: real, mail: ctx.mail, config: ctx.config });
    const agent = request.agent(app);
    const token = (await agent.get('/api/auth/csrf')).body.csrfToken;
    const login = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: 'admin@falsetrace.test', password: 'demo-probe-2026' }).expect(200);
    // the sign-in answer says it too, so the nav is whole at once
    expect(login.body.localMail).toBe(false);
    await agent.get('/api/dev/outbox').expect(404);
    // the client hides the Outbox link on this answer
    expect((await agent.get('/api/auth/me')).body.localMail).toBe(false);
    (app.locals.sessionStore as { close(): void }).close();
  });
});
