import type { Insertable } from 'kysely';
import type { Database, Db } from '../database';

/** SQLite's default cap on bound parameters in one statement is 32,766; stay well under it. */
const MAX_PARAMETERS = 16_000;

/** Many rows in multi-row INSERTs, as few statements as the parameter cap allows (for seeding). */
export async function insertMany<T extends keyof Database & string>(db: Db, table: T, rows: Insertable<Database[T]>[]): Promise<void> {
  if (rows.length === 0) return;
  const columns = Math.max(...rows.slice(0, 50).map((row) => Object.keys(row as object).length));
  const size = Math.max(1, Math.floor(MAX_PARAMETERS / columns));
  for (let i = 0; i < rows.length; i += size) {
    // eslint-disable-next-line @typescript-eslint/no-explicit-any -- Kysely cannot narrow a generic table's row type
    await db.insertInto(table).values(rows.slice(i, i + size) as any).execute();
  }
}
