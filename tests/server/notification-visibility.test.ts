import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sendDigests } from '../../server/services/digest';
import { createTestContext, invitedEngineer, mailsTo, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

const WATCHER = 'tag.watcher@falsetrace.test';

/** Watching a tag must not tell anyone about cases they could not open themselves. */
describe('notifications follow the case visibility policy', () => {
  let ctx: TestContext;
  let author: Client;
  let watcher: Client;
  let mod: Client;

  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
    mod = await signedIn(ctx, 'moderator');
    watcher = await invitedEngineer(ctx, WATCHER);
    await watcher.post('/api/tags/secret-rig/watch').expect(200);
    await watcher.post('/api/tags/digest-rig/watch').expect(200);
    await watcher.put('/api/profile/notifications', { prefs: { comment: 'instant', retired: 'instant', verified: 'instant' } }).expect(200);
  });
  afterAll(() => ctx.close());

  const draft = async (title: string, tag: string) =>
    (await author.post('/api/cases', { title, summary: 'hidden symptom text', tags: [tag] }).expect(201)).body.case.id as number;

  it('should mail a tag watcher nothing about drafts, cases in review or retired cases', async () => {
    const id = await draft('Hidden draft under a watched tag', 'secret-rig');
    await author.post(`/api/cases/${id}/comments`, { body: 'Draft comment text that must stay private' }).expect(201);
    await author.post(`/api/cases/${id}/submit`).expect(200);
    await author.post(`/api/cases/${id}/comments`, { body: 'In-review comment text that must stay private' }).expect(201);
    await mod.post(`/api/cases/${id}/review`, { action: 'retire', note: 'Private retire note' }).expect(200);
    await ctx.mail.flush();
    const mails = await mailsTo(ctx, WATCHER);
    expect(mails.filter((m) => m.subject.includes('Hidden draft'))).toEqual([]);
  });

  it('should still mail the watcher once the case is verified and visible', async () => {
    const id = await draft('Visible after verification', 'secret-rig');
    await author.post(`/api/cases/${id}/submit`).expect(200);
    await mod.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(200);
    await author.post(`/api/cases/${id}/comments`, { body: 'A public comment' }).expect(201);
    await ctx.mail.flush();
    const subjects = (await mailsTo(ctx, WATCHER)).map((m) => m.subject).filter((s) => s.includes('Visible after verification'));
    expect(subjects.length).toBe(2);
  });

  it('should leave hidden cases out of the digest, judged when the digest is sent', async () => {
    await watcher.put('/api/profile/notifications', { prefs: { comment: 'digest', verified: 'digest', retired: 'digest' } }).expect(200);
    const hidden = await draft('Digest hidden draft', 'digest-rig');
    await author.post(`/api/cases/${hidden}/comments`, { body: 'digest draft comment' }).expect(201);
    // visible when the comment is made, retired before the digest goes out
    const later = await draft('Digest later retired', 'digest-rig');
    await author.post(`/api/cases/${later}/submit`).expect(200);
    await mod.post(`/api/cases/${later}/review`, { action: 'verify' }).expect(200);
    await author.post(`/api/cases/${later}/comments`, { body: 'comment while verified' }).expect(201);
    await mod.post(`/api/cases/${later}/review`, { action: 'retire', note: 'Private digest retire note' }).expect(200);
    await sendDigests({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config });
    await ctx.mail.flush();
    const digest = (await mailsTo(ctx, WATCHER)).filter((m) => m.subject.includes('Daily digest'));
    for (const m of digest) {
      expect(m.text).not.toContain('Digest hidden draft');
      expect(m.text).not.toContain(`/cases/${hidden}`);
      expect(m.text).not.toContain(`/cases/${later}`);
    }
  });

  it('should list no tag, and count no case, that only hidden cases use', async () => {
    await draft('Only hidden use of a tag', 'only-hidden-tag');
    const seen = (await watcher.get('/api/tags').expect(200)).body.tags as { tag: string; count: number }[];
    expect(seen.map((t) => t.tag)).not.toContain('only-hidden-tag');
    // secret-rig: one verified case is visible; the retired one is not counted
    expect(seen.find((t) => t.tag === 'secret-rig')?.count).toBe(1);
    const own = (await author.get('/api/tags').expect(200)).body.tags as { tag: string }[];
    expect(own.map((t) => t.tag)).toContain('only-hidden-tag');
    const all = (await mod.get('/api/tags').expect(200)).body.tags as { tag: string; count: number }[];
    expect(all.find((t) => t.tag === 'secret-rig')?.count).toBe(2);
  });
});
