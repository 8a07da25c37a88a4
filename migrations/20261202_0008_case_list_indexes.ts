import type { Kysely } from 'kysely';

/** Indexes that match the case list's sorts, so a page is read in order instead of sorted whole. */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.createIndex('cases_updated_at').on('cases').columns(['updated_at', 'id']).execute();
  await db.schema.createIndex('cases_created_at').on('cases').columns(['created_at', 'id']).execute();
  await db.schema.createIndex('cases_author_updated').on('cases').columns(['author_id', 'updated_at']).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropIndex('cases_author_updated').execute();
  await db.schema.dropIndex('cases_created_at').execute();
  await db.schema.dropIndex('cases_updated_at').execute();
}
