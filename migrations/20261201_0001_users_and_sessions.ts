import { Kysely, sql } from 'kysely';
import { autoId, isPostgres } from '../server/db/dialect';

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('users')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('email', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('engineer','moderator','admin')`))
    .addColumn('password_hash', 'text')
    .addColumn('active', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('sessions')
    .addColumn('sid', 'text', (c) => c.primaryKey())
    .addColumn('data', 'text', (c) => c.notNull())
    .addColumn('user_id', 'integer', (c) => c.references('users.id').onDelete('cascade'))
    // milliseconds since 1970: SQLite's integer holds 64 bits, PostgreSQL's only 32, so bigint there
    .addColumn('expires_at', isPostgres(db) ? 'bigint' : 'integer', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sessions_user_id').on('sessions').column('user_id').execute();
  await db.schema.createIndex('sessions_expires_at').on('sessions').column('expires_at').execute();

  // One table for every single-use mailed link; only a hash of the token is kept.
  await db.schema
    .createTable('auth_tokens')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('invitation','password_reset')`))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('role', 'text')
    .addColumn('user_id', 'integer', (c) => c.references('users.id').onDelete('cascade'))
    .addColumn('created_by', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .addColumn('used_at', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  // Mails caught by the built-in local SMTP fake.
  await db.schema
    .createTable('outbox_messages')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('to_addr', 'text', (c) => c.notNull())
    .addColumn('from_addr', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('html', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('outbox_messages').execute();
  await db.schema.dropTable('auth_tokens').execute();
  await db.schema.dropTable('sessions').execute();
  await db.schema.dropTable('users').execute();
}
