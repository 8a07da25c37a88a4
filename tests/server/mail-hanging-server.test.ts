import { createServer, type Server, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pendingMailCount } from '../../server/db/repositories/mail-queue';
import { client, createTestContext, demoEmail, signedIn, type TestContext } from './helpers/test-context';

/** An SMTP server that takes the connection and never says a word. */
async function silentSmtp(): Promise<{ port: number; sockets: Set<Socket>; server: Server }> {
  const sockets = new Set<Socket>();
  const server = createServer((s) => {
    sockets.add(s);
    s.on('error', () => undefined);
    s.on('close', () => sockets.delete(s));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { port: (server.address() as { port: number }).port, sockets, server };
}

describe('a mail server that never answers holds no request', () => {
  let ctx: TestContext;
  let smtp: Awaited<ReturnType<typeof silentSmtp>>;

  beforeAll(async () => {
    smtp = await silentSmtp();
    // long enough that every attempt in this suite is still hanging when the responses arrive
    ctx = await createTestContext({ smtpUrl: `smtp://127.0.0.1:${smtp.port}?ignoreTLS=true`, mailTimeoutsMs: { connect: 20_000, greeting: 20_000, socket: 20_000 } });
  });
  afterAll(async () => {
    for (const s of smtp.sockets) s.destroy();
    await new Promise((r) => smtp.server.close(r));
    await ctx.close();
  });

  // still pending and its first attempt not yet over: the response did not wait for SMTP
  const unsent = () => ctx.db.selectFrom('mail_queue').select(['to_addr', 'subject']).where('sent_at', 'is', null).where('attempts', '=', 0).execute();

  it('should answer a password reset while its mail is still waiting in the queue', async () => {
    const c = await client(ctx);
    await c.post('/api/auth/password-reset', { email: demoEmail('moderator') }).expect(202);
    // the sender's sweep turns the request into the mail after the answer (at once on SQLite, a few
    // round trips later on PostgreSQL); the mail then waits on the silent server, unsent
    await expect.poll(async () => (await unsent()).some((m) => m.to_addr === demoEmail('moderator') && /reset/i.test(m.subject)), { timeout: 10_000 }).toBe(true);
  });

  it('should answer a case submission while the moderators’ mails are still waiting', async () => {
    const eng = await signedIn(ctx, 'engineer');
    const id = (await eng.post('/api/cases', { title: 'Submitted while mail hangs', summary: 'mail server silent' }).expect(201)).body.case.id;
    await eng.post(`/api/cases/${id}/submit`).expect(200);
    const waiting = (await unsent()).filter((m) => m.subject.includes('Submitted while mail hangs'));
    expect(waiting.map((m) => m.to_addr).sort()).toEqual([demoEmail('admin'), demoEmail('moderator')].sort());
    expect(await pendingMailCount(ctx.db)).toBeGreaterThanOrEqual(3);
  });
});
