import { sql, type Insertable } from 'kysely';
import type { AttachmentsTable, AuditLogTable, CaseRevisionsTable, CasesTable, CommentsTable, Db, UsersTable } from '../database';
import { isPostgres } from '../dialect';

// SQLite caps bound parameters per statement; big casebooks are read in slices
const SLICE = 500;

async function inSlices<T, K = number>(ids: readonly K[], read: (slice: K[]) => Promise<T[]>): Promise<T[]> {
  const out: T[] = [];
  for (let i = 0; i < ids.length; i += SLICE) out.push(...(await read(ids.slice(i, i + SLICE))));
  return out;
}

export const casesWithIds = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('cases').selectAll().where('id', 'in', s).orderBy('id').execute());

export const authorTagsOfCases = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('case_tags').select(['case_id', 'tag']).where('case_id', 'in', s).where('source', '=', 'author').orderBy('case_id').orderBy('tag').execute());

export const revisionsOfCases = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('case_revisions').selectAll().where('case_id', 'in', s).orderBy('id').execute());

export const commentsOfCases = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('comments').selectAll().where('case_id', 'in', s).orderBy('id').execute());

export const attachmentsOfCases = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('attachments').selectAll().where('case_id', 'in', s).orderBy('id').execute());

export const historyOfCases = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('audit_log').selectAll().where('case_id', 'in', s).orderBy('id').execute());

export const pinsOfCases = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('pinned_lessons').select(['case_id', 'position']).where('case_id', 'in', s).orderBy('position').execute());

export const usersWithIds = (db: Db, ids: readonly number[]) =>
  inSlices(ids, (s) => db.selectFrom('users').select(['id', 'email', 'name', 'role']).where('id', 'in', s).orderBy('id').execute());

/** Cases that carry one of these origin keys (imported ones), by key. */
export async function casesWithOriginKeys(db: Db, keys: readonly string[]): Promise<Map<string, number>> {
  const rows = await inSlices(keys, (s) =>
    db.selectFrom('cases').select(['id', 'origin_key']).where('origin_key', 'in', s).execute(),
  );
  return new Map(rows.map((r) => [r.origin_key!, r.id]));
}

/** Cases written here (no stored origin key) created at one of these moments, with their author's e-mail. */
export const localCasesCreatedAt = (db: Db, times: readonly string[]) =>
  inSlices(times, (s) =>
    db
      .selectFrom('cases')
      .innerJoin('users', 'users.id', 'cases.author_id')
      .select(['cases.id', 'cases.created_at', 'users.email'])
      .where('cases.origin_key', 'is', null)
      .where('cases.created_at', 'in', s)
      .execute(),
  );

export async function usersByEmail(db: Db, emails: readonly string[]): Promise<Map<string, number>> {
  const rows: { id: number; email: string }[] = [];
  for (let i = 0; i < emails.length; i += SLICE) {
    rows.push(...(await db.selectFrom('users').select(['id', 'email']).where('email', 'in', emails.slice(i, i + SLICE)).execute()));
  }
  return new Map(rows.map((r) => [r.email, r.id]));
}

export async function insertImportedUser(db: Db, user: Insertable<UsersTable>): Promise<number> {
  return (await db.insertInto('users').values(user).returning('id').executeTakeFirstOrThrow()).id;
}

/** Imported rows take fresh ids here; the caller maps the archive's numbers to them. */
export async function insertImportedCase(db: Db, row: Insertable<CasesTable>): Promise<number> {
  return (await db.insertInto('cases').values(row).returning('id').executeTakeFirstOrThrow()).id;
}

/** A just-imported case's write-up with its `#123` links renumbered. */
export const updateImportedWriteUp = (db: Db, caseId: number, narrative: string, lessonDetail: string | null) =>
  db.updateTable('cases').set({ narrative, lesson_detail: lessonDetail }).where('id', '=', caseId).execute();

export async function insertImportedTags(db: Db, caseId: number, tags: readonly string[], source: 'author' | 'engine') {
  if (tags.length === 0) return;
  await db
    .insertInto('case_tags')
    .values(tags.map((tag) => ({ case_id: caseId, tag, source })))
    .onConflict((oc) => oc.doNothing())
    .execute();
}

export const linkImportedDuplicate = (db: Db, caseId: number, duplicateOf: number, retiredReason: string | null) =>
  db.updateTable('cases').set({ duplicate_of: duplicateOf, retired_reason: retiredReason }).where('id', '=', caseId).execute();

export const insertImportedRevision = (db: Db, row: Insertable<CaseRevisionsTable>) => db.insertInto('case_revisions').values(row).execute();

export async function insertImportedComment(db: Db, row: Insertable<CommentsTable>): Promise<number> {
  return (await db.insertInto('comments').values(row).returning('id').executeTakeFirstOrThrow()).id;
}

export const insertImportedAttachment = (db: Db, row: Insertable<AttachmentsTable>) => db.insertInto('attachments').values(row).execute();

/** History keeps its order but takes fresh ids: audit ids are shared by every case. */
export const insertImportedHistory = (db: Db, row: Insertable<AuditLogTable>) => db.insertInto('audit_log').values(row).execute();

/**
 * Pins a lesson at the bottom of the bench checklist. "Highest position + 1" is a read and then an
 * insert, so writers of the checklist take its lock first: two pins at the same moment on
 * PostgreSQL got the same position before. Opens a transaction when not given one.
 */
export async function appendPinnedLesson(db: Db, caseId: number, pinnedBy: number, createdAt: string): Promise<void> {
  if (!db.isTransaction) return db.transaction().execute((trx) => appendPinnedLesson(trx, caseId, pinnedBy, createdAt));
  await lockWriters(db, 'checklist');
  const { max } = await db.selectFrom('pinned_lessons').select((eb) => eb.fn.max('position').as('max')).executeTakeFirstOrThrow();
  await db
    .insertInto('pinned_lessons')
    .values({ case_id: caseId, position: Number(max ?? 0) + 1, pinned_by: pinnedBy, created_at: createdAt })
    .onConflict((oc) => oc.doNothing())
    .execute();
}

/**
 * Makes writers of one kind wait for each other inside their transactions, so the second sees
 * what the first wrote: concurrent imports (their people and cases) and checklist writers (its
 * positions). PostgreSQL only, through a transaction-scoped advisory lock (raw SQL: Kysely has no
 * builder for it); SQLite runs one write transaction at a time already.
 */
export async function lockWriters(trx: Db, what: 'casebook-import' | 'checklist'): Promise<void> {
  if (isPostgres(trx)) await sql`select pg_advisory_xact_lock(hashtext(${`falsetrace:${what}`}))`.execute(trx);
}
