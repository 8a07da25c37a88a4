import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runDailyDigestIfDue, sendDigests } from '../../server/services/digest';
import { createTestContext, mailsTo, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

describe('lessons, tags, watches and the digest', () => {
  let ctx: TestContext;
  let eng: Client;
  let mod: Client;
  let verifiedId: number;
  const deps = () => ({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config });

  beforeAll(async () => {
    ctx = await createTestContext();
    [eng, mod] = await Promise.all([signedIn(ctx, 'engineer'), signedIn(ctx, 'moderator')]);
    verifiedId = (
      await eng.post('/api/cases', {
        title: 'Ground clip rang at 150 MHz',
        summary: '12 cm clip lead on a 1 ns edge',
        statedCause: 'ground-lead',
        lessonSummary: 'Use the ground spring for edges faster than 5 ns',
        tags: ['x10', 'clock'],
      })
    ).body.case.id;
    await eng.post(`/api/cases/${verifiedId}/submit`).expect(200);
    await mod.post(`/api/cases/${verifiedId}/review`, { action: 'verify' }).expect(200);
  });
  afterAll(() => ctx.close());

  it('should list verified lessons grouped by cause and let moderators pin them', async () => {
    const { groups, checklist } = (await eng.get('/api/lessons').expect(200)).body;
    expect(groups.map((g: { cause: string }) => g.cause)).toEqual(['ground-lead']);
    expect(groups[0].lessons[0]).toMatchObject({ caseId: verifiedId, lessonSummary: 'Use the ground spring for edges faster than 5 ns', pinned: false });
    expect(checklist).toEqual([]);
    await eng.post(`/api/lessons/${verifiedId}/pin`, { pinned: true }).expect(403);
    const pinned = (await mod.post(`/api/lessons/${verifiedId}/pin`, { pinned: true }).expect(200)).body;
    expect(pinned.checklist.map((l: { caseId: number }) => l.caseId)).toEqual([verifiedId]);
    expect((await eng.get('/api/lessons?q=spring')).body.groups).toHaveLength(1);
    expect((await eng.get('/api/lessons?q=nothing-like-this')).body.groups).toHaveLength(0);
  });

  it('should let moderators reorder the bench checklist, refusing a stale or malformed order', async () => {
    const second = (
      await eng.post('/api/cases', { title: 'Channel left at 1x', summary: 'a tenth of the gate drive', statedCause: 'attenuation-mismatch', lessonSummary: 'Check the channel setting after a probe swap' })
    ).body.case.id as number;
    await eng.post(`/api/cases/${second}/submit`).expect(200);
    await mod.post(`/api/cases/${second}/review`, { action: 'verify' }).expect(200);
    await mod.post(`/api/lessons/${verifiedId}/pin`, { pinned: true }).expect(200);
    const pinned = (await mod.post(`/api/lessons/${second}/pin`, { pinned: true }).expect(200)).body;
    const ids = (book: { checklist: { caseId: number }[] }) => book.checklist.map((l) => l.caseId);
    expect(ids(pinned)).toEqual([verifiedId, second]);

    await eng.put('/api/lessons/checklist', { caseIds: [second, verifiedId] }).expect(403);
    const moved = (await mod.put('/api/lessons/checklist', { caseIds: [second, verifiedId] }).expect(200)).body;
    expect(ids(moved)).toEqual([second, verifiedId]);
    expect(ids((await eng.get('/api/lessons').expect(200)).body)).toEqual([second, verifiedId]);

    // a page that missed a pin or unpin sends an order of the wrong set: refused, nothing moves
    const stale = await mod.put('/api/lessons/checklist', { caseIds: [verifiedId] }).expect(409);
    expect(stale.body.error).toMatch(/checklist changed/);
    const twice = await mod.put('/api/lessons/checklist', { caseIds: [second, second] }).expect(400);
    expect(twice.body.error).toMatch(/only once/);
    await mod.put('/api/lessons/checklist', { caseIds: 'all of them' }).expect(400);
    expect(ids((await eng.get('/api/lessons').expect(200)).body)).toEqual([second, verifiedId]);

    // a lesson pinned later goes to the bottom
    await mod.post(`/api/lessons/${second}/pin`, { pinned: false }).expect(200);
    const again = (await mod.post(`/api/lessons/${second}/pin`, { pinned: true }).expect(200)).body;
    expect(ids(again)).toEqual([verifiedId, second]);
  });

  it('should give lessons pinned at the same moment each a position of its own', async () => {
    const verified: number[] = [];
    for (const n of [1, 2, 3, 4]) {
      const id = (await eng.post('/api/cases', { title: `Simultaneous pin ${n}`, summary: 'pinned together', statedCause: 'bandwidth', lessonSummary: `Lesson ${n}` })).body.case.id as number;
      await eng.post(`/api/cases/${id}/submit`).expect(200);
      await mod.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(200);
      verified.push(id);
    }
    // the four reads of "highest position" used to run before any of the inserts
    await Promise.all(verified.map((id) => mod.post(`/api/lessons/${id}/pin`, { pinned: true }).expect(200)));
    const { checklist } = (await eng.get('/api/lessons').expect(200)).body as { checklist: { caseId: number; pinPosition: number }[] };
    const positions = checklist.map((l) => l.pinPosition);
    expect(new Set(positions).size).toBe(positions.length);
    expect(checklist.map((l) => l.caseId)).toEqual(expect.arrayContaining(verified));
    for (const id of verified) await mod.post(`/api/lessons/${id}/pin`, { pinned: false }).expect(200);
  });

  it('should rename, merge, add synonyms to and retire tags, for moderators only', async () => {
    await eng.post('/api/tags/x10/rename', { to: '10x' }).expect(403);
    await mod.post('/api/tags/x10/rename', { to: '10x' }).expect(200);
    let tags = (await eng.get('/api/tags')).body.tags;
    expect(tags.find((t: { tag: string }) => t.tag === '10x')).toMatchObject({ count: 1, synonyms: ['x10'] });
    // an author typing the old name gets the curated one
    const c = (await eng.post('/api/cases', { title: 'Another x10 case', summary: 'uses old tag', tags: ['x10', 'timing'] })).body.case;
    expect(c.tags).toEqual(expect.arrayContaining(['10x', 'timing']));
    await mod.post('/api/tags/timing/merge', { into: 'clock' }).expect(200);
    tags = (await eng.get('/api/tags')).body.tags;
    expect(tags.find((t: { tag: string }) => t.tag === 'timing')).toBeUndefined();
    expect(tags.find((t: { tag: string }) => t.tag === 'clock')).toMatchObject({ count: 2, synonyms: ['timing'] });
    await mod.put('/api/tags/10x/synonyms', { synonyms: ['x10', 'ten-times'] }).expect(200);
    expect((await eng.get('/api/tags')).body.tags.find((t: { tag: string }) => t.tag === '10x').synonyms).toEqual(['ten-times', 'x10']);
    await mod.post('/api/tags/clock/retire', { retired: true }).expect(200);
    const refused = await eng.post('/api/cases', { title: 'Uses a retired tag', summary: 'should be refused', tags: ['clock'] }).expect(400);
    expect(refused.body.error).toMatch(/retired the tag clock/);
    await mod.post('/api/tags/Bad Tag/rename', { to: 'x' }).expect(400);
  });

  it('should keep preferences per kind and send digest items instead of instant mails', async () => {
    const prefs = (await eng.get('/api/profile/notifications').expect(200)).body.prefs;
    expect(prefs).toMatchObject({ verified: 'instant', lessons: 'digest' });
    await eng.put('/api/profile/notifications', { prefs: { comment: 'digest', mention: 'off' } }).expect(200);
    await eng.put('/api/profile/notifications', { prefs: { comment: 'loud' } }).expect(400);
    const before = (await mailsTo(ctx, 'engineer@falsetrace.test')).length;
    await mod.post(`/api/cases/${verifiedId}/comments`, { body: 'Nice catch, @engineer' }).expect(201);
    expect((await mailsTo(ctx, 'engineer@falsetrace.test')).length).toBe(before);
    const items = await ctx.db.selectFrom('digest_items').selectAll().execute();
    expect(items.map((i) => i.kind)).toEqual(['comment']);
  });

  it('should mail an @mention and watchers of a case', async () => {
    await mod.post(`/api/cases/${verifiedId}/watch`).expect(200);
    await eng.post(`/api/cases/${verifiedId}/comments`, { body: 'Thanks @moderator, spring fitted' }).expect(201);
    const mails = await mailsTo(ctx, 'moderator@falsetrace.test');
    expect(mails.some((m) => /mentioned you/.test(m.text) && /spring fitted/.test(m.text))).toBe(true);
    expect((await eng.get('/api/profile/watches')).body.cases).toContain(verifiedId);
  });

  it('should send the digest once: a second run sends no lesson twice', async () => {
    const first = await sendDigests(deps());
    expect(first.lessons).toBeGreaterThan(0);
    const digest = (await mailsTo(ctx, 'engineer@falsetrace.test')).filter((m) => /Daily digest/.test(m.subject));
    expect(digest).toHaveLength(1);
    expect(digest[0].text).toContain('Use the ground spring for edges faster than 5 ns');
    expect(digest[0].text).toContain('New comment by Tomasz Lindqvist');
    expect(await sendDigests(deps())).toEqual({ mails: 0, lessons: 0 });
    expect((await mailsTo(ctx, 'engineer@falsetrace.test')).filter((m) => /Daily digest/.test(m.subject))).toHaveLength(1);
  });

  it('should run the daily schedule once per day after the digest hour', async () => {
    expect(await runDailyDigestIfDue(deps(), new Date('2026-12-02T05:00:00Z'))).toBe(false);
    expect(await runDailyDigestIfDue(deps(), new Date('2026-12-02T07:30:00Z'))).toBe(true);
    expect(await runDailyDigestIfDue(deps(), new Date('2026-12-02T19:00:00Z'))).toBe(false);
    expect(await runDailyDigestIfDue(deps(), new Date('2026-12-03T08:00:00Z'))).toBe(true);
  });

  it('should show the review queue with its checklist to moderators only', async () => {
    const id = (await eng.post('/api/cases', { title: 'Queue me', summary: 'waiting for a moderator', statedCause: 'loading', setup: { circuit: { mainsConnected: true } } })).body.case.id;
    await eng.post(`/api/cases/${id}/submit`).expect(200);
    await eng.get('/api/review/queue').expect(403);
    const { queue } = (await mod.get('/api/review/queue').expect(200)).body;
    const entry = queue.find((e: { case: { id: number } }) => e.case.id === id);
    expect(entry.checklist.map((i: { id: string; state: string }) => [i.id, i.state])).toEqual([
      ['engine_agrees', expect.any(String)],
      ['evidence', 'attention'],
      ['lesson', 'attention'],
      ['safety', 'attention'],
      ['capture_settings', 'not_needed'],
    ]);
    expect((await mod.get('/api/review/count')).body.waiting).toBeGreaterThan(0);
  });
});
