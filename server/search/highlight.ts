import { irregularFormsOf, isWrittenFormTerm, WRITTEN_FORM_MARK } from '../../shared/search/stem';
import { PHRASES } from '../../shared/search/synonyms';
import { termsWithOffsets } from '../../shared/search/text-terms';
import type { HighlightField, SearchHighlight } from '../../shared/schemas/search';

/** Longest snippet cut from a long field, in characters (our choice: two lines of a result card). */
const SNIPPET = 180;

/** Characters tokenised either side of a place a term may start: the word before and after it, for a two-word phrase or a number and its unit. */
const AROUND = 24;
/**
 * At most this many characters of a long field are tokenised, window by window from its start:
 * a card shows one snippet of SNIPPET characters, so the densest run among the first few
 * places a common word occurs is as good a snippet as the densest in a field of pages.
 */
const TOKENISED = 4 * SNIPPET;

const keyCache = new WeakMap<ReadonlySet<string>, string[]>();

/**
 * Lower-case strings one of which every written form of the terms contains: a stem's first
 * four letters ("ringing" and "rings" start "ring"; not a final i, as "copy" stems to "copi"),
 * its irregular forms ("rang"), a quantity's digits, a phrase's words ("ten times" for 10x,
 * "spring tip" for the ground spring).
 */
function keysOf(terms: ReadonlySet<string>): string[] {
  let keys = keyCache.get(terms);
  if (keys) return keys;
  const out = new Set<string>();
  for (const term of terms) {
    if (isWrittenFormTerm(term)) {
      out.add(term.slice(WRITTEN_FORM_MARK.length));
      continue;
    }
    const digits = /^\d+(?:\.\d+)?/.exec(term);
    if (digits) {
      out.add(digits[0]);
      if (term === '10x') out.add('ten');
      if (term === '100x') out.add('hundred');
      if (term === '1000x') out.add('thousand');
      continue;
    }
    // a stemmer changes only a word's end; a final y becomes i ("copy" → "copi"), so that letter is left out
    out.add(term.slice(0, Math.min(4, term.endsWith('i') ? term.length - 1 : term.length)));
    for (const form of irregularFormsOf(term)) out.add(form);
    for (const p of PHRASES) if (p.term === term) for (const w of p.words) out.add(w.slice(0, 4));
  }
  keys = [...out].filter((k) => k !== '');
  keyCache.set(terms, keys);
  return keys;
}

/** Windows of `text` worth tokenising: around every place a key occurs, merged, on spaces. */
function windows(text: string, keys: string[], budget: number): [number, number][] {
  const lower = text.toLowerCase();
  const spans: [number, number][] = [];
  for (const k of keys) {
    for (let at = lower.indexOf(k); at >= 0; at = lower.indexOf(k, at + 1)) spans.push([Math.max(0, at - AROUND), Math.min(text.length, at + k.length + AROUND)]);
  }
  spans.sort((a, b) => a[0] - b[0]);
  const merged: [number, number][] = [];
  for (const s of spans) {
    const last = merged[merged.length - 1];
    if (last && s[0] <= last[1]) last[1] = Math.max(last[1], s[1]);
    else merged.push([s[0], s[1]]);
  }
  // start and end on a space so no word is cut in two; stop once `budget` characters are covered
  const out: [number, number][] = [];
  let covered = 0;
  for (const [s, e] of merged) {
    if (covered >= budget) break;
    const start = s === 0 ? 0 : text.indexOf(' ', s) + 1 || s;
    const space = text.indexOf(' ', Math.min(e, start + budget - covered));
    const end = space < 0 ? text.length : space;
    if (end <= start) continue;
    out.push([start, end]);
    covered += end - start;
  }
  return out;
}

/**
 * [start, end) of each word in `text` whose index term is one the query stood for, overlaps
 * merged. Only the text around the places a term may be written is tokenised, and of a field
 * cut to a snippet (`snippetField`) only the first few such places.
 */
