import type { Db } from '../database';

/**
 * A live session row, with the account it is signed in as (null columns when it is signed in as
 * nobody, or the account is gone): one statement for what every signed-in request reads first.
 */
export const getSession = (db: Db, sid: string, nowMs: number) =>
  db
    .selectFrom('sessions')
    .leftJoin('users', 'users.id', 'sessions.user_id')
    .select(['sessions.data', 'sessions.expires_at', 'sessions.user_id', 'users.id as account_id', 'users.email', 'users.name', 'users.role', 'users.active'])
    .where('sessions.sid', '=', sid)
    .where('sessions.expires_at', '>', nowMs)
    .executeTakeFirst();

export async function upsertSession(db: Db, sid: string, data: string, userId: number | null, expiresAtMs: number) {
  await db
    .insertInto('sessions')
    .values({ sid, data, user_id: userId, expires_at: expiresAtMs })
    .onConflict((oc) => oc.column('sid').doUpdateSet({ data, user_id: userId, expires_at: expiresAtMs }))
    .execute();
}

/** Extends a session's expiry, at most once a minute: a row is not rewritten for every request. */
export const TOUCH_EVERY_MS = 60_000;

/** @returns whether the row was extended (false: it was extended less than a minute ago, or is gone) */
export async function touchSession(db: Db, sid: string, expiresAtMs: number): Promise<boolean> {
  const result = await db.updateTable('sessions').set({ expires_at: expiresAtMs }).where('sid', '=', sid).where('expires_at', '<=', expiresAtMs - TOUCH_EVERY_MS).executeTakeFirst();
  return Number(result.numUpdatedRows) > 0;
}

export async function deleteSession(db: Db, sid: string) {
  await db.deleteFrom('sessions').where('sid', '=', sid).execute();
}

/** Ends every session of a user, except optionally the one making the request. */
export async function deleteUserSessions(db: Db, userId: number, exceptSid?: string) {
  let q = db.deleteFrom('sessions').where('user_id', '=', userId);
  if (exceptSid) q = q.where('sid', '!=', exceptSid);
  await q.execute();
}

export async function deleteExpiredSessions(db: Db, nowMs: number) {
  await db.deleteFrom('sessions').where('expires_at', '<=', nowMs).execute();
}
