import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, createTestContext, demoEmail, mailsTo, signedIn, type TestContext } from './helpers/test-context';

const statuses = async (n: number, run: (i: number) => Promise<{ status: number }>) => {
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push((await run(i)).status);
  return out;
};

describe('sign-in limits hold per account and per client', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should stop one client spraying passwords over 30 addresses', async () => {
    const c = await client(ctx);
    const codes = await statuses(30, (i) => c.login(`sprayed.${i}@falsetrace.test`, 'wrong-password-1'));
    expect(codes).toContain(429);
  });

  it('should lock an account whatever X-Forwarded-For says, without a configured proxy', async () => {
    const c = await client(ctx);
    const codes = await statuses(12, (i) =>
      c.agent.post('/api/auth/login').set('x-csrf-token', c.token).set('X-Forwarded-For', `203.0.113.${i + 1}`).send({ email: demoEmail('moderator'), password: 'wrong-password-2' }),
    );
    expect(codes.slice(-2)).toEqual([429, 429]);
  });

});

describe('mail-sending routes are capped per address and per account', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should send at most a few reset mails to one address, rotating X-Forwarded-For or not', async () => {
    const c = await client(ctx);
    const codes = await statuses(14, (i) =>
      c.agent.post('/api/auth/password-reset').set('x-csrf-token', c.token).set('X-Forwarded-For', `198.51.100.${i + 1}`).send({ email: demoEmail('admin') }),
    );
    expect(codes.filter((s) => s === 202).length).toBeLessThanOrEqual(3);
    expect((await mailsTo(ctx, demoEmail('admin'))).filter((m) => /reset/i.test(m.subject)).length).toBeLessThanOrEqual(3);
  });

  it('should refuse a comment that @mentions more than ten people', async () => {
    const admin = await signedIn(ctx, 'admin');
    for (let i = 0; i < 11; i++) await admin.post('/api/admin/people/invitations', { email: `crowd.${i}@falsetrace.test`, role: 'engineer' }).expect(201);
    for (let i = 0; i < 11; i++) {
      const token = (await mailsTo(ctx, `crowd.${i}@falsetrace.test`)).at(-1)!.text.match(/accept-invitation\/(\S+)/)![1];
      await (await client(ctx)).post('/api/auth/invitations/accept', { token, name: `Crowd ${i}`, password: 'crowd-password-1' }).expect(201);
    }
    const eng = await signedIn(ctx, 'engineer');
    const id = (await eng.post('/api/cases', { title: 'Mention storm', summary: 'many names' }).expect(201)).body.case.id;
    const everyone = Array.from({ length: 11 }, (_, i) => `@crowd.${i}`).join(' ');
    const res = await eng.post(`/api/cases/${id}/comments`, { body: `Look, ${everyone}` }).expect(400);
    expect(res.body.error).toMatch(/at most 10 people/);
    await eng.post(`/api/cases/${id}/comments`, { body: 'Look, @crowd.1 and @crowd.2' }).expect(201);
  });

  it('should cap invitations and comments per account', async () => {
    const admin = await signedIn(ctx, 'admin');
    // 11 sent above by another session of the same admin: the limit is per account
    const invites = await statuses(12, (i) => admin.post('/api/admin/people/invitations', { email: `wave.${i}@falsetrace.test`, role: 'engineer' }));
    expect(invites).toContain(429);
    const eng = await signedIn(ctx, 'engineer');
    const id = (await eng.post('/api/cases', { title: 'Comment flood', summary: 'many comments' }).expect(201)).body.case.id;
    const comments = await statuses(32, (i) => eng.post(`/api/cases/${id}/comments`, { body: `comment ${i}` }));
    expect(comments).toContain(429);
  });
});

describe('X-Forwarded-For behind a configured proxy', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext({ trustProxy: 'loopback' });
  });
  afterAll(() => ctx.close());

  it('should count each forwarded client separately when TRUST_PROXY names the proxy', async () => {
    const c = await client(ctx);
    const codes = await statuses(12, (i) =>
      c.agent.post('/api/auth/password-reset').set('x-csrf-token', c.token).set('X-Forwarded-For', `192.0.2.${i + 1}`).send({ email: `someone.${i}@falsetrace.test` }),
    );
    expect(codes.every((s) => s === 202)).toBe(true);
  });
});
