import { Kysely, sql } from 'kysely';
import { autoId } from '../server/db/dialect';

// A Bench symptom search someone asked to be told about: checked against each newly verified case.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('saved_searches')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    // the words as typed and the facets (cause, tag), as JSON
    .addColumn('query', 'text', (c) => c.notNull())
    .addColumn('delivery', 'text', (c) => c.notNull().check(sql`delivery in ('mail','digest')`))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('saved_searches_user').on('saved_searches').columns(['user_id', 'id']).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('saved_searches').execute();
}
