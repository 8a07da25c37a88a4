import type { Insertable, Selectable } from 'kysely';
import type { Db, SavedSearchesTable } from '../database';

export type SavedSearchRow = Selectable<SavedSearchesTable>;

export const listSavedSearches = (db: Db, userId: number): Promise<SavedSearchRow[]> =>
  db.selectFrom('saved_searches').selectAll().where('user_id', '=', userId).orderBy('id').execute();

export const countSavedSearches = async (db: Db, userId: number) =>
  Number((await db.selectFrom('saved_searches').select((eb) => eb.fn.countAll().as('n')).where('user_id', '=', userId).executeTakeFirstOrThrow()).n);

export async function insertSavedSearch(db: Db, row: Insertable<SavedSearchesTable>) {
  const { id } = await db.insertInto('saved_searches').values(row).returning('id').executeTakeFirstOrThrow();
  return id;
}

/** Deletes one of this user's searches; false when there is none of theirs with that id. */
export async function deleteSavedSearch(db: Db, userId: number, id: number) {
  const r = await db.deleteFrom('saved_searches').where('id', '=', id).where('user_id', '=', userId).executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}

/** Every saved search of an active user, for checking a newly verified case (a few per person). */
export const savedSearchesOfActiveUsers = (db: Db) =>
  db
    .selectFrom('saved_searches')
    .innerJoin('users', 'users.id', 'saved_searches.user_id')
    .selectAll('saved_searches')
    .where('users.active', '=', 1)
    .orderBy('saved_searches.id')
    .execute();
