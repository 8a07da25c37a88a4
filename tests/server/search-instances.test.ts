import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from '../../shared/auth/roles';
import { openCaseSearch, type CaseSearch } from '../../server/search/case-search';
import { changesAfter, pruneChanges, recordCaseChange } from '../../server/search/change-log';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;
const query = (q: string) => ({ q, page: 1, pageSize: 20 });

describe('search across app instances and off the request thread', () => {
  let ctx: TestContext;
  let eng: Client;
  let mod: Client;
  let moderator: Actor;
  /** A second instance on the same database: it learns of writes only through the change log. */
  let b: CaseSearch;

  beforeAll(async () => {
    ctx = await createTestContext();
    eng = await signedIn(ctx, 'engineer');
    mod = await signedIn(ctx, 'moderator');
    const m = await ctx.db.selectFrom('users').select('id').where('role', '=', 'moderator').executeTakeFirstOrThrow();
    moderator = { id: m.id, role: 'moderator' };
    b = await openCaseSearch(ctx.db, { followMs: 0 });
  });
  afterAll(async () => {
    await b.close();
    await ctx.close();
  });

  it('should find on instance B a case written through instance A once B follows the log', async () => {
    const id = (await eng.post('/api/cases', { title: 'Quokkatron relay chatter', summary: 'Written on instance A' }).expect(201)).body.case.id;
    expect((await b.search(moderator, query('quokkatron '))).total).toBe(0);
    await b.followNow();
    expect((await b.search(moderator, query('quokkatron '))).results.map((r) => r.id)).toEqual([id]);
    expect(b.lagSeconds()).toBeGreaterThanOrEqual(0);

    await eng.del(`/api/cases/${id}`).expect(204);
    await b.followNow();
    expect((await b.search(moderator, query('quokkatron '))).total).toBe(0);
  });

  it('should follow a change that touches every case (a tag renamed) by reading them all again', async () => {
    const id = (await eng.post('/api/cases', { title: 'Wallabyscope drift', summary: 'Tagged', tags: ['wallaby-old'] }).expect(201)).body.case.id;
    await b.followNow();
    await mod.post('/api/tags/wallaby-old/rename', { to: 'wallaby-new' }).expect(200);
    await b.followNow();
    const r = await b.search(moderator, query('wallabyscope '));
    expect(r.results.map((x) => x.id)).toEqual([id]);
    expect(r.facets.tags).toEqual({ 'wallaby-new': 1 });
  });

  it('should keep change log rows for a day and prune older ones', async () => {
    const id = await recordCaseChange(ctx.db, 424242);
    await pruneChanges(ctx.db, Date.now() + 23 * 3600_000);
    expect((await changesAfter(ctx.db, id - 1)).map((c) => c.id)).toContain(id);
    await pruneChanges(ctx.db, Date.now() + 25 * 3600_000);
    expect(await changesAfter(ctx.db, 0)).toEqual([]);
  });

  it('should answer from a worker thread, and 503 with a clear message while the index loads', async () => {
    await eng.post('/api/cases', { title: 'Bilbyprobe overshoot', summary: 'Seen by the worker' }).expect(201);
    const w = await openCaseSearch(ctx.db, { worker: true, background: true, readyWaitMs: 0, followMs: 0 });
    try {
      expect(w.isReady()).toBe(false);
      // the case list scans while the index loads
      expect(await w.listCandidates('bilbyprobe', 100)).toBeUndefined();
      await expect(w.search(moderator, query('bilbyprobe '))).rejects.toMatchObject({ status: 503, message: expect.stringMatching(/still loading/) });
      await w.ready;
      expect(w.isReady()).toBe(true);
      const r = await w.search(moderator, query('bilbyprobe '));
      expect(r.results.map((x) => x.title)).toEqual(['Bilbyprobe overshoot']);
      expect(r.results[0].highlights[0]).toMatchObject({ field: 'title', ranges: [[0, 10]] });
      const listed = await w.listCandidates('bilbyprobe', 100);
      expect(listed).toHaveLength(1);
    } finally {
      await w.close();
    }
  });
});
