import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { updateUser } from '../../server/db/repositories/users';
import { client, createTestContext, demoEmail, signedIn, type TestContext } from './helpers/test-context';

describe('sign-in', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should answer health without sign-in', async () => {
    await request(ctx.app).get('/api/health').expect(200, { ok: true });
  });

  it('should sign in a demo account and return the contract shape', async () => {
    const c = await client(ctx);
    const res = await c.login(demoEmail('engineer')).expect(200);
    // The contract's shape, plus localMail as /api/auth/me carries it (the nav needs it at once).
    expect(res.body).toEqual({ user: { id: expect.any(Number), email: 'engineer@falsetrace.test', name: expect.any(String), role: 'engineer' }, localMail: true });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/ft\.sid=.*HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect((await c.get('/api/auth/me')).body.user.email).toBe('engineer@falsetrace.test');
  });

  it('should keep sessions in SQLite, not in memory', async () => {
    await signedIn(ctx, 'moderator');
    const rows = await ctx.db.selectFrom('sessions').selectAll().execute();
    expect(rows.some((r) => r.user_id !== null)).toBe(true);
  });

  it('should give a new session id at sign-in', async () => {
    const c = await client(ctx);
    await c.login(demoEmail('engineer')).expect(200);
    const first = (await ctx.db.selectFrom('sessions').select('sid').orderBy('expires_at', 'desc').execute()).map((r) => r.sid);
    await c.login(demoEmail('engineer')).expect(200);
    const after = (await ctx.db.selectFrom('sessions').select('sid').execute()).map((r) => r.sid);
    expect(after.filter((s) => !first.includes(s))).toHaveLength(1);
  });

  it('should refuse a wrong password with 401 and a message', async () => {
    const c = await client(ctx);
    const res = await c.login(demoEmail('admin'), 'not-the-password').expect(401);
    expect(res.body.error).toMatch(/wrong e-mail or password/i);
  });

  it('should refuse malformed sign-in input with 400 and field issues', async () => {
    const c = await client(ctx);
    const res = await c.post('/api/auth/login', { email: 'not an address', password: '' }).expect(400);
    expect(res.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'password']);
  });

  it('should refuse state-changing requests without or with a forged CSRF token (403)', async () => {
    const agent = request.agent(ctx.app);
    await agent.get('/api/auth/csrf').expect(200);
    await agent.post('/api/auth/login').send({ email: demoEmail('engineer'), password: 'demo-probe-2026' }).expect(403);
    await agent.post('/api/auth/login').set('x-csrf-token', 'abc.def').send({ email: demoEmail('engineer'), password: 'demo-probe-2026' }).expect(403);
  });

  it('should rate-limit repeated failed sign-ins with 429', async () => {
    const c = await client(ctx);
    const codes: number[] = [];
    for (let i = 0; i < 12; i++) codes.push((await c.login(demoEmail('moderator'), `wrong-${i}-password`)).status);
    expect(codes.slice(0, 3)).toEqual([401, 401, 401]);
    expect(codes).toContain(429);
    const limited = await c.login(demoEmail('moderator'), 'wrong-again');
    expect(limited.status).toBe(429);
    expect(limited.body.error).toMatch(/too many/i);
  });

  it('should end the session at sign-out', async () => {
    const c = await signedIn(ctx, 'engineer');
    await c.post('/api/auth/logout').expect(200);
    expect((await c.get('/api/auth/me')).body.user).toBeNull();
    await c.get('/api/admin/people').expect(401);
  });

  it('should stop a deactivated user from signing in and end their sessions', async () => {
    const c = await signedIn(ctx, 'engineer');
    const id = (await c.get('/api/auth/me')).body.user.id;
    await updateUser(ctx.db, id, { active: 0 });
    expect((await c.get('/api/auth/me')).body.user).toBeNull();
    const again = await client(ctx);
    await again.login(demoEmail('engineer')).expect(401);
    await updateUser(ctx.db, id, { active: 1 });
  });

  it('should let a user rename themself and change the password, ending other sessions', async () => {
    const a = await signedIn(ctx, 'admin');
    const b = await signedIn(ctx, 'admin');
    expect((await a.patch('/api/profile', { name: 'Priya H.' }).expect(200)).body.user.name).toBe('Priya H.');
    await a.post('/api/profile/password', { currentPassword: 'wrong', newPassword: 'a-new-password-1' }).expect(400);
    await a.post('/api/profile/password', { currentPassword: 'demo-probe-2026', newPassword: 'short' }).expect(400);
    await a.post('/api/profile/password', { currentPassword: 'demo-probe-2026', newPassword: 'a-new-password-1' }).expect(200);
    expect((await a.get('/api/auth/me')).body.user.name).toBe('Priya H.');
    expect((await b.get('/api/auth/me')).body.user).toBeNull();
    await (await client(ctx)).login(demoEmail('admin'), 'a-new-password-1').expect(200);
  });

  it('should answer unknown API paths with a JSON 404', async () => {
    const res = await request(ctx.app).get('/api/nothing-here').expect(404);
    expect(res.body.error).toMatch(/no api route/i);
  });
});

