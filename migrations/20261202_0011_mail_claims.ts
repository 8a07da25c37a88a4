import type { Kysely } from 'kysely';

// Several app instances share one queue: a sender claims a mail (who, when) before handing it to
// SMTP, so no two send it; a claim older than the timeout is taken over (its sender died).
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('mail_queue').addColumn('claimed_by', 'text').execute();
  await db.schema.alterTable('mail_queue').addColumn('claimed_at', 'text').execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('mail_queue').dropColumn('claimed_at').execute();
  await db.schema.alterTable('mail_queue').dropColumn('claimed_by').execute();
}
