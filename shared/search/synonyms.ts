/**
 * Spellings the trade uses for one thing, folded into one index term at index and query time.
 * Word sequences become `phrase` terms; a number with a unit becomes one quantity term.
 */

/** Multi-word phrases → the one term both the index and a query use for them. */
export const PHRASES: readonly { words: readonly string[]; term: string }[] = [
  // common practice: "x10", "10x" and "ten times" all name a tenfold ratio
  { words: ['ten', 'times'], term: '10x' },
  { words: ['hundred', 'times'], term: '100x' },
  { words: ['thousand', 'times'], term: '1000x' },
  { words: ['times', 'ten'], term: '10x' },
  // common practice: the short spring that grounds a probe at its tip barrel
  { words: ['spring', 'tip'], term: 'groundspring' },
  { words: ['tip', 'spring'], term: 'groundspring' },
  { words: ['ground', 'spring'], term: 'groundspring' },
  { words: ['grounding', 'spring'], term: 'groundspring' },
  { words: ['spring', 'ground'], term: 'groundspring' },
  { words: ['square', 'wave'], term: 'squarewave' },
];

/** Unit spellings after a number → the unit part of a quantity term ("50 ohm" → "50ω"). */
export const UNIT_SPELLINGS: Readonly<Record<string, string>> = {
  ω: 'ω', ohm: 'ω', ohms: 'ω',
  kω: 'kω', kohm: 'kω', kohms: 'kω', k: 'kω',
  mω: 'mω', mohm: 'mω', meg: 'mω', megohm: 'mω', megohms: 'mω',
  hz: 'hz', khz: 'khz', mhz: 'mhz', ghz: 'ghz',
  v: 'v', mv: 'mv', kv: 'kv', µv: 'µv', μv: 'µv', uv: 'µv', vpp: 'vpp', vrms: 'vrms',
  ma: 'ma', µa: 'µa', μa: 'µa', ua: 'µa',
  s: 's', ms: 'ms', µs: 'µs', μs: 'µs', us: 'µs', ns: 'ns', ps: 'ps',
  pf: 'pf', nf: 'nf', µf: 'µf', μf: 'µf', uf: 'µf',
  nh: 'nh', µh: 'µh', μh: 'µh', uh: 'µh',
  cm: 'cm', mm: 'mm', m: 'm',
  '%': '%', pct: '%', percent: '%',
  db: 'db', w: 'w', mw: 'mw',
  x: 'x', '×': 'x',
};

const NUMBER = /^\d+(?:\.\d+)?$/;
const GLUED = /^(\d+(?:\.\d+)?)([a-zωµμ%×]+)$/u;

/** A quantity term for `number unit`, or undefined when `unit` is not a unit spelling. */
export function quantityTerm(number: string, unit: string): string | undefined {
  if (!NUMBER.test(number)) return undefined;
  const u = UNIT_SPELLINGS[unit];
  return u === undefined ? undefined : `${number}${u}`;
}

/** One token in canonical form: "x10" and "×10" → "10x", "50ohms" → "50ω", "120MHz" → "120mhz". */
export function canonicalToken(token: string): string {
  const times = /^[x×](\d+)$/.exec(token);
  if (times) return `${times[1]}x`;
  const glued = GLUED.exec(token);
  if (glued) return quantityTerm(glued[1], glued[2]) ?? token;
  return token;
}

