import { performance } from 'node:perf_hooks';
import { setImmediate as yieldToRequests } from 'node:timers/promises';
import type { CaseSetup, StatedCause } from '../../shared/schemas/case';
import { replaceCaseTags } from '../db/repositories/case-tags';
import type { Db } from '../db/database';
import type { AppDeps } from '../deps';
import { caseChanged } from '../search/change-log';
import { diagnosisColumns, recomputeDiagnosis } from './case-diagnosis';
import { engineRevision } from './engine-revision';

/** The `app_state` key holding the engine revision every stored diagnosis was last computed by. */
export const ENGINE_REVISION_KEY = 'engine_revision';
/**
 * Set while a re-diagnosis runs: rows it rewrote keep their edit time, so a search snapshot taken
 * before it still matches the database; after a crash mid-sweep that snapshot must not be trusted.
 */
export const SWEEP_MARKER_KEY = 'engine_revision_sweep';
/** Cases read at a time. */
const BATCH = 100;
/** The engine takes about a millisecond a case: the event loop goes back to requests this often (ms). */
const SLICE_MS = 10;

/** Records that every stored diagnosis is the current engine's (after a seed computed them all). */
export async function markDiagnosesCurrent(db: Db, revision = engineRevision()): Promise<void> {
  await setState(db, ENGINE_REVISION_KEY, revision);
}

/**
 * Brings every stored diagnosis up to the current engine, once per engine revision: a case's
 * verdict, engine cause, the cause it is filed under, its disagreement flag and its engine tags
 * were computed when it was last saved, and a newer engine may answer differently. Only cases
 * whose answer changed are written (not their update time: nobody edited them) and re-indexed.
 * Reads a batch at a time and yields every few milliseconds, so requests are served meanwhile.
 * Several instances starting at once may each run it; the result is the same.
 */
export async function rediagnoseCasebook(deps: Pick<AppDeps, 'db' | 'search'>, revision = engineRevision()): Promise<{ checked: number; updated: number } | null> {
  const { db } = deps;
  const stored = await db.selectFrom('app_state').select('value').where('key', '=', ENGINE_REVISION_KEY).executeTakeFirst();
  if (stored?.value === revision) {
    // a mark left by a sweep that died after marking its revision: the index was rebuilt at this start
    await clearSweepMark(db);
    return null;
  }
  await setState(db, SWEEP_MARKER_KEY, revision);
  let checked = 0;
  let updated = 0;
  let sliceStarted = performance.now();
  for (let after = 0; ; ) {
    const rows = await db.selectFrom('cases').select(['id', 'setup', 'stated_cause', 'diagnosis']).where('id', '>', after).orderBy('id').limit(BATCH).execute();
    if (rows.length === 0) break;
    after = rows[rows.length - 1].id;
    for (const row of rows) {
      if (performance.now() - sliceStarted > SLICE_MS) {
        await yieldToRequests();
        sliceStarted = performance.now();
      }
      checked++;
      const d = recomputeDiagnosis(JSON.parse(row.setup) as CaseSetup, row.stated_cause as StatedCause | null);
      const columns = diagnosisColumns(d);
      if (columns.diagnosis === row.diagnosis) continue;
      await db.transaction().execute(async (trx) => {
        await trx.updateTable('cases').set(columns).where('id', '=', row.id).execute();
        await replaceCaseTags(trx, row.id, 'engine', d.engineTags);
      });
      await caseChanged(deps, row.id);
      updated++;
    }
  }
  // the index now holds the rewritten cases: on disk too, before the sweep counts as done
  if (updated > 0 && deps.search) await deps.search.saveSnapshot();
  await markDiagnosesCurrent(db, revision);
  await clearSweepMark(db);
  return { checked, updated };
}

/** Whether a re-diagnosis was cut short (the process died): the search snapshot may predate its rewrites. */
export async function rediagnosisInterrupted(db: Db): Promise<boolean> {
  return (await db.selectFrom('app_state').select('key').where('key', '=', SWEEP_MARKER_KEY).executeTakeFirst()) !== undefined;
}

async function clearSweepMark(db: Db): Promise<void> {
  await db.deleteFrom('app_state').where('key', '=', SWEEP_MARKER_KEY).execute();
}

async function setState(db: Db, key: string, value: string): Promise<void> {
  await db
    .insertInto('app_state')
    .values({ key, value })
    .onConflict((oc) => oc.column('key').doUpdateSet({ value }))
    .execute();
}
