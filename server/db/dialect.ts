import { PostgresAdapter, sql, type ColumnDefinitionBuilder, type Kysely } from 'kysely';

export type DialectName = 'sqlite' | 'postgres';

/** Which database a Kysely instance (or a transaction of one) talks to. */
export const dialectOf = (db: Kysely<any>): DialectName => (db.getExecutor().adapter instanceof PostgresAdapter ? 'postgres' : 'sqlite');

export const isPostgres = (db: Kysely<any>) => dialectOf(db) === 'postgres';

/**
 * An auto-numbered integer primary key for migrations. SQLite keeps `integer primary key
 * autoincrement` (ids never reused, as before); PostgreSQL has no AUTOINCREMENT keyword and uses
 * an identity column instead.
 */
export const autoId = (db: Kysely<any>) => (c: ColumnDefinitionBuilder) =>
  isPostgres(db) ? c.primaryKey().generatedByDefaultAsIdentity() : c.primaryKey().autoIncrement();

/**
 * After a bulk load (the bench seed, a casebook import), gathers PostgreSQL's planner statistics
 * at once rather than when autovacuum next gets to it, a minute or so later: until then the
 * planner guesses (three rows for an author's 381 cases, sorted on every list request instead of
 * read from an index in order). PostgreSQL's manual advises ANALYZE after loading much data. SQLite
 * plans without statistics here, as it always has: nothing to do.
 */
export async function refreshPlannerStatistics(db: Kysely<any>): Promise<void> {
  if (isPostgres(db)) await sql`analyze`.execute(db);
}
