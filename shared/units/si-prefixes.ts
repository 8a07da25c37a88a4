/**
 * SI prefixes Falsetrace reads and writes, from yocto to tera.
 * source: BIPM SI Brochure, 9th ed., 2019, Table 7 (SI prefixes)
 *
 * Peta and above are left out on purpose: no probing quantity gets there, and "E"/"P"
 * typed after a number are more often typing slips than exa or peta.
 */
export interface SiPrefix {
  symbol: string;
  name: string;
  /** Power of ten the prefix stands for. */
  exponent: number;
}

export const SI_PREFIXES: readonly SiPrefix[] = [
  { symbol: 'y', name: 'yocto', exponent: -24 },
  { symbol: 'z', name: 'zepto', exponent: -21 },
  { symbol: 'a', name: 'atto', exponent: -18 },
  { symbol: 'f', name: 'femto', exponent: -15 },
  { symbol: 'p', name: 'pico', exponent: -12 },
  { symbol: 'n', name: 'nano', exponent: -9 },
  { symbol: 'µ', name: 'micro', exponent: -6 },
  { symbol: 'm', name: 'milli', exponent: -3 },
  { symbol: 'c', name: 'centi', exponent: -2 },
  { symbol: 'k', name: 'kilo', exponent: 3 },
  { symbol: 'M', name: 'mega', exponent: 6 },
  { symbol: 'G', name: 'giga', exponent: 9 },
  { symbol: 'T', name: 'tera', exponent: 12 },
];

/**
 * Other spellings met on benches and in SPICE decks. "u" and Greek mu stand in for the micro
 * sign; "K" for kilo is common on resistor labels (common practice). "meg" is matched
 * separately, case-insensitively.
 */
const ALIASES: Record<string, string> = { u: 'µ', 'μ': 'µ', K: 'k' };

const BY_SYMBOL = new Map(SI_PREFIXES.map((p) => [p.symbol, p]));

/** The prefix a single character stands for, or undefined. */
export function prefixFor(symbol: string): SiPrefix | undefined {
  return BY_SYMBOL.get(ALIASES[symbol] ?? symbol);
}

/** Prefix symbol to write for a power of ten that is a multiple of 3 (centi is never written). */
export function prefixSymbolFor(exponent: number): string {
  if (exponent === 0) return '';
  return SI_PREFIXES.find((p) => p.exponent === exponent && p.symbol !== 'c')?.symbol ?? '';
}
