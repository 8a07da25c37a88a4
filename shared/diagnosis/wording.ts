import { formatEngineering } from '../units/engineering';

/** Engineering notation for explanations: `eng(15e-12, 'F')` → "15 pF". */
export const eng = (value: number, unit: string): string => formatEngineering(value, unit);

/**
 * A ratio written for people: "10", "2.5", "180,001". Large ratios keep every digit because
 * the exact figure is what a reader checks against the data sheet.
 */
export function factor(ratio: number): string {
  if (!Number.isFinite(ratio)) return String(ratio);
  if (Math.abs(ratio) >= 1000) {
    return Math.round(ratio)
      .toString()
      .replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  }
  return String(Number(ratio.toPrecision(3)));
}

/** A percentage with sensible precision: "16.3 %", "0.5 %", "120 %". */
export function percent(pct: number): string {
  return `${Number(pct.toPrecision(3))} %`;
}

/**
 * A label as words inside a sentence: "High-impedance probe on a 50 Ω input" → "high-impedance
 * probe on a 50 Ω input". Only the first letter is lowered, and not when the first word is an
 * acronym ("AC coupling droop" stays): lower-casing the whole label turned Ω into ω.
 */
export function inSentence(label: string): string {
  const second = label.charAt(1);
  return second !== '' && second === second.toUpperCase() && second !== second.toLowerCase() ? label : label.charAt(0).toLowerCase() + label.slice(1);
}

/** "An active probe", "A differential probe": the article a word takes at the start of a sentence (by its first letter). */
export function withArticle(word: string): string {
  return `${/^[aeiou]/i.test(word) ? 'An' : 'A'} ${word}`;
}