describe('session rows', () => {
  it('should not rewrite the session row on every signed-in request, only once a minute', async () => {
    const { createTestContext: create, signedIn: signIn } = await import('./helpers/test-context');
    const ctx = await create();
    try {
      const eng = await signIn(ctx, 'engineer');
      const expiry = async () => (await ctx.db.selectFrom('sessions').select('expires_at').where('user_id', 'is not', null).executeTakeFirstOrThrow()).expires_at;
      const before = await expiry();
      for (let i = 0; i < 3; i++) await eng.get('/api/auth/me').expect(200);
      expect(await expiry()).toBe(before);
      // a session last extended over a minute ago is extended again
      await ctx.db.updateTable('sessions').set({ expires_at: before - 120_000 }).execute();
      await eng.get('/api/auth/me').expect(200);
      expect(await expiry()).toBeGreaterThan(before - 120_000);
    } finally {
      await ctx.close();
    }
  });
});

describe('CSRF tokens belong to a session', () => {
  it('should refuse the token from before sign-in after it, and another session’s token', async () => {
    const { createTestContext: create, demoEmail: email, DEMO_PASSWORD: pw } = await import('./helpers/test-context');
    const request = (await import('supertest')).default;
    const ctx = await create();
    try {
      const agent = request.agent(ctx.app);
      const before: string = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken;
      const login = await agent.post('/api/auth/login').set('x-csrf-token', before).send({ email: email('engineer'), password: pw }).expect(200);
      const renewed = decodeURIComponent(String(login.headers['set-cookie']).match(/ft\.csrf=([^;]+)/)![1]);
      expect(renewed).toBeTruthy();
      expect(renewed).not.toBe(before);
      const sid = String(login.headers['set-cookie']).match(/ft\.sid=([^;]+)/)![1];
      // the pre-sign-in token, replayed with its cookie and the signed-in session, no longer passes
      const stale = await request(ctx.app).post('/api/cases').set('Cookie', `ft.sid=${sid}; ft.csrf=${encodeURIComponent(before)}`).set('x-csrf-token', before).send({ title: 'Stale token', summary: 'must be refused' });
      expect(stale.status).toBe(403);
      expect(stale.body.error).toMatch(/CSRF/);
      await agent.post('/api/cases').set('x-csrf-token', renewed).send({ title: 'With the renewed token', summary: 'a summary long enough' }).expect(201);
      expect((await agent.get('/api/auth/csrf').expect(200)).body.csrfToken).toBe(renewed);

      // a second person's valid token and cookie do not work with the first person's session
      const other = request.agent(ctx.app);
      const t0: string = (await other.get('/api/auth/csrf')).body.csrfToken;
      await other.post('/api/auth/login').set('x-csrf-token', t0).send({ email: email('moderator'), password: pw }).expect(200);
      const theirs: string = (await other.get('/api/auth/csrf')).body.csrfToken;
      const crossed = await request(ctx.app).post('/api/cases').set('Cookie', `ft.sid=${sid}; ft.csrf=${encodeURIComponent(theirs)}`).set('x-csrf-token', theirs).send({ title: 'Crossed token', summary: 'must be refused' });
      expect(crossed.status).toBe(403);
      expect(crossed.body.error).toMatch(/CSRF/);
    } finally {
      await ctx.close();
    }
  });
});
