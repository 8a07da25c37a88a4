import type { Kysely } from 'kysely';
import { autoId } from '../server/db/dialect';

/**
 * The change log search indexes follow: a row whenever a case's searchable content or who may
 * see it changes. Each app instance polls it from the last id it applied, so instances on one
 * database stay in step without talking to each other. Rows older than a day are pruned.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('case_changes')
    .addColumn('id', 'integer', autoId(db))
    // no foreign key: the row must outlive a deleted case, so other instances learn of the delete
    .addColumn('case_id', 'integer')
    .addColumn('changed_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('case_changes_changed_at').on('case_changes').column('changed_at').execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('case_changes').execute();
}
