import type { SearchQuery } from '../../shared/schemas/search';
import type { CaseIndex } from './case-index';

export interface Facets {
  cause: Record<string, number>;
  tags: Record<string, number>;
  status: Record<string, number>;
}

/** Tags shown in the facet: the most used among the matches. */
const MAX_TAGS = 30;

const bump = (m: Map<string, number>, k: string) => m.set(k, (m.get(k) ?? 0) + 1);
const sorted = (m: Map<string, number>, limit = Infinity) => Object.fromEntries([...m].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).slice(0, limit));

/**
 * Facet counts over candidate cases, and the candidates that pass every filter. Each facet
 * counts the candidates that pass the other two filters, so choosing a cause does not hide
 * the other causes' counts.
 */
export function countFacets(index: CaseIndex, candidates: Iterable<number>, q: Pick<SearchQuery, 'cause' | 'tag' | 'status'>): { facets: Facets; passing: number[] } {
  const cause = new Map<string, number>();
  const tags = new Map<string, number>();
  const status = new Map<string, number>();
  const passing: number[] = [];
  for (const id of candidates) {
    const f = index.facts.get(id);
    if (!f) continue;
    const okCause = !q.cause || f.cause === q.cause;
    const okTag = !q.tag || f.tags.includes(q.tag);
    const okStatus = !q.status || f.status === q.status;
    if (okTag && okStatus && f.cause) bump(cause, f.cause);
    if (okCause && okStatus) for (const t of f.tags) bump(tags, t);
    if (okCause && okTag) bump(status, f.status);
    if (okCause && okTag && okStatus) passing.push(id);
  }
  return { facets: { cause: sorted(cause), tags: sorted(tags, MAX_TAGS), status: sorted(status) }, passing };
}
