import type { Kysely } from 'kysely';
import { autoId } from '../server/db/dialect';

// A reset request is only written down by the request; the background sender looks the address up
// later, so the answer takes the same work whether or not the address has an account.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('password_reset_requests')
    .addColumn('id', 'integer', autoId(db))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('password_reset_requests').execute();
}
