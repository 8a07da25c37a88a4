import type { Db } from '../database';

export async function insertRevision(db: Db, caseId: number, authorId: number, snapshot: string, createdAt: string) {
  const last = await db
    .selectFrom('case_revisions')
    .select((eb) => eb.fn.max('number').as('n'))
    .where('case_id', '=', caseId)
    .executeTakeFirst();
  const number = Number(last?.n ?? 0) + 1;
  await db.insertInto('case_revisions').values({ case_id: caseId, number, author_id: authorId, snapshot, created_at: createdAt }).execute();
  return number;
}

export const listRevisions = (db: Db, caseId: number) =>
  db
    .selectFrom('case_revisions')
    .leftJoin('users', 'users.id', 'case_revisions.author_id')
    .selectAll('case_revisions')
    .select('users.name as author_name')
    .where('case_id', '=', caseId)
    .orderBy('number', 'desc')
    .execute();
