import { isWrittenFormTerm, stem, writtenFormTerm } from '../../shared/search/stem';
import { lastWordOpen, termsWithOffsets } from '../../shared/search/text-terms';
import type { CaseIndex, TermGroup, WeightedTerm } from './case-index';

/** Shorter partial words would expand to most of the dictionary while the user is still typing. */
const MIN_PREFIX = 3;
/** Completions kept for a partial word (the most used ones when there are more). */
const MAX_COMPLETIONS = 200;
/** Misspellings are only looked for in words of this length or more. */
const MIN_FUZZY = 4;
const INFLECTIONS = ['ing', 'ed', 'es', 's'];

// minisearch's own weights for prefix and fuzzy matches, so the scores mean what they mean there
const PREFIX_WEIGHT = 0.375;
const FUZZY_WEIGHT = 0.45;
const prefixWeight = (term: string, typed: string) => (PREFIX_WEIGHT * term.length) / (term.length + 0.3 * (term.length - typed.length));
const fuzzyWeight = (term: string, distance: number) => (FUZZY_WEIGHT * term.length) / (term.length + distance);

/**
 * Stems a half-typed inflected word may be heading for: the index holds "ring" for
 * "ringing", so "ringin" must look up "ring" (and "probin" → "probe", "saggin" → "sag").
 */
function inflectionRoots(partial: string, index: CaseIndex): string[] {
  const roots = new Set<string>();
  for (let k = partial.length - 1; k >= MIN_PREFIX; k--) {
    const rest = partial.slice(k);
    if (!INFLECTIONS.some((s) => s.startsWith(rest))) continue;
    const root = partial.slice(0, k);
    const doubled = root.length > 3 && root[root.length - 1] === root[root.length - 2];
    for (const r of [root, `${root}e`, `${root}i`, ...(doubled ? [root.slice(0, -1)] : [])]) if (index.engine.hasTerm(r)) roots.add(r);
  }
  return [...roots];
}

/** A query word that is a curated tag synonym is read as its tag ("gnd-bounce" → "ground-bounce"). */
function withTagSynonyms(query: string, synonyms: Map<string, string>): string {
  if (synonyms.size === 0) return query;
  return query.replace(/[^\s,;]+/g, (word) => synonyms.get(word.toLowerCase()) ?? word);
}

/**
 * Query planning: each query word becomes the dictionary terms that count as it.
 * - the word itself, when the dictionary has it;
 * - a word being typed (no space after it yet): its completions, and the stem a half-typed
 *   inflection is heading for, scored as one word (`typing`);
 * - a word the dictionary lacks may be misspelt: terms within 1 edit (2 from eight letters).
 *   Words the dictionary has are never fuzzed, which keeps the edit-distance walk off
 *   ordinary queries;
 * - a one-word curated synonym of a tag also stands for its tag.
 * A word with no terms at all still forms a group, so AND fails and OR takes over.
 */
export function planQuery(query: string, index: CaseIndex, synonyms: Map<string, string>): TermGroup[] {
  const text = withTagSynonyms(query, synonyms);
  const words = termsWithOffsets(text, 'query');
  const open = lastWordOpen(text);
  const groups = new Map<string, TermGroup>();
  const dict = index.engine;
  words.forEach((w, i) => {
    if (groups.has(w.term)) return;
    const typing = open && i === words.length - 1 && w.end === text.length;
    const terms = new Map<string, number>();
    const add = (term: string, weight: number) => terms.set(term, Math.max(weight, terms.get(term) ?? 0));
    if (dict.hasTerm(w.term)) add(w.term, 1);
    // an irregular form as typed ("rang") also scores the cases that wrote it so
    const written = writtenFormTerm(w.surface);
    if (written && dict.hasTerm(written)) add(written, 1);
    if (typing && w.surface.length >= MIN_PREFIX) {
      for (const c of dict.completions(w.surface, MAX_COMPLETIONS)) add(c.term, prefixWeight(c.term, w.surface));
      if (dict.hasTerm(w.surface)) add(w.surface, 1);
      for (const root of inflectionRoots(w.surface, index)) add(root, 1);
    } else if (!dict.hasTerm(w.term) && !/\d/.test(w.term) && w.term.length >= MIN_FUZZY) {
      for (const n of dict.nearTerms(w.term, w.term.length >= 8 ? 2 : 1)) if (!isWrittenFormTerm(n.term)) add(n.term, fuzzyWeight(n.term, n.distance));
      // the dictionary holds stems, so a misspelt inflection ("ringng") is far from every term
      // but its front is a stem: try it without an ending made of inflection letters
      for (let cut = 1; cut <= 3 && w.surface.length - cut >= MIN_FUZZY; cut++) {
        const front = w.surface.slice(0, -cut);
        if (/^[ingeds]+$/.test(w.surface.slice(-cut)) && dict.hasTerm(front)) add(front, fuzzyWeight(front, 1));
      }
    }
    const tag = synonyms.get(w.surface);
    if (tag && !/[-\s]/.test(tag) && dict.hasTerm(stem(tag))) add(stem(tag), 1);
    groups.set(w.term, { word: w.surface, terms: [...terms].map(([term, weight]): WeightedTerm => ({ term, weight })), typing });
  });
  return [...groups.values()];
}
