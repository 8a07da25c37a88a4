import type { Kysely } from 'kysely';

// The author's note on probing the case's circuit safely; the review asks for it whenever the engine raises a risk.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('cases').addColumn('safety_note', 'text').execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('cases').dropColumn('safety_note').execute();
}
