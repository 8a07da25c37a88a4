import type { Db } from '../db/database';
import type { AppDeps } from '../deps';

/**
 * The case change log (table `case_changes`) that keeps every app instance's search index in step.
 *
 * Why a table polled every half second rather than PostgreSQL's LISTEN/NOTIFY: it works the
 * same on SQLite and PostgreSQL, a notification missed while an instance was restarting or its
 * connection dropped is still in the table (an instance resumes from the last id it applied),
 * and a poll of an indexed `id > ?` costs next to nothing. A change reaches the other instances
 * within about a second.
 */

/** Rows are kept this long: an instance down for longer rebuilds from its snapshot's stamp anyway. */
export const CHANGE_LOG_KEEP_MS = 24 * 60 * 60 * 1000;

export interface CaseChange {
  id: number;
  /** Null: re-read every case. */
  case_id: number | null;
}

/** Writes a change down; returns its id. `caseId` null asks every instance to re-read every case. */
export async function recordCaseChange(db: Db, caseId: number | null): Promise<number> {
  const row = await db.insertInto('case_changes').values({ case_id: caseId, changed_at: new Date().toISOString() }).returning('id').executeTakeFirstOrThrow();
  return Number(row.id);
}

/** The newest change's id (0 when there is none): where an index built now starts following. */
export async function latestChangeId(db: Db): Promise<number> {
  const row = await db.selectFrom('case_changes').select((eb) => eb.fn.max('id').as('id')).executeTakeFirst();
  return Number(row?.id ?? 0);
}

export async function changesAfter(db: Db, afterId: number, limit = 1000): Promise<CaseChange[]> {
  const rows = await db.selectFrom('case_changes').select(['id', 'case_id']).where('id', '>', afterId).orderBy('id').limit(limit).execute();
  return rows.map((r) => ({ id: Number(r.id), case_id: r.case_id === null ? null : Number(r.case_id) }));
}

export async function pruneChanges(db: Db, now = Date.now()): Promise<void> {
  await db.deleteFrom('case_changes').where('changed_at', '<', new Date(now - CHANGE_LOG_KEEP_MS).toISOString()).execute();
}

/**
 * After a write that changes a case's searchable text or who may see it: the index here is
 * updated at once (the writer sees their change) and the change is logged for the others.
 */
export async function caseChanged(deps: Pick<AppDeps, 'db' | 'search'>, id: number): Promise<void> {
  if (deps.search) await deps.search.syncCase(id);
  else await recordCaseChange(deps.db, id);
}

/** After a change that touches many cases at once (tag curation, an import). */
export async function allCasesChanged(deps: Pick<AppDeps, 'db' | 'search'>): Promise<void> {
  if (deps.search) await deps.search.rebuild();
  else await recordCaseChange(deps.db, null);
}

/** After a case is deleted: re-reading it finds nothing, which takes it out of every index. */
export const caseRemoved = caseChanged;