export function matchRanges(text: string, terms: ReadonlySet<string>, snippetField = true): [number, number][] {
  const found: { term: string; start: number; end: number }[] = [];
  for (const [s, e] of windows(text, keysOf(terms), snippetField ? TOKENISED : Number.POSITIVE_INFINITY)) {
    for (const t of termsWithOffsets(text.slice(s, e), 'index')) found.push({ term: t.term, start: t.start + s, end: t.end + s });
  }
  const hits = found
    .filter((t) => terms.has(t.term))
    .map((t): [number, number] => [t.start, t.end])
    .sort((a, b) => a[0] - b[0] || b[1] - a[1]);
  const merged: [number, number][] = [];
  for (const r of hits) {
    const last = merged[merged.length - 1];
    if (last && r[0] <= last[1]) last[1] = Math.max(last[1], r[1]);
    else merged.push([r[0], r[1]]);
  }
  return merged;
}

/** The window of at most `SNIPPET` characters holding the most matches, moved to word boundaries. */
function snippet(text: string, ranges: [number, number][]): { text: string; ranges: [number, number][] } {
  let bestStart = 0;
  let bestCount = 0;
  for (let i = 0, j = 0; i < ranges.length; i++) {
    while (j < ranges.length && ranges[j][1] - ranges[i][0] <= SNIPPET) j++;
    if (j - i > bestCount) {
      bestCount = j - i;
      bestStart = ranges[i][0];
    }
  }
  // lead in a little before the first match, then snap to a space
  let start = Math.max(0, bestStart - 40);
  if (start > 0) {
    const space = text.indexOf(' ', start);
    start = space >= 0 && space < bestStart ? space + 1 : bestStart;
  }
  let end = Math.min(text.length, start + SNIPPET);
  if (end < text.length) {
    const space = text.lastIndexOf(' ', end);
    if (space > start) end = space;
  }
  const prefix = start > 0 ? '…' : '';
  const suffix = end < text.length ? '…' : '';
  const shift = prefix.length - start;
  return {
    text: `${prefix}${text.slice(start, end)}${suffix}`,
    ranges: ranges.filter(([s, e]) => s >= start && e <= end).map(([s, e]) => [s + shift, e + shift] as [number, number]),
  };
}

/** A narrative's markdown as the plain text a result card shows: no emphasis marks, fences, headings or link targets. */
export function plainText(markdown: string): string {
  // each pattern only where the characters it needs occur: most stories have no markdown but line ends
  let text = markdown;
  if (text.includes('```')) text = text.replace(/```[^\n]*\n?/g, '');
  if (text.includes('](')) text = text.replace(/\[([^\]]*)\]\([^)]*\)/g, '$1');
  if (text.includes('**') || text.includes('__') || text.includes('`')) text = text.replace(/\*\*|__|`/g, '');
  if (text.includes('*')) text = text.replace(/\*([^*\n]+)\*/g, '$1');
  if (text.includes('#') || text.includes('>')) text = text.replace(/^\s{0,3}(?:#{1,6}|>)\s?/gm, '');
  if (text.includes('\n')) text = text.replace(/[ \t]*\n[ \t\n]*/g, ' ');
  return text;
}

/**
 * Where a case matched, for its result card: the title and summary whole, then a snippet
 * from each longer field that matched (the narrative first), up to `maxSnippets`.
 */
export function highlightsFor(fields: { field: HighlightField; text: string | null }[], terms: ReadonlySet<string>, maxSnippets = 2): SearchHighlight[] {
  const out: SearchHighlight[] = [];
  let snippets = 0;
  const keys = keysOf(terms);
  for (const { field, text: raw } of fields) {
    if (!raw || terms.size === 0) continue;
    // the snippets are taken: a longer field would be read for nothing
    if (field !== 'title' && field !== 'summary' && snippets >= maxSnippets) continue;
    const lowered = raw.toLowerCase();
    // no place a term may be written: no markdown to strip, nothing to tokenise
    if (!keys.some((k) => lowered.includes(k))) continue;
    const text = field === 'title' ? raw : plainText(raw);
    const ranges = matchRanges(text, terms, field !== 'title' && field !== 'summary');
    if (ranges.length === 0) continue;
    if (field === 'title' || field === 'summary') out.push({ field, text, ranges });
    else if (snippets < maxSnippets) {
      snippets++;
      out.push({ field, ...snippet(text, ranges) });
    }
  }
  return out;
}
