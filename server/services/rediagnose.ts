import { performance } from 'node:perf_hooks';
import { setImmediate as yieldToRequests } from 'node:timers/promises';
import type { CaseSetup } from '../../shared/schemas/case';
import type { StatedCause } from '../../shared/schemas/case';
import { replaceCaseTags } from '../db/repositories/case-tags';
import type { Db } from '../db/database';
import type { AppDeps } from '../deps';
import { caseChanged } from '../search/change-log';
import { recomputeDiagnosis } from './case-diagnosis';
import { engineRevision } from './engine-revision';

/** The `app_state` key holding the engine revision every stored diagnosis was last computed by. */
export const ENGINE_REVISION_KEY = 'engine_revision';
/** Cases read at a time. */
const BATCH = 100;
/** The engine takes about a millisecond a case: the event loop goes back to requests this often (ms). */
const SLICE_MS = 10;

/** Records that every stored diagnosis is the current engine's (after a seed computed them all). */
export async function markDiagnosesCurrent(db: Db, revision = engineRevision()): Promise<void> {
  await db
    .insertInto('app_state')
    .values({ key: ENGINE_REVISION_KEY, value: revision })
    .onConflict((oc) => oc.column('key').doUpdateSet({ value: revision }))
    .execute();
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
  if (stored?.value === revision) return null;
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
      const diagnosis = d.diagnosis ? JSON.stringify(d.diagnosis) : null;
      if (diagnosis === row.diagnosis) continue;
      await db.transaction().execute(async (trx) => {
        await trx
          .updateTable('cases')
          .set({ diagnosis, engine_cause: d.engineCause, cause: d.cause, disagrees: d.disagrees ? 1 : 0 })
          .where('id', '=', row.id)
          .execute();
        await replaceCaseTags(trx, row.id, 'engine', d.engineTags);
      });
      await caseChanged(deps, row.id);
      updated++;
    }
  }
  await markDiagnosesCurrent(db, revision);
  return { checked, updated };
}
