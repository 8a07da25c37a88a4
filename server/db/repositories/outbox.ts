import type { Insertable } from 'kysely';
import type { Db, OutboxMessagesTable } from '../database';

export const insertOutboxMessage = (db: Db, row: Insertable<OutboxMessagesTable>) =>
  db.insertInto('outbox_messages').values(row).execute();

export const listOutboxMessages = (db: Db, limit = 200) =>
  db.selectFrom('outbox_messages').selectAll().orderBy('id', 'desc').limit(limit).execute();
