import { irregularFormsOf } from '../../shared/search/stem';
import { PHRASES } from '../../shared/search/synonyms';
import { termsWithOffsets } from '../../shared/search/text-terms';
import type { HighlightField, SearchHighlight } from '../../shared/schemas/search';

/** Longest snippet cut from a long field, in characters (our choice: two lines of a result card). */
const SNIPPET = 180;

/** Below this length a field is tokenised whole; above it only around the places a query term may be. */
const WHOLE = 600;
/** Characters tokenised either side of a place a term may start (covers a two-word phrase). */
const AROUND = 48;

const keyCache = new WeakMap<ReadonlySet<string>, string[]>();

/**
 * Lower-case strings one of which every written form of the terms contains: a stem's first
 * four letters ("ringing" and "rings" start "ring"), its irregular forms ("rang"), a quantity's
 * digits, a phrase's words ("ten times" for 10x, "spring tip" for the ground spring).
 */
function keysOf(terms: ReadonlySet<string>): string[] {
  let keys = keyCache.get(terms);
  if (keys) return keys;
  const out = new Set<string>();
  for (const term of terms) {
    const digits = /^\d+(?:\.\d+)?/.exec(term);
    if (digits) {
      out.add(digits[0]);
      if (term === '10x') out.add('ten');
      if (term === '100x') out.add('hundred');
      if (term === '1000x') out.add('thousand');
      continue;
    }
    out.add(term.slice(0, 4));
    for (const form of irregularFormsOf(term)) out.add(form);
    for (const p of PHRASES) if (p.term === term) for (const w of p.words) out.add(w.slice(0, 4));
  }
  keys = [...out].filter((k) => k !== '');
  keyCache.set(terms, keys);
  return keys;
}

/** Windows of `text` worth tokenising: around every place a key occurs, merged, on spaces. */
function windows(text: string, keys: string[]): [number, number][] {
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
  // start and end on a space so no word is cut in two
  return merged.map(([s, e]) => {
    const start = s === 0 ? 0 : text.indexOf(' ', s) + 1 || s;
    const space = text.indexOf(' ', e);
    return [start, space < 0 ? text.length : space];
  });
}

/** [start, end) of each word in `text` whose index term is one the query stood for, overlaps merged. */
export function matchRanges(text: string, terms: ReadonlySet<string>): [number, number][] {
  const found: { term: string; start: number; end: number }[] = [];
  if (text.length <= WHOLE) found.push(...termsWithOffsets(text, 'index'));
  else {
    for (const [s, e] of windows(text, keysOf(terms))) {
      for (const t of termsWithOffsets(text.slice(s, e), 'index')) found.push({ term: t.term, start: t.start + s, end: t.end + s });
    }
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
  return markdown
    .replace(/```[^\n]*\n?/g, '')
    .replace(/\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/\*\*|__|`/g, '')
    .replace(/\*([^*\n]+)\*/g, '$1')
    .replace(/^\s{0,3}(?:#{1,6}|>)\s?/gm, '')
    .replace(/[ \t]*\n[ \t\n]*/g, ' ');
}

/**
 * Where a case matched, for its result card: the title and summary whole, then a snippet
 * from each longer field that matched (the narrative first), up to `maxSnippets`.
 */
export function highlightsFor(fields: { field: HighlightField; text: string | null }[], terms: ReadonlySet<string>, maxSnippets = 2): SearchHighlight[] {
  const out: SearchHighlight[] = [];
  let snippets = 0;
  for (const { field, text: raw } of fields) {
    if (!raw || terms.size === 0) continue;
    const text = field === 'title' ? raw : plainText(raw);
    const ranges = matchRanges(text, terms);
    if (ranges.length === 0) continue;
    if (field === 'title' || field === 'summary') out.push({ field, text, ranges });
    else if (snippets < maxSnippets) {
      snippets++;
      out.push({ field, ...snippet(text, ranges) });
    }
  }
  return out;
}
