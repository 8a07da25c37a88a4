import type { Selectable, Updateable } from 'kysely';
import type { CommentsTable, Db } from '../database';

export type CommentRow = Selectable<CommentsTable> & { author_name: string };

const withAuthor = (db: Db) =>
  db.selectFrom('comments').innerJoin('users', 'users.id', 'comments.author_id').selectAll('comments').select('users.name as author_name');

export const listComments = (db: Db, caseId: number): Promise<CommentRow[]> =>
  withAuthor(db).where('comments.case_id', '=', caseId).orderBy('comments.id').execute();

export const findComment = (db: Db, id: number): Promise<CommentRow | undefined> => withAuthor(db).where('comments.id', '=', id).executeTakeFirst();

export async function insertComment(db: Db, caseId: number, authorId: number, body: string, now: string) {
  const { id } = await db
    .insertInto('comments')
    .values({ case_id: caseId, author_id: authorId, body, created_at: now, updated_at: now })
    .returning('id')
    .executeTakeFirstOrThrow();
  return id;
}

export const updateComment = (db: Db, id: number, patch: Updateable<CommentsTable>) =>
  db.updateTable('comments').set(patch).where('id', '=', id).execute();

export const deleteComment = (db: Db, id: number) => db.deleteFrom('comments').where('id', '=', id).execute();
