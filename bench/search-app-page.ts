import type Database from 'better-sqlite3';
import type { SearchSourceRow } from '../server/db/repositories/search-source';
import type { CaseIndex } from '../server/search/case-index';
import { highlightsFor } from '../server/search/highlight';
import { rankCases } from '../server/search/rank';
import type { BenchQuery } from './search-queries';

/**
 * The page the API serves, the same work as the server's search route minus HTTP: rank
 * (words, symptom reading, facets), read the shown page's rows from SQLite, highlight them.
 */
export function appPage(index: CaseIndex, rowsOf: Database.Statement, q: BenchQuery) {
  const r = rankCases(index, { id: q.as.id, role: q.as.role }, { q: q.q, page: 1, pageSize: 20 }, new Map());
  const rows = new Map((rowsOf.all(JSON.stringify(r.page.map((x) => x.id))) as SearchSourceRow[]).map((x) => [x.id, x]));
  for (const { id } of r.page) {
    const row = rows.get(id);
    if (!row) continue;
    highlightsFor(
      [
        { field: 'title', text: row.title },
        { field: 'summary', text: row.summary },
        { field: 'narrative', text: row.narrative },
        { field: 'fix', text: row.fix },
        { field: 'lesson', text: [row.lesson_summary, row.lesson_detail].filter(Boolean).join('\n') },
      ],
      r.terms,
    );
  }
  return { ids: r.page.map((x) => x.id), total: r.total };
}
