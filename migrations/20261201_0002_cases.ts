import { Kysely, sql } from 'kysely';
import { autoId } from '../server/db/dialect';

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('cases')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('author_id', 'integer', (c) => c.notNull().references('users.id'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('summary', 'text', (c) => c.notNull())
    .addColumn('narrative', 'text', (c) => c.notNull().defaultTo(''))
    // SI numbers as JSON, validated by shared/schemas/case.ts on the way in
    .addColumn('setup', 'text', (c) => c.notNull().defaultTo('{}'))
    .addColumn('stated_cause', 'text')
    .addColumn('stated_cause_other', 'text')
    .addColumn('fix', 'text')
    .addColumn('lesson_summary', 'text')
    .addColumn('lesson_detail', 'text')
    .addColumn('status', 'text', (c) =>
      c.notNull().defaultTo('draft').check(sql`status in ('draft','in_review','needs_changes','verified','retired')`),
    )
    .addColumn('diagnosis', 'text')
    .addColumn('engine_cause', 'text')
    // the stated cause, else the engine's top cause: what lists and filters show
    .addColumn('cause', 'text')
    .addColumn('disagrees', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('review_note', 'text')
    .addColumn('duplicate_of', 'integer', (c) => c.references('cases.id').onDelete('set null'))
    .addColumn('retired_reason', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .addColumn('submitted_at', 'text')
    .addColumn('verified_at', 'text')
    .execute();
  await db.schema.createIndex('cases_status').on('cases').columns(['status', 'updated_at']).execute();
  await db.schema.createIndex('cases_author').on('cases').column('author_id').execute();
  await db.schema.createIndex('cases_cause').on('cases').column('cause').execute();

  await db.schema
    .createTable('case_tags')
    .addColumn('case_id', 'integer', (c) => c.notNull().references('cases.id').onDelete('cascade'))
    .addColumn('tag', 'text', (c) => c.notNull())
    .addColumn('source', 'text', (c) => c.notNull().defaultTo('author').check(sql`source in ('author','engine')`))
    .addPrimaryKeyConstraint('case_tags_pk', ['case_id', 'tag'])
    .execute();
  await db.schema.createIndex('case_tags_tag').on('case_tags').column('tag').execute();

  await db.schema
    .createTable('attachments')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('case_id', 'integer', (c) => c.notNull().references('cases.id').onDelete('cascade'))
    .addColumn('uploaded_by', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('screenshot','capture')`))
    .addColumn('storage_name', 'text', (c) => c.notNull().unique())
    .addColumn('thumbnail_name', 'text')
    .addColumn('original_name', 'text', (c) => c.notNull())
    .addColumn('content_type', 'text', (c) => c.notNull())
    .addColumn('size_bytes', 'integer', (c) => c.notNull())
    .addColumn('width', 'integer')
    .addColumn('height', 'integer')
    .addColumn('analysis', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('attachments_case').on('attachments').column('case_id').execute();

  await db.schema
    .createTable('case_revisions')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('case_id', 'integer', (c) => c.notNull().references('cases.id').onDelete('cascade'))
    .addColumn('number', 'integer', (c) => c.notNull())
    .addColumn('author_id', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('snapshot', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('case_revisions_number', ['case_id', 'number'])
    .execute();

  await db.schema
    .createTable('comments')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('case_id', 'integer', (c) => c.notNull().references('cases.id').onDelete('cascade'))
    .addColumn('author_id', 'integer', (c) => c.notNull().references('users.id'))
    .addColumn('body', 'text', (c) => c.notNull())
    .addColumn('hidden', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('hidden_by', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('comments_case').on('comments').column('case_id').execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const t of ['comments', 'case_revisions', 'attachments', 'case_tags', 'cases']) await db.schema.dropTable(t).execute();
}
