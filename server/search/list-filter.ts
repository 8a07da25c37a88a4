import { STOPWORDS } from '../../shared/search/stopwords';
import { UNIT_SPELLINGS } from '../../shared/search/synonyms';
import { indexTerms } from '../../shared/search/text-terms';
import { DOC_FIELDS } from './case-document';
import type { CaseIndex } from './case-index';

/**
 * The index fields holding what a text filter reads: the case list's (`containsText` on title
 * and summary) and the Lessons page's (title, lesson summary and detail: all in `remedy`).
 */
export type TextFilterFields = 'list' | 'lessons';
const FIELDS_READ: Record<TextFilterFields, number[]> = {
  list: [DOC_FIELDS.indexOf('title'), DOC_FIELDS.indexOf('summary')],
  lessons: [DOC_FIELDS.indexOf('title'), DOC_FIELDS.indexOf('remedy')],
};
/** Shorter words would expand to much of the dictionary; the scan answers them. */
const MIN_WORD = 3;
const UNITS = Object.keys(UNIT_SPELLINGS);

/**
 * Index terms a text word starting with `word` may have been indexed as: the word's own term,
 * every term beginning with the word or its term ("ring" → "ringer"), and the terms the word or
 * its term begin with (a suffix stripped into the typed part: "ringi" of "ringing" → "ring").
 */
function termsStartedBy(index: CaseIndex, word: string): Set<string> {
  const dict = index.engine;
  const out = new Set<string>();
  for (const base of new Set([word, ...indexTerms(word)])) {
    if (dict.hasTerm(base)) out.add(base);
    for (const c of dict.completions(base, Infinity)) out.add(c.term);
    for (let k = MIN_WORD; k < base.length; k++) if (dict.hasTerm(base.slice(0, k))) out.add(base.slice(0, k));
  }
  return out;
}

/**
 * The cases whose title or summary (`fields` 'list'; 'lessons': title or lesson) may contain
 * `q` where its words start words of the text: each word of `q` starts a word there, as the
 * index reads them. For such queries this is a superset of the substring match (the same
 * analysis made both sides' terms), so the list runs its substring test on these ids only
 * instead of on every case; text inside a word ("lead" in "misleading") is what it gives up.
 * Undefined when the index cannot say, and the list scans: no words left after function
 * words; a word under three letters; a number or a unit word, which the analysis folds with
 * its neighbour ("50 ohm" → one term "50ω"); more than `limit` cases, as an id list that long
 * costs no less than the scan.
 */
export function listTextCandidates(index: CaseIndex, q: string, limit: number, fields: TextFilterFields = 'list'): number[] | undefined {
  const words = [...new Set(q.normalize('NFKC').toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? [])].filter((w) => !STOPWORDS.has(w));
  if (words.length === 0) return undefined;
  if (words.some((w) => w.length < MIN_WORD || /\d/.test(w) || UNITS.some((u) => u.startsWith(w)))) return undefined;
  let ids: Set<number> | undefined;
  for (const word of words) {
    const holding = new Set<number>();
    for (const term of termsStartedBy(index, word)) for (const id of index.engine.casesWithTerm(term, FIELDS_READ[fields])) if (!ids || ids.has(id)) holding.add(id);
    ids = holding;
    if (ids.size === 0) break;
  }
  return ids && ids.size <= limit ? [...ids] : undefined;
}
