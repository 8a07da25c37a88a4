import { PostgresAdapter, type ColumnDefinitionBuilder, type Kysely } from 'kysely';

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
