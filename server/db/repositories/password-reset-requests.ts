import type { Db } from '../database';

export const insertResetRequest = (db: Db, email: string, nowIso: string) =>
  db.insertInto('password_reset_requests').values({ email, created_at: nowIso }).execute();

export const pendingResetRequests = (db: Db, limit = 50) =>
  db.selectFrom('password_reset_requests').selectAll().orderBy('id').limit(limit).execute();

/** Deletes the request; false when another sender deleted (took) it first. */
export const deleteResetRequest = async (db: Db, id: number) =>
  Number((await db.deleteFrom('password_reset_requests').where('id', '=', id).executeTakeFirst()).numDeletedRows) === 1;
