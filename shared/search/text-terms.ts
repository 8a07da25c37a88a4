import { STOPWORDS } from './stopwords';
import { stem, writtenFormTerm } from './stem';
import { PHRASES, canonicalToken, quantityTerm } from './synonyms';

/** An index term and where in the text it came from (UTF-16 offsets, end exclusive). */
export interface TermAt {
  term: string;
  start: number;
  end: number;
  /** The token as written, normalised but not stemmed (for as-you-type prefix matching). */
  surface: string;
}

export interface Token {
  text: string;
  start: number;
  end: number;
}

// letters/digits with inner joiners ("10x-at-1x", "1.2", "scope's"), an optional leading ×, or a lone %
const TOKEN = /×?[\p{L}\p{N}]+(?:['’.\-+/][\p{L}\p{N}]+)*%?|%/gu;

const ASCII = /^[\x00-\x7f]*$/;
const normalize = (raw: string) => (ASCII.test(raw) ? raw : raw.normalize('NFKC')).toLowerCase().replace(/['’]s$/, '');

/**
 * `normalize` without its work for the usual token: plain lower-case ASCII letters and digits
 * come back as they are (no regex, no new string); anything else takes the full path.
 */
function normalizeFast(raw: string): string {
  for (let i = 0; i < raw.length; i++) {
    const c = raw.charCodeAt(i);
    if (!((c >= 97 && c <= 122) || (c >= 48 && c <= 57) || c === 46)) return normalize(raw);
  }
  return raw;
}

/** A raw token as the index reads it: normalised, and "ground-lead", "10x-at-1x", "1x/10x" split into their parts. */
function pushToken(out: Token[], raw: string, start: number) {
  const norm = normalizeFast(raw);
  const parts = norm.includes('-') || norm.includes('/') ? norm.split(/[-/]/) : undefined;
  if (parts && parts.every((p) => p !== '')) {
    let at = start;
    for (const p of parts) {
      out.push({ text: p, start: at, end: at + p.length });
      at += p.length + 1;
    }
  } else {
    out.push({ text: norm, start, end: start + raw.length });
  }
}

/** The tokens `TOKEN` finds in `text` from `from` on: the definition of a token. */
export function patternTokens(text: string, from = 0, out: Token[] = []): Token[] {
  TOKEN.lastIndex = from;
  for (let m = TOKEN.exec(text); m !== null; m = TOKEN.exec(text)) pushToken(out, m[0], m.index);
  return out;
}

const isAsciiAlnum = (c: number) => (c >= 48 && c <= 57) || (c >= 97 && c <= 122) || (c >= 65 && c <= 90);
// the joiners of TOKEN that are ASCII: ' . - + /
const isAsciiJoiner = (c: number) => c === 39 || c === 46 || c === 45 || c === 43 || c === 47;

/**
 * `patternTokens`, by a loop over character codes while the text is ASCII (a pattern with
 * Unicode classes is the slower part of reading a text). From the first non-ASCII character
 * on (µ, Ω, ’, ×, a dash), the pattern takes over where it would have resumed: after the last
 * token whose end was decided by ASCII characters alone.
 */
export function rawTokens(text: string): Token[] {
  const out: Token[] = [];
  const n = text.length;
  let firstWide = 0;
  while (firstWide < n && text.charCodeAt(firstWide) < 128) firstWide++;
  // a token ending at e looked at the characters at e and e + 1; those must be ASCII
  const settled = firstWide - 2;
  let resume = 0;
  let i = 0;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c >= 128) break;
    if (!isAsciiAlnum(c) && c !== 37) {
      i++;
      continue;
    }
    const start = i++;
    if (c !== 37) {
      while (i < n && isAsciiAlnum(text.charCodeAt(i))) i++;
      while (i + 1 < n && isAsciiJoiner(text.charCodeAt(i)) && isAsciiAlnum(text.charCodeAt(i + 1))) {
        i += 2;
        while (i < n && isAsciiAlnum(text.charCodeAt(i))) i++;
      }
      if (i < n && text.charCodeAt(i) === 37) i++;
    }
    if (firstWide < n && i > settled) break;
    pushToken(out, text.slice(start, i), start);
    resume = i;
  }
  return firstWide < n ? patternTokens(text, resume, out) : out;
}

const PHRASES_BY_FIRST = new Map<string, (typeof PHRASES)[number][]>();
for (const p of PHRASES) PHRASES_BY_FIRST.set(p.words[0], [...(PHRASES_BY_FIRST.get(p.words[0]) ?? []), p]);

// Index terms of single words, memoised: a corpus repeats its vocabulary, so each word is analysed once.
const TERM_CACHE = new Map<string, string>();
const TERM_CACHE_LIMIT = 200_000;

function wordTerm(word: string): string {
  let term = TERM_CACHE.get(word);
  if (term === undefined) {
    const canonical = canonicalToken(word);
    term = STOPWORDS.has(canonical) ? '' : /\d/.test(canonical) ? canonical : stem(canonical);
    if (TERM_CACHE.size >= TERM_CACHE_LIMIT) TERM_CACHE.clear();
    TERM_CACHE.set(word, term);
  }
  return term;
}

function emit(out: TermAt[], term: string, start: number, end: number, surface = term) {
  if (term !== '') out.push({ term, start, end, surface });
}

/** A word: its term, and in the index an irregular form's written-form term as well. */
function emitWord(out: TermAt[], t: Token, mode: 'index' | 'query') {
  emit(out, wordTerm(t.text), t.start, t.end, t.text);
  if (mode === 'index') {
    const written = writtenFormTerm(t.text);
    if (written) emit(out, written, t.start, t.end, t.text);
  }
}

/**
 * The text's index terms with their positions: phrases and quantities folded to one term,
 * function words dropped, inflections stripped.
 *
 * @param mode `index` also keeps the words of a phrase (so "ground" still finds "ground
 *   spring"); `query` keeps only the phrase term, so a query for the phrase needs the phrase.
 */
export function termsWithOffsets(text: string, mode: 'index' | 'query' = 'index'): TermAt[] {
  // emit and emitWord live outside: a closure made per call is also renamed per call by the TS loader
  const tokens = rawTokens(text);
  const out: TermAt[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    const next = tokens[i + 1];
    const quantity = next && t.text.charCodeAt(0) < 58 ? quantityTerm(t.text, next.text) : undefined;
    if (quantity && next) {
      emit(out, quantity, t.start, next.end);
      i++;
      continue;
    }
    const phrase = PHRASES_BY_FIRST.get(t.text)?.find((p) => p.words.every((w, k) => tokens[i + k]?.text === w));
    if (phrase) {
      const last = tokens[i + phrase.words.length - 1];
      emit(out, phrase.term, t.start, last.end);
      if (mode === 'index') {
        for (let k = 0; k < phrase.words.length; k++) emitWord(out, tokens[i + k], mode);
      }
      i += phrase.words.length - 1;
      continue;
    }
    if (t.text === '%') continue;
    emitWord(out, t, mode);
  }
  return out;
}

/** Index terms only, the `tokenize` of the search index. */
export const indexTerms = (text: string): string[] => termsWithOffsets(text, 'index').map((t) => t.term);

/** Whether the user is still typing the last word (no space or punctuation after it yet). */
export function lastWordOpen(text: string): boolean {
  return /[\p{L}\p{N}]$/u.test(text);
}
