import { sql, type RawBuilder, type SqlBool } from 'kysely';

/**
 * `column LIKE '%text%'` with %, _ and \ in the text taken literally. SQLite's LIKE has no
 * default escape character, so the ESCAPE clause is what makes the backslashes mean anything.
 */
export function containsText(column: string, text: string): RawBuilder<SqlBool> {
  const pattern = `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
  return sql<SqlBool>`${sql.ref(column)} like ${pattern} escape '\\'`;
}
