import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, createTestContext, linkPath, mailsTo, signedIn, type TestContext } from './helpers/test-context';

describe('invitations by e-mail', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  const invite = async (email: string, role = 'moderator') => {
    const admin = await signedIn(ctx, 'admin');
    await admin.post('/api/admin/people/invitations', { email, role }).expect(201);
    const [mail] = await mailsTo(ctx, email);
    return { mail, token: linkPath(mail.text, ctx.config.publicUrl).split('/').pop()! };
  };

  it('should mail a single-use link that sets name and password and signs in', async () => {
    const { mail, token } = await invite('Noor.Vance@Example.test');
    expect(mail.subject).toMatch(/invited/i);
    expect(mail.html).toContain('<a href="http://falsetrace.local/accept-invitation/');
    expect(mail.text).toContain('/accept-invitation/');

    const stored = await ctx.db.selectFrom('auth_tokens').selectAll().where('email', '=', 'noor.vance@example.test').executeTakeFirstOrThrow();
    expect(stored.token_hash).not.toContain(token);
    expect(new Date(stored.expires_at).getTime() - new Date(stored.created_at).getTime()).toBe(72 * 3600 * 1000);

    const guest = await client(ctx);
    expect((await guest.get(`/api/auth/invitations/${token}`).expect(200)).body.invitation).toEqual({
      email: 'noor.vance@example.test',
      role: 'moderator',
    });
    const accepted = await guest.post('/api/auth/invitations/accept', { token, name: 'Noor Vance', password: 'scope-ground-spring' }).expect(201);
    expect(accepted.body.user).toMatchObject({ email: 'noor.vance@example.test', role: 'moderator', name: 'Noor Vance' });

    const fresh = await client(ctx);
    expect((await fresh.login('noor.vance@example.test', 'scope-ground-spring').expect(200)).body.user.role).toBe('moderator');

    const second = await (await client(ctx)).post('/api/auth/invitations/accept', { token, name: 'Someone', password: 'another-password' });
    expect(second.status).toBe(410);
    expect(second.body.error).toMatch(/already used/i);
  });

  it('should refuse an expired invitation', async () => {
    const { token } = await invite('late.arrival@example.test', 'engineer');
    await ctx.db.updateTable('auth_tokens').set({ expires_at: new Date(Date.now() - 1000).toISOString() }).where('email', '=', 'late.arrival@example.test').execute();
    const guest = await client(ctx);
    expect((await guest.get(`/api/auth/invitations/${token}`).expect(410)).body.error).toMatch(/expired/i);
    await guest.post('/api/auth/invitations/accept', { token, name: 'Late', password: 'long-enough-pw' }).expect(410);
  });

  it('should refuse an unknown link, a weak password and an existing account', async () => {
    const guest = await client(ctx);
    await guest.get(`/api/auth/invitations/${'x'.repeat(43)}`).expect(404);
    const { token } = await invite('weak.pass@example.test', 'engineer');
    const weak = await guest.post('/api/auth/invitations/accept', { token, name: 'W', password: 'short' }).expect(400);
    expect(weak.body.issues[0]).toEqual({ path: 'password', message: 'Use at least 10 characters' });
    const admin = await signedIn(ctx, 'admin');
    const dup = await admin.post('/api/admin/people/invitations', { email: 'engineer@falsetrace.test', role: 'engineer' }).expect(409);
    expect(dup.body.error).toMatch(/already has an account/);
    await admin.post('/api/admin/people/invitations', { email: 'nope', role: 'engineer' }).expect(400);
  });
});
