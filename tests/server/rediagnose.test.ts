import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ENGINE_REVISION_KEY, markDiagnosesCurrent, rediagnoseCasebook, rediagnosisInterrupted, SWEEP_MARKER_KEY } from '../../server/services/rediagnose';
import { openCaseSearch } from '../../server/search/case-search';
import { engineRevision, engineRevisionFromSource } from '../../server/services/engine-revision';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

/**
 * Diagnoses stored by an older engine: a case saved before the engine learnt something keeps
 * that engine's verdict, cause and tags until the server brings it up to date.
 */
describe('stored diagnoses brought up to the current engine', () => {
  let ctx: TestContext;
  let author: Client;
  let staleId: number;
  let currentId: number;

  // fact of the trade: a 10x probe on a channel set to 1x shows a tenth of the signal
  const tenXAtOneX = {
    probe: { nominalAttenuation: 10 },
    scope: { attenuationSetting: 1 },
    signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
    observed: { amplitudeV: 0.5 },
  };

  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
    staleId = (await author.post('/api/cases', { title: 'Reset line reads a tenth', summary: 'half a volt where 5 V was expected', setup: tenXAtOneX }).expect(201)).body.case.id;
    currentId = (await author.post('/api/cases', { title: 'Plain clock', summary: 'nothing wrong', setup: { signal: { expectedAmplitudeV: 3.3, kind: 'square' } } }).expect(201)).body.case.id;
    // as an older engine would have left it: called a true trace, no cause, no engine tags
    await ctx.db
      .updateTable('cases')
      .set({ diagnosis: JSON.stringify({ verdict: 'faithful', hypotheses: [], tags: [], assumptions: [], risks: [] }), engine_cause: null, cause: null })
      .where('id', '=', staleId)
      .execute();
    await ctx.db.deleteFrom('case_tags').where('case_id', '=', staleId).where('source', '=', 'engine').execute();
    await ctx.db.insertInto('case_tags').values({ case_id: staleId, tag: 'long-ground-lead', source: 'engine' }).execute();
    await ctx.db.updateTable('app_state').set({ value: 'an-older-engine' }).where('key', '=', ENGINE_REVISION_KEY).execute();
    await ctx.db.insertInto('app_state').values({ key: ENGINE_REVISION_KEY, value: 'an-older-engine' }).onConflict((oc) => oc.column('key').doNothing()).execute();
    // and indexed so
    await ctx.search.syncCase(staleId);
  });

  const foundUnderMismatch = async () =>
    (await author.get('/api/search').query({ q: 'reset line tenth', cause: 'attenuation-mismatch' }).expect(200)).body.results.map((r: { id: number }) => r.id);
  afterAll(() => ctx.close());

  it('should rewrite only the case whose answer changed, leave its edit time alone, and record the revision', async () => {
    const before = (await author.get(`/api/cases/${staleId}`).expect(200)).body.case;
    expect(before.diagnosis.verdict).toBe('faithful');
    expect(await foundUnderMismatch()).not.toContain(staleId);

    const done = await rediagnoseCasebook({ db: ctx.db, search: ctx.search });
    expect(done).toEqual({ checked: 2, updated: 1 });

    const after = (await author.get(`/api/cases/${staleId}`).expect(200)).body.case;
    expect(after.diagnosis.verdict).toBe('measurement-error');
    expect(after.diagnosis.hypotheses[0].causes).toEqual(['attenuation-mismatch']);
    const row = await ctx.db.selectFrom('cases').select(['engine_cause', 'cause']).where('id', '=', staleId).executeTakeFirstOrThrow();
    expect(row).toEqual({ engine_cause: 'attenuation-mismatch', cause: 'attenuation-mismatch' });
    expect(after.tags).toContain('attenuation-mismatch');
    expect(after.tags).not.toContain('long-ground-lead');
    expect(after.updatedAt).toBe(before.updatedAt);
    const state = await ctx.db.selectFrom('app_state').select('value').where('key', '=', ENGINE_REVISION_KEY).executeTakeFirstOrThrow();
    expect(state.value).toBe(engineRevision());
  });

  it('should find the rewritten case by its new cause in search and facets', async () => {
    const found = await foundUnderMismatch();
    expect(found).toContain(staleId);
    expect(found).not.toContain(currentId);
  });

  it('should leave a search snapshot that holds the rewritten case, and no mark of a sweep in progress', async () => {
    // the rewrite kept the case's edit time, so only a snapshot saved after it can be current
    const restored = await openCaseSearch(ctx.db, { dataDir: ctx.config.dataDir });
    expect(restored.origin).toBe('snapshot');
    const found = await restored.search({ id: 2, role: 'moderator' }, { q: 'reset line tenth', cause: 'attenuation-mismatch', page: 1, pageSize: 20 });
    expect(found.results.map((r) => r.id)).toContain(staleId);
    restored.close();
    expect(await rediagnosisInterrupted(ctx.db)).toBe(false);
  });

  it('should say a sweep was cut short when its mark is left behind', async () => {
    await ctx.db.insertInto('app_state').values({ key: SWEEP_MARKER_KEY, value: 'x' }).execute();
    expect(await rediagnosisInterrupted(ctx.db)).toBe(true);
    // cut short after its revision was recorded: the next start's sweep has nothing to do but clear the mark
    expect(await rediagnoseCasebook({ db: ctx.db, search: ctx.search })).toBeNull();
    expect(await rediagnosisInterrupted(ctx.db)).toBe(false);
  });

  it('should do nothing again under the same engine', async () => {
    expect(await rediagnoseCasebook({ db: ctx.db, search: ctx.search })).toBeNull();
    await markDiagnosesCurrent(ctx.db, 'another');
    expect(await rediagnoseCasebook({ db: ctx.db, search: ctx.search })).toEqual({ checked: 2, updated: 0 });
  });

  it('should give the event loop back while it works through many cases', async () => {
    // six hundred more cases, each costing the engine about half a millisecond or more
    const { id: _id, ...copy } = await ctx.db.selectFrom('cases').selectAll().where('id', '=', currentId).executeTakeFirstOrThrow();
    await ctx.db.insertInto('cases').values(Array.from({ length: 600 }, () => copy)).execute();
    await markDiagnosesCurrent(ctx.db, 'yet another');
    let turns = 0;
    let counting = true;
    const count = () => {
      turns++;
      if (counting) setImmediate(count);
    };
    setImmediate(count);
    const done = await rediagnoseCasebook({ db: ctx.db, search: ctx.search });
    counting = false;
    expect(done).toEqual({ checked: 602, updated: 0 });
    // a sweep holding the loop throughout would let the counter run once at most
    expect(turns).toBeGreaterThan(2);
  });

  it('should fingerprint the engine source, the same each time', () => {
    expect(engineRevisionFromSource()).toMatch(/^[0-9a-f]{16}$/);
    expect(engineRevisionFromSource()).toBe(engineRevision());
  });
});
