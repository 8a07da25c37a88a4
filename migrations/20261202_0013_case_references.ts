import { Kysely } from 'kysely';

// Which cases name which as `#123` (in the write-up, or in one comment), so a case page lists the
// cases that link to it with an index lookup rather than a scan of every text.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('case_references')
    .addColumn('source_case_id', 'integer', (c) => c.notNull().references('cases.id').onDelete('cascade'))
    // null: the case's narrative or lesson; else the comment holding the link
    .addColumn('comment_id', 'integer', (c) => c.references('comments.id').onDelete('cascade'))
    // no foreign key: a text may name a number that is no case (yet); readers join on cases
    .addColumn('target_case_id', 'integer', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('case_references_target').on('case_references').columns(['target_case_id', 'source_case_id']).execute();
  await db.schema.createIndex('case_references_source').on('case_references').columns(['source_case_id', 'comment_id']).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('case_references').execute();
}
