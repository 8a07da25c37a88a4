import type { SearchQuery } from '../../shared/schemas/search';
import type { CaseIndex } from './case-index';
import { FACET_ROW, ROW_CAUSE, ROW_STATUS, ROW_TAG_COUNT, ROW_TAGS } from './facet-rows';

export interface Facets {
  cause: Record<string, number>;
  tags: Record<string, number>;
  status: Record<string, number>;
}

/** Tags shown in the facet: the most used among the matches. */
const MAX_TAGS = 30;

const sorted = (entries: [string, number][], limit = Infinity) => Object.fromEntries(entries.sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).slice(0, limit));

/**
 * Facet counts over candidate cases, and the candidates that pass every filter. Each facet
 * counts the candidates that pass the other two filters, so choosing a cause does not hide
 * the other causes' counts. Counted by code into arrays (one array per facet), not by name,
 * from the packed rows of `FacetRows`.
 */
export function countFacets(index: CaseIndex, candidates: Iterable<number>, q: Pick<SearchQuery, 'cause' | 'tag' | 'status'>): { facets: Facets; passing: number[] } {
  const size = index.codeCount;
  const cause = new Int32Array(size);
  const tags = new Int32Array(size);
  const status = new Int32Array(size);
  // −1: no filter; a filter on a value no case has is −2, which matches no code
  const filterCode = (name: string | undefined) => (name ? (index.knownCode(name) >= 0 ? index.knownCode(name) : -2) : -1);
  const causeCode = filterCode(q.cause);
  const tagCode = filterCode(q.tag);
  const statusCode = filterCode(q.status);
  const passing: number[] = [];
  const rows = index.facetRows;
  const meta = rows.meta;
  const pool = rows.pool;
  for (const id of candidates) {
    const row = rows.rowOf(id);
    if (row < 0) continue;
    const at = row * FACET_ROW;
    const causeOf = meta[at + ROW_CAUSE];
    const statusOf = meta[at + ROW_STATUS];
    const tagStart = meta[at + ROW_TAGS];
    const tagEnd = tagStart + meta[at + ROW_TAG_COUNT];
    const okCause = causeCode === -1 || causeOf === causeCode;
    let okTag = tagCode === -1;
    for (let k = tagStart; !okTag && k < tagEnd; k++) okTag = pool[k] === tagCode;
    const okStatus = statusCode === -1 || statusOf === statusCode;
    if (okTag && okStatus && causeOf >= 0) cause[causeOf]++;
    if (okCause && okStatus) for (let k = tagStart; k < tagEnd; k++) tags[pool[k]]++;
    if (okCause && okTag) status[statusOf]++;
    if (okCause && okTag && okStatus) passing.push(id);
  }
  const named = (counts: Int32Array) => {
    const out: [string, number][] = [];
    for (let code = 0; code < counts.length; code++) if (counts[code] > 0) out.push([index.facetName(code), counts[code]]);
    return out;
  };
  return { facets: { cause: sorted(named(cause)), tags: sorted(named(tags), MAX_TAGS), status: sorted(named(status)) }, passing };
}
