import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startLocalSmtpFake } from '../../server/mail/local-smtp-fake';
import { createMailQueue } from '../../server/mail/mail-queue';
import { createMailer } from '../../server/mail/mailer';
import { pendingMailCount } from '../../server/db/repositories/mail-queue';
import { createTestContext, mailsTo, signedIn, type TestContext, updatedAtOf } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

describe('review desk actions', () => {
  let ctx: TestContext;
  let eng: Client;
  let mod: Client;
  let admin: Client;
  const submitted = async (title: string) => {
    const id = (await eng.post('/api/cases', { title, summary: 'one-line symptom for review' })).body.case.id as number;
    await eng.post(`/api/cases/${id}/submit`).expect(200);
    return id;
  };

  beforeAll(async () => {
    ctx = await createTestContext();
    [eng, mod, admin] = await Promise.all([signedIn(ctx, 'engineer'), signedIn(ctx, 'moderator'), signedIn(ctx, 'admin')]);
  });
  afterAll(() => ctx.close());

  it('should mail moderators when a case is submitted', async () => {
    await submitted('Submitted case mails moderators');
    const mails = await mailsTo(ctx, 'moderator@falsetrace.test');
    expect(mails.some((m) => /Submitted case mails moderators/.test(m.subject) && /Submitted for review/.test(m.text))).toBe(true);
    expect((await mailsTo(ctx, 'admin@falsetrace.test')).length).toBeGreaterThan(0);
  });

  it('should refuse reviews from engineers and from the author', async () => {
    const id = await submitted('Engineer may not review');
    await eng.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(403);
    const own = (await mod.post('/api/cases', { title: 'Moderator own case', summary: 'own' })).body.case.id;
    await mod.post(`/api/cases/${own}/submit`).expect(200);
    const res = await mod.post(`/api/cases/${own}/review`, { action: 'verify' }).expect(403);
    expect(res.body.error).toMatch(/own cases/);
    await admin.post(`/api/cases/${own}/review`, { action: 'verify' }).expect(200);
  });

  it('should send back with a note, then verify after resubmission, auditing and mailing each step', async () => {
    const id = await submitted('Loop gain looked halved');
    await mod.post(`/api/cases/${id}/review`, { action: 'send_back' }).expect(400);
    await mod.post(`/api/cases/${id}/review`, { action: 'send_back', note: 'Attach the capture, please.' }).expect(200);
    const back = (await eng.get(`/api/cases/${id}`)).body.case;
    expect(back).toMatchObject({ status: 'needs_changes', reviewNote: 'Attach the capture, please.', permissions: { edit: true } });
    await eng.patch(`/api/cases/${id}`, { lessonSummary: 'Check the probe ratio before the loop', baseUpdatedAt: back.updatedAt }).expect(200);
    await eng.post(`/api/cases/${id}/submit`).expect(200);
    await mod.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(200);
    expect((await eng.get(`/api/cases/${id}`)).body.case.status).toBe('verified');
    await mod.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(409);

    const history = (await eng.get(`/api/cases/${id}/history`)).body.history.map((h: { action: string }) => h.action);
    expect(history).toEqual(['verify', 'submit', 'send_back', 'submit']);
    const mails = (await mailsTo(ctx, 'engineer@falsetrace.test')).filter((m) => m.subject.includes('Loop gain looked halved'));
    expect(mails.map((m) => m.text)).toEqual(expect.arrayContaining([expect.stringMatching(/Sent back.*[\s\S]*Attach the capture/), expect.stringMatching(/Verified by/)]));
  });

  it('should retire with a reason and mark duplicates that link to the original', async () => {
    const original = await submitted('Original ringing case');
    await mod.post(`/api/cases/${original}/review`, { action: 'verify' }).expect(200);
    const dup = await submitted('Same ringing again');
    await mod.post(`/api/cases/${dup}/review`, { action: 'duplicate' }).expect(400);
    await mod.post(`/api/cases/${dup}/review`, { action: 'duplicate', duplicateOf: dup }).expect(400);
    await mod.post(`/api/cases/${dup}/review`, { action: 'duplicate', duplicateOf: 99999 }).expect(404);
    await mod.post(`/api/cases/${dup}/review`, { action: 'duplicate', duplicateOf: original }).expect(200);
    const row = await ctx.db.selectFrom('cases').selectAll().where('id', '=', dup).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ status: 'retired', duplicate_of: original });

    const other = await submitted('Not a probing problem');
    await mod.post(`/api/cases/${other}/review`, { action: 'retire' }).expect(400);
    await mod.post(`/api/cases/${other}/review`, { action: 'retire', note: 'The circuit really was broken' }).expect(200);
    const entry = (await mod.get(`/api/cases/${other}/history`)).body.history[0];
    expect(entry).toMatchObject({ action: 'retire', note: 'The circuit really was broken', before: { status: 'in_review' }, after: { status: 'retired' }, actorName: 'Tomasz Lindqvist' });
    await mod.post(`/api/cases/${other}/review`, { action: 'frobnicate' }).expect(400);
  });

  it('should audit a moderator edit with before and after', async () => {
    const id = await submitted('Typo in the title');
    await mod.patch(`/api/cases/${id}`, { title: 'Typo fixed in the title', baseUpdatedAt: await updatedAtOf(mod, id) }).expect(200);
    const [entry] = (await mod.get(`/api/cases/${id}/history`)).body.history;
    expect(entry).toMatchObject({ action: 'moderator_edit', before: { title: 'Typo in the title' }, after: { title: 'Typo fixed in the title' } });
  });
});

describe('mail queue', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should keep a mail sent while the SMTP server is down and deliver it after it is back', async () => {
    const port = ctx.fake.port;
    await ctx.fake.close();
    const queue = createMailQueue(ctx.db, createMailer(`smtp://127.0.0.1:${port}?ignoreTLS=true&connectionTimeout=2000`, true));
    await queue.send({ to: 'late@falsetrace.test', subject: 'Queued while down', text: 'hello', html: '<p>hello</p>' });
    await queue.flush();
    expect(await pendingMailCount(ctx.db)).toBe(1);
    const row = await ctx.db.selectFrom('mail_queue').selectAll().executeTakeFirstOrThrow();
    expect(row.attempts).toBe(1);
    expect(row.last_error).toBeTruthy();
    expect(await queue.retryDue(new Date())).toBe(0); // not due yet: backoff

    ctx.fake = await startLocalSmtpFake(ctx.db, port);
    expect(await queue.retryDue(new Date(Date.now() + 60_000))).toBe(1);
    expect(await pendingMailCount(ctx.db)).toBe(0);
    expect((await mailsTo(ctx, 'late@falsetrace.test')).map((m) => m.subject)).toEqual(['Queued while down']);
  });
});
