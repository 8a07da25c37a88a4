import type { Insertable } from 'kysely';
import type { Db, MailQueueTable } from '../database';

export const insertQueuedMail = (db: Db, row: Insertable<MailQueueTable>) =>
  db.insertInto('mail_queue').values(row).returning('id').executeTakeFirstOrThrow();

export const dueMails = (db: Db, nowIso: string, limit = 20) =>
  db.selectFrom('mail_queue').selectAll().where('sent_at', 'is', null).where('next_attempt_at', '<=', nowIso).orderBy('id').limit(limit).execute();

export const findQueuedMail = (db: Db, id: number) => db.selectFrom('mail_queue').selectAll().where('id', '=', id).executeTakeFirst();

export const markMailSent = (db: Db, id: number, nowIso: string) =>
  db.updateTable('mail_queue').set({ sent_at: nowIso, last_error: null }).where('id', '=', id).execute();

export const markMailFailed = (db: Db, id: number, attempts: number, nextAttemptIso: string, error: string) =>
  db.updateTable('mail_queue').set({ attempts, next_attempt_at: nextAttemptIso, last_error: error.slice(0, 500) }).where('id', '=', id).execute();

export const pendingMailCount = async (db: Db) =>
  Number((await db.selectFrom('mail_queue').select((eb) => eb.fn.countAll().as('n')).where('sent_at', 'is', null).executeTakeFirstOrThrow()).n);
