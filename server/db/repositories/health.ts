import { sql } from 'kysely';
import type { Db } from '../database';

/** The cheapest statement that proves the database answers (same SQL on SQLite and PostgreSQL). */
export async function pingDatabase(db: Db): Promise<void> {
  await sql`SELECT 1`.execute(db);
}
