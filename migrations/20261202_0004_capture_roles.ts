import { Kysely, sql } from 'kysely';

// A capture may be marked as taken before or after the fix, and remembers which of its channels is analysed.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .alterTable('attachments')
    .addColumn('capture_role', 'text', (c) => c.check(sql`capture_role in ('before', 'after')`))
    .execute();
  await db.schema.alterTable('attachments').addColumn('capture_channel', 'integer').execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('attachments').dropColumn('capture_channel').execute();
  await db.schema.alterTable('attachments').dropColumn('capture_role').execute();
}
