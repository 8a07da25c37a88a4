import type { Insertable } from 'kysely';
import type { Db, MailQueueTable } from '../database';
import { isPostgres } from '../dialect';

export const insertQueuedMail = (db: Db, row: Insertable<MailQueueTable>) =>
  db.insertInto('mail_queue').values(row).returning('id').executeTakeFirstOrThrow();

/**
 * Claims the oldest mail due by `dueIso` that nobody holds (or whose holder's claim is older than `staleBeforeIso`:
 * that sender died) for `claimer`, in one statement so that two senders never get the same row.
 * PostgreSQL: the row is picked `FOR UPDATE SKIP LOCKED`, so a concurrent claimer takes the next
 * one instead of waiting; SQLite runs each write statement alone, which makes the UPDATE atomic.
 */
export async function claimNextMail(db: Db, claimer: string, dueIso: string, staleBeforeIso: string, claimedAtIso: string) {
  const next = db
    .selectFrom('mail_queue')
    .select('id')
    .where('sent_at', 'is', null)
    .where('next_attempt_at', '<=', dueIso)
    .where((eb) => eb.or([eb('claimed_at', 'is', null), eb('claimed_at', '<', staleBeforeIso)]))
    .orderBy('id')
    .limit(1)
    .$if(isPostgres(db), (qb) => qb.forUpdate().skipLocked());
  return db.updateTable('mail_queue').set({ claimed_by: claimer, claimed_at: claimedAtIso }).where('id', 'in', next).returningAll().executeTakeFirst();
}

export const findQueuedMail = (db: Db, id: number) => db.selectFrom('mail_queue').selectAll().where('id', '=', id).executeTakeFirst();

export const markMailSent = (db: Db, id: number, nowIso: string) =>
  db.updateTable('mail_queue').set({ sent_at: nowIso, last_error: null, claimed_by: null, claimed_at: null }).where('id', '=', id).execute();

export const markMailFailed = (db: Db, id: number, attempts: number, nextAttemptIso: string, error: string) =>
  db
    .updateTable('mail_queue')
    .set({ attempts, next_attempt_at: nextAttemptIso, last_error: error.slice(0, 500), claimed_by: null, claimed_at: null })
    .where('id', '=', id)
    .execute();

export const pendingMailCount = async (db: Db) =>
  Number((await db.selectFrom('mail_queue').select((eb) => eb.fn.countAll().as('n')).where('sent_at', 'is', null).executeTakeFirstOrThrow()).n);
