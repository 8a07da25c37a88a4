import type { Db } from '../database';

/** The highest row id of each table a case's history writes to, taken before one action. */
export interface HistoryMarks {
  audit: number;
  revisions: number;
  comments: number;
  attachments: number;
  watches: number;
}

const maxId = async (db: Db, table: 'audit_log' | 'case_revisions' | 'comments' | 'attachments' | 'watches') =>
  Number((await db.selectFrom(table).select((eb) => eb.fn.max('id').as('n')).executeTakeFirst())?.n ?? 0);

export async function historyMarks(db: Db): Promise<HistoryMarks> {
  return {
    audit: await maxId(db, 'audit_log'),
    revisions: await maxId(db, 'case_revisions'),
    comments: await maxId(db, 'comments'),
    attachments: await maxId(db, 'attachments'),
    watches: await maxId(db, 'watches'),
  };
}

/**
 * Gives every history row written since `marks` the time `at`, for a scenario replayed with
 * fixed dates (the demo casebook). Services stamp "now"; this moves their rows into the story.
 */
export async function backdateSince(db: Db, marks: HistoryMarks, at: string): Promise<void> {
  await db.updateTable('audit_log').set({ created_at: at }).where('id', '>', marks.audit).execute();
  await db.updateTable('case_revisions').set({ created_at: at }).where('id', '>', marks.revisions).execute();
  await db.updateTable('comments').set({ created_at: at, updated_at: at }).where('id', '>', marks.comments).execute();
  await db.updateTable('attachments').set({ created_at: at }).where('id', '>', marks.attachments).execute();
  await db.updateTable('watches').set({ created_at: at }).where('id', '>', marks.watches).execute();
}

export const backdatePin = (db: Db, caseId: number, at: string) =>
  db.updateTable('pinned_lessons').set({ created_at: at }).where('case_id', '=', caseId).execute();

export const caseTimes = (db: Db, caseId: number) =>
  db.selectFrom('cases').select(['created_at', 'updated_at', 'submitted_at', 'verified_at']).where('id', '=', caseId).executeTakeFirstOrThrow();

/** Sets each of the case's time columns that an action just changed to `at`. */
export async function backdateCase(db: Db, caseId: number, before: Awaited<ReturnType<typeof caseTimes>> | null, at: string): Promise<void> {
  const now = await caseTimes(db, caseId);
  const patch: Partial<typeof now> = {};
  for (const key of ['created_at', 'updated_at', 'submitted_at', 'verified_at'] as const) {
    if (now[key] !== null && (before === null || now[key] !== before[key])) patch[key] = at;
  }
  if (Object.keys(patch).length) await db.updateTable('cases').set(patch).where('id', '=', caseId).execute();
}
