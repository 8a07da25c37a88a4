import { sql, type RawBuilder, type SqlBool } from 'kysely';

/**
 * `column LIKE '%text%'` regardless of case, with %, _ and \ in the text taken literally. SQLite's
 * LIKE has no default escape character, so the ESCAPE clause is what makes the backslashes mean
 * anything. Both sides go through lower() because PostgreSQL's LIKE is case-sensitive (SQLite's
 * ignores ASCII case already, and its lower() folds only ASCII, so SQLite matches as before).
 */
export function containsText(column: string, text: string): RawBuilder<SqlBool> {
  const pattern = `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
  return sql<SqlBool>`lower(${sql.ref(column)}) like lower(${pattern}) escape '\\'`;
}
