import { readSymptomQuery } from '../../shared/search/symptom-query';
import type { SearchQuery } from '../../shared/schemas/search';
import type { CaseDoc, CaseFacts } from './case-document';
import { CaseIndex } from './case-index';
import { planQuery } from './query-plan';
import { rankCases } from './rank';
import { runTextQuery } from './run-query';

// ranking is asked as someone who sees every case: the caller asks the visibility policy itself
const SEES_ALL = { id: 0, role: 'admin' } as const;

/**
 * Whether one case answers a search, decided by the search's own reading on that case alone
 * (a one-document index, so nothing else in the casebook sways it): it passes the facet
 * filters and either holds every word of the query (the search's AND; the OR fallback that
 * rescues a query no case fully matches is not a match here) or is filed under a cause the
 * symptom reading infers. The words count as finished, as in a search the user has typed out.
 */
export function caseMatchesSearch(entry: { doc: CaseDoc; facts: CaseFacts }, query: Pick<SearchQuery, 'q' | 'cause' | 'tag'>, synonyms: Map<string, string>): boolean {
  const index = new CaseIndex();
  index.addAll([entry]);
  const q = query.q.trim() === '' ? '' : `${query.q.trim()} `;
  const ranked = rankCases(index, SEES_ALL, { q, cause: query.cause, tag: query.tag, page: 1, pageSize: 1 }, synonyms);
  if (ranked.total === 0) return false;
  if (q === '') return true;
  if (runTextQuery(index, planQuery(q, index, synonyms), () => true).mode === 'and') return true;
  const reading = readSymptomQuery(q);
  const f = entry.facts;
  return Boolean(reading?.causes.some((c) => c.likelihood > 0 && (c.cause === f.cause || c.cause === f.engineCause)));
}
