import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;
type Tag = { tag: string; count: number };

/**
 * The tag counters kept by triggers (migration 0015) against a recount from the tag uses
 * themselves, after each kind of write that can change them.
 */
describe('tag counts kept by the database', () => {
  let ctx: TestContext;
  let eng: Client;
  let mod: Client;

  beforeAll(async () => {
    ctx = await createTestContext();
    [eng, mod] = await Promise.all([signedIn(ctx, 'engineer'), signedIn(ctx, 'moderator')]);
  });
  afterAll(() => ctx.close());

  /** What the counters must say: every tag use grouped by tag, all cases and verified ones. */
  async function recount() {
    const rows = await ctx.db
      .selectFrom('case_tags')
      .innerJoin('cases', 'cases.id', 'case_tags.case_id')
      .select(['case_tags.tag', 'cases.status'])
      .execute();
    const out = new Map<string, { all: number; verified: number }>();
    for (const r of rows) {
      const c = out.get(r.tag) ?? { all: 0, verified: 0 };
      c.all++;
      if (r.status === 'verified') c.verified++;
      out.set(r.tag, c);
    }
    return out;
  }

  async function expectCountersRight() {
    const kept = await ctx.db.selectFrom('tag_counts').selectAll().execute();
    const truth = await recount();
    const nonZero = kept.filter((k) => Number(k.all_cases) !== 0 || Number(k.verified_cases) !== 0);
    expect(Object.fromEntries(nonZero.map((k) => [k.tag, { all: Number(k.all_cases), verified: Number(k.verified_cases) }]))).toEqual(Object.fromEntries(truth));
  }

  const updatedAt = async (c: Client, id: number) => (await c.get(`/api/cases/${id}`).expect(200)).body.case.updatedAt as string;
  const create = async (title: string, tags: string[]) => (await eng.post('/api/cases', { title, summary: 'counter check', statedCause: 'ground-lead', lessonSummary: 'check the counters', tags }).expect(201)).body.case.id as number;
  const verify = async (id: number) => {
    await eng.post(`/api/cases/${id}/submit`).expect(200);
    await mod.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(200);
  };
  const tagsAs = async (c: Client) => Object.fromEntries(((await c.get('/api/tags').expect(200)).body.tags as Tag[]).map((t) => [t.tag, t.count]));

  it('should follow new cases, verification, retagging, retiring, renames, merges and deletes', async () => {
    const a = await create('Counter case A', ['ctr-clip', 'ctr-spring']);
    const b = await create('Counter case B', ['ctr-clip']);
    const draft = await create('Counter draft', ['ctr-clip', 'ctr-draft-only']);
    await expectCountersRight();
    await verify(a);
    await verify(b);
    await expectCountersRight();

    // the engineer sees verified cases and their own drafts; the moderator sees every case
    expect(await tagsAs(eng)).toMatchObject({ 'ctr-clip': 3, 'ctr-spring': 1, 'ctr-draft-only': 1 });
    expect(await tagsAs(mod)).toMatchObject({ 'ctr-clip': 3, 'ctr-spring': 1, 'ctr-draft-only': 1 });
    const other = await signedIn(ctx, 'admin');
    const seenByOther = await tagsAs(other);
    expect(seenByOther['ctr-clip']).toBe(3);

    await mod.patch(`/api/cases/${a}`, { tags: ['ctr-clip', 'ctr-coax'], baseUpdatedAt: await updatedAt(mod, a) }).expect(200);
    await expectCountersRight();
    await mod.post(`/api/cases/${b}/review`, { action: 'retire', note: 'superseded by a later case' }).expect(200);
    await expectCountersRight();
    await mod.post('/api/tags/ctr-coax/rename', { to: 'ctr-coaxial' }).expect(200);
    await expectCountersRight();
    await mod.post('/api/tags/ctr-spring/merge', { into: 'ctr-clip' }).expect(200);
    await expectCountersRight();
    await eng.del(`/api/cases/${draft}`).expect(204);
    await expectCountersRight();
    expect(await tagsAs(mod)).not.toHaveProperty('ctr-draft-only');
  });
});
