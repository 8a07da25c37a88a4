import { caseDocument } from '../server/search/case-document';
import type { CaseIndex } from '../server/search/case-index';
import { rankCases } from '../server/search/rank';
import { generateCorpus } from './search-corpus';
import type { buildFts5 } from './search-fts5';
import { JUDGED_QUERIES, judgedRows, ndcgAt } from './search-judged';

/** The generated corpus of `count` cases with the judged cases mixed in, as the search indexes them. */
export function judgedCorpus(count: number) {
  const corpus = generateCorpus(count);
  const judged = judgedRows(count);
  const rows = [...corpus.rows, ...judged.rows];
  const tags = new Map([...corpus.tags, ...judged.tags]);
  const entries = rows.map((r) => caseDocument(r, tags.get(r.id) ?? [], new Map()));
  const titleOf = new Map(rows.map((r) => [r.id, r.title]));
  return { judgedCount: judged.rows.length, rows, entries, titleOf };
}

/** Each judged query's top 5 by the app and by plain FTS5 BM25 (as titles, read as a moderator who sees every case), with nDCG@5 of each. */
export function judgeQueries(index: CaseIndex, fts: ReturnType<typeof buildFts5>, titleOf: Map<number, string>) {
  const as = { role: 'moderator' as const, id: 999 };
  return JUDGED_QUERIES.map((j) => {
    const app = rankCases(index, as, { q: j.q, page: 1, pageSize: 5 }, new Map()).page.map((r) => titleOf.get(r.id)!);
    const fts5 = fts.search({ q: j.q, as, kind: 'judged' }).ids.slice(0, 5).map((id) => titleOf.get(id)!);
    return { q: j.q, app, fts5, ndcgApp: ndcgAt(5, app, j.relevant), ndcgFts5: ndcgAt(5, fts5, j.relevant) };
  });
}

export const meanOf = (values: number[]) => values.reduce((sum, v) => sum + v, 0) / values.length;
