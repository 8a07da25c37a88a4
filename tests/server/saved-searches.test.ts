import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sendDigests } from '../../server/services/digest';
import { createTestContext, demoEmail, invitedEngineer, mailsTo, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;
const WATCHER = 'saved.searcher@falsetrace.test';

describe('saved searches', () => {
  let ctx: TestContext;
  let author: Client;
  let watcher: Client;
  let mod: Client;

  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
    mod = await signedIn(ctx, 'moderator');
    watcher = await invitedEngineer(ctx, WATCHER);
  });
  afterAll(() => ctx.close());

  const verified = async (input: object) => {
    const id = (await author.post('/api/cases', input).expect(201)).body.case.id as number;
    await author.post(`/api/cases/${id}/submit`).expect(200);
    await mod.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(200);
    return id;
  };

  it('should list, create and delete only the user\'s own searches', async () => {
    const created = (await watcher.post('/api/profile/saved-searches', { name: 'Zorbium ringing', q: 'zorbium ringing', delivery: 'mail' }).expect(201)).body.savedSearch;
    expect(created).toMatchObject({ name: 'Zorbium ringing', q: 'zorbium ringing', cause: null, tag: null, delivery: 'mail' });
    expect((await watcher.get('/api/profile/saved-searches').expect(200)).body.savedSearches.map((s: { id: number }) => s.id)).toEqual([created.id]);
    expect((await author.get('/api/profile/saved-searches').expect(200)).body.savedSearches).toEqual([]);
    // someone else's search is not there to delete
    await author.del(`/api/profile/saved-searches/${created.id}`).expect(404);
    await watcher.del(`/api/profile/saved-searches/${created.id}`).expect(204);
    expect((await watcher.get('/api/profile/saved-searches').expect(200)).body.savedSearches).toEqual([]);
  });

  it('should refuse an empty search or a missing name with a clear message', async () => {
    const r = await watcher.post('/api/profile/saved-searches', { name: 'Everything', q: '  ', delivery: 'mail' }).expect(400);
    expect(JSON.stringify(r.body)).toContain('empty search matches every case');
    await watcher.post('/api/profile/saved-searches', { name: '', q: 'ringing', delivery: 'mail' }).expect(400);
    await watcher.post('/api/profile/saved-searches', { name: 'x', q: 'ringing', delivery: 'pigeon' }).expect(400);
  });

  it('should mail the owner when a matching case is verified, and not for one that does not match', async () => {
    await watcher.post('/api/profile/saved-searches', { name: 'Quillon spikes', q: 'quillon spikes', delivery: 'mail' }).expect(201);
    await verified({ title: 'Quillon board spikes on every edge', summary: 'Spikes on the quillon board corners' });
    await verified({ title: 'Unrelated sagging bias', summary: 'Bias node sags slowly' });
    const mails = await mailsTo(ctx, WATCHER);
    const hits = mails.filter((m) => m.subject.includes('Quillon spikes'));
    expect(hits.map((m) => m.subject)).toEqual(['[Falsetrace] Saved search “Quillon spikes”: Quillon board spikes on every edge']);
    expect(mails.some((m) => m.subject.includes('Unrelated sagging'))).toBe(false);
  });

  it('should tell nobody of a draft or a case in review that matches', async () => {
    await watcher.post('/api/profile/saved-searches', { name: 'Marrowfax', q: 'marrowfax', delivery: 'mail' }).expect(201);
    const id = (await author.post('/api/cases', { title: 'Marrowfax draft', summary: 'marrowfax private words' }).expect(201)).body.case.id;
    await author.post(`/api/cases/${id}/submit`).expect(200);
    await mod.post(`/api/cases/${id}/review`, { action: 'send_back', note: 'Add the setup' }).expect(200);
    expect((await mailsTo(ctx, WATCHER)).filter((m) => m.subject.includes('Marrowfax'))).toEqual([]);
  });

  it('should put a digest search into the next digest, leaving out a case retired before it goes', async () => {
    await watcher.post('/api/profile/saved-searches', { name: 'Pellucid droop', q: 'pellucid droop', delivery: 'digest' }).expect(201);
    const kept = await verified({ title: 'Pellucid tops droop', summary: 'pellucid droop on long pulses' });
    const retired = await verified({ title: 'Pellucid droop duplicate', summary: 'pellucid droop again' });
    await mod.post(`/api/cases/${retired}/review`, { action: 'retire', note: 'Retired before the digest' }).expect(200);
    expect((await mailsTo(ctx, WATCHER)).filter((m) => m.subject.includes('Pellucid'))).toEqual([]);
    await sendDigests({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config, search: ctx.search });
    const digest = (await mailsTo(ctx, WATCHER)).filter((m) => m.subject.includes('Daily digest')).at(-1)!;
    expect(digest.text).toContain(`#${kept} Pellucid tops droop`);
    expect(digest.text).not.toContain('Pellucid droop duplicate');
  });

  it('should not tell the author of the case about their own case', async () => {
    await author.post('/api/profile/saved-searches', { name: 'Own vexil', q: 'vexil', delivery: 'mail' }).expect(201);
    await verified({ title: 'Vexil probe case', summary: 'vexil words' });
    expect((await mailsTo(ctx, demoEmail('engineer'))).filter((m) => m.subject.includes('Own vexil'))).toEqual([]);
  });
});
