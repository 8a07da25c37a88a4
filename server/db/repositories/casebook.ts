import type { Insertable } from 'kysely';
import type { AttachmentsTable, AuditLogTable, CaseRevisionsTable, CasesTable, CommentsTable, Db, UsersTable } from '../database';

// SQLite caps bound parameters per statement; big casebooks are read in slices
const SLICE = 500;

async function inSlices<T>(ids: readonly number[], read: (slice: number[]) => Promise<T[]>): Promise<T[]> {
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

type IdTable = 'cases' | 'case_revisions' | 'comments' | 'attachments';

/** Which of these ids already exist in a table. */
export async function existingIds(db: Db, table: IdTable, ids: readonly number[]): Promise<Set<number>> {
  const rows = await inSlices(ids, (s) => db.selectFrom(table).select('id').where('id', 'in', s).execute());
  return new Set(rows.map((r) => r.id));
}

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

export const insertImportedCase = (db: Db, row: Insertable<CasesTable> & { id: number }) => db.insertInto('cases').values(row).execute();

export async function insertImportedTags(db: Db, caseId: number, tags: readonly string[], source: 'author' | 'engine') {
  if (tags.length === 0) return;
  await db
    .insertInto('case_tags')
    .values(tags.map((tag) => ({ case_id: caseId, tag, source })))
    .onConflict((oc) => oc.doNothing())
    .execute();
}

export const linkImportedDuplicate = (db: Db, caseId: number, duplicateOf: number) =>
  db.updateTable('cases').set({ duplicate_of: duplicateOf }).where('id', '=', caseId).execute();

export const insertImportedRevision = (db: Db, row: Insertable<CaseRevisionsTable> & { id: number }) => db.insertInto('case_revisions').values(row).execute();

export const insertImportedComment = (db: Db, row: Insertable<CommentsTable> & { id: number }) => db.insertInto('comments').values(row).execute();

export const insertImportedAttachment = (db: Db, row: Insertable<AttachmentsTable> & { id: number }) => db.insertInto('attachments').values(row).execute();

/** History keeps its order but takes fresh ids: audit ids are shared by every case. */
export const insertImportedHistory = (db: Db, row: Insertable<AuditLogTable>) => db.insertInto('audit_log').values(row).execute();

export async function appendPinnedLesson(db: Db, caseId: number, pinnedBy: number, createdAt: string) {
  const { max } = await db.selectFrom('pinned_lessons').select((eb) => eb.fn.max('position').as('max')).executeTakeFirstOrThrow();
  await db
    .insertInto('pinned_lessons')
    .values({ case_id: caseId, position: Number(max ?? 0) + 1, pinned_by: pinnedBy, created_at: createdAt })
    .onConflict((oc) => oc.doNothing())
    .execute();
}
