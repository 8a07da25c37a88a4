import { Kysely, sql } from 'kysely';
import { autoId } from '../server/db/dialect';

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('audit_log')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('case_id', 'integer', (c) => c.references('cases.id').onDelete('cascade'))
    .addColumn('actor_id', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('before', 'text')
    .addColumn('after', 'text')
    .addColumn('note', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('audit_log_case').on('audit_log').columns(['case_id', 'id']).execute();

  // Every mail waits here until the SMTP server has taken it; failures are retried with backoff.
  await db.schema
    .createTable('mail_queue')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('to_addr', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('html', 'text', (c) => c.notNull())
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('next_attempt_at', 'text', (c) => c.notNull())
    .addColumn('last_error', 'text')
    .addColumn('sent_at', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('mail_queue_due').on('mail_queue').columns(['sent_at', 'next_attempt_at']).execute();

  await db.schema
    .createTable('watches')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('case_id', 'integer', (c) => c.references('cases.id').onDelete('cascade'))
    .addColumn('tag', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addCheckConstraint('watches_one_target', sql`(case_id is null) <> (tag is null)`)
    .execute();
  await db.schema.createIndex('watches_unique_case').on('watches').columns(['user_id', 'case_id']).unique().where(sql.ref('case_id'), 'is not', null).execute();
  await db.schema.createIndex('watches_unique_tag').on('watches').columns(['user_id', 'tag']).unique().where(sql.ref('tag'), 'is not', null).execute();

  await db.schema
    .createTable('notification_prefs')
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('mode', 'text', (c) => c.notNull().check(sql`mode in ('instant','digest','off')`))
    .addPrimaryKeyConstraint('notification_prefs_pk', ['user_id', 'kind'])
    .execute();

  // Notifications a user chose to get once a day instead of at once.
  await db.schema
    .createTable('digest_items')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('case_id', 'integer', (c) => c.references('cases.id').onDelete('cascade'))
    .addColumn('line', 'text', (c) => c.notNull())
    .addColumn('sent_at', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  // Which verified lessons each subscriber has had in a digest: the digest never repeats one.
  await db.schema
    .createTable('lesson_deliveries')
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('case_id', 'integer', (c) => c.notNull().references('cases.id').onDelete('cascade'))
    .addColumn('sent_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('lesson_deliveries_pk', ['user_id', 'case_id'])
    .execute();

  await db.schema
    .createTable('tags')
    .addColumn('tag', 'text', (c) => c.primaryKey())
    .addColumn('description', 'text')
    .addColumn('retired', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema
    .createTable('tag_synonyms')
    .addColumn('synonym', 'text', (c) => c.primaryKey())
    .addColumn('tag', 'text', (c) => c.notNull().references('tags.tag').onDelete('cascade').onUpdate('cascade'))
    .execute();

  await db.schema
    .createTable('app_state')
    .addColumn('key', 'text', (c) => c.primaryKey())
    .addColumn('value', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('pinned_lessons')
    .addColumn('case_id', 'integer', (c) => c.primaryKey().references('cases.id').onDelete('cascade'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addColumn('pinned_by', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const t of ['pinned_lessons', 'app_state', 'tag_synonyms', 'tags', 'lesson_deliveries', 'digest_items', 'notification_prefs', 'watches', 'mail_queue', 'audit_log']) {
    await db.schema.dropTable(t).execute();
  }
}
