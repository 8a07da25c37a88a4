import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, createTestContext, demoEmail, linkPath, mailsTo, signedIn, type TestContext } from './helpers/test-context';

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
