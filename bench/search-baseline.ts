import MiniSearch, { type SearchResult } from 'minisearch';
import { DOC_FIELDS, FIELD_BOOST, type CaseDoc, type CaseFacts } from '../server/search/case-document';
import type { BenchQuery } from './search-queries';

/**
 * minisearch as it comes: its own tokenizer, prefix on the word being typed, fuzzy 0.2 on
 * every word, AND then OR, visibility as a result filter. The reference for what the
 * product's design (see server/search) gains.
 */
export function buildBaseline(entries: { doc: CaseDoc; facts: CaseFacts }[]) {
  const engine = new MiniSearch<CaseDoc & { status: string; authorId: number }>({
    fields: [...DOC_FIELDS],
    storeFields: ['status', 'authorId'],
    searchOptions: { boost: FIELD_BOOST, fuzzy: 0.2 },
  });
  engine.addAll(entries.map((e) => ({ ...e.doc, status: e.facts.status, authorId: e.facts.authorId })));

  function search(q: BenchQuery): { ids: number[]; total: number } {
    const typing = /[\p{L}\p{N}]$/u.test(q.q);
    const filter = q.as.role === 'moderator' ? undefined : (r: SearchResult) => r.status === 'verified' || r.authorId === q.as.id;
    const prefix = (_t: string, i: number, terms: string[]) => typing && i === terms.length - 1;
    let results = engine.search(q.q, { combineWith: 'AND', prefix, filter });
    if (results.length === 0) results = engine.search(q.q, { combineWith: 'OR', prefix, filter });
    return { ids: results.slice(0, 20).map((r) => r.id as number), total: results.length };
  }
  return { search };
}
