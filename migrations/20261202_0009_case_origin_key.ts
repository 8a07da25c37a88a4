import { Kysely, sql } from 'kysely';

// Where an imported case came from (a key that travels with the case between casebooks), so the
// same archive imported twice is recognised without trusting record numbers.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('cases').addColumn('origin_key', 'text').execute();
  await db.schema.createIndex('cases_origin_key').unique().on('cases').column('origin_key').where(sql.ref('origin_key'), 'is not', null).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropIndex('cases_origin_key').execute();
  await db.schema.alterTable('cases').dropColumn('origin_key').execute();
}
