import { prefixFor, prefixSymbolFor } from './si-prefixes';

export type ParseResult = { ok: true; value: number } | { ok: false; error: string };

/** Units the case form asks for, with the quantity named in error messages. */
const QUANTITIES: Record<string, string> = {
  F: 'capacitance',
  'Ω': 'resistance',
  Hz: 'frequency',
  s: 'time',
  V: 'voltage',
  A: 'current',
  H: 'inductance',
  W: 'power',
  m: 'length',
  '': 'plain number',
};

/** Spellings of units that keyboards make easy; the key is matched exactly. */
const UNIT_ALIASES: Record<string, string> = {
  '\u2126': 'Ω', // OHM SIGN, which some fonts and pasted data sheets use
  ohm: 'Ω',
  ohms: 'Ω',
  Ohm: 'Ω',
  Ohms: 'Ω',
  OHM: 'Ω',
  OHMS: 'Ω',
  hz: 'Hz',
  HZ: 'Hz',
  sec: 's',
  v: 'V',
};

/** Canonical unit symbol for a spelling, or undefined when it is not a unit we know. */
export function canonicalUnit(text: string): string | undefined {
  const unit = UNIT_ALIASES[text] ?? text;
  return unit !== '' && unit in QUANTITIES ? unit : undefined;
}

const NUMBER = /^([+-]?(?:\d+\.?\d*|\.\d+))(?:[eE]([+-]?\d+))?\s*(.*)$/u;

/**
 * Reads a value written in engineering notation: "15 pF", "9 MΩ", "9Meg", "4.7k", "2.5 ns",
 * "1e-9", "10 µs", "10 us", "50 ohm".
 *
 * - Prefixes: y z a f p n µ (also u, μ) m k (also K) M G T, and c before a unit ("15 cm").
 *   `M` is mega; a lower-case `m` is milli; `meg` in any case is mega, as in SPICE.
 * - A bare `m` means milli, except when `unit` is `'m'` (a length), where it means metres.
 * - The unit is optional; when `unit` is given, a unit written in the text must match it.
 * - Decimal commas ("1,5") are refused rather than guessed at: "1,500" could be 1.5 or 1500.
 * - The prefix is case-sensitive ("mHz" is millihertz); unit words are not ("50 OHM").
 *
 * @param text what the user typed
 * @param unit the unit expected (`'F'`, `'Ω'` or `'ohm'`, `'Hz'`, `'s'`, `'V'`, `'m'`…), if any
 * @returns the value in SI base units, or an error message to show beside the field
 */
export function parseEngineering(text: string, unit?: string): ParseResult {
  const expected = unit === undefined ? undefined : unit === '' ? '' : canonicalUnit(unit);
  if (expected === undefined && unit !== undefined) return fail(`unknown unit "${unit}"`);
  const trimmed = text.trim();
  if (trimmed === '') return fail('enter a value');
  if (trimmed.includes(',')) return fail('use a decimal point, as in "1.5", not a comma');
  const match = NUMBER.exec(trimmed);
  if (!match) return fail(`"${trimmed}" is not a number`);
  const [, mantissa, exponentText, suffix] = match;
  if (/^[\d.+-]/.test(suffix)) return fail(`"${trimmed}" is not a number`);
  const split = splitSuffix(suffix, expected);
  if (!split.ok) return split;
  if (expected !== undefined && split.unit !== undefined && split.unit !== expected) {
    return fail(`expected ${describe(expected)}, got ${split.unit}`);
  }
  // Building the decimal string lets Number() round once, so "15 p" is exactly 15e-12.
  const exponent = Number(exponentText ?? '0') + split.exponent;
  const value = Number(`${mantissa}e${exponent}`);
  if (!Number.isFinite(value)) return fail(`"${trimmed}" is too large`);
  return { ok: true, value };
}

type Split = { ok: true; exponent: number; unit?: string } | { ok: false; error: string };

function splitSuffix(suffix: string, expected: string | undefined): Split {
  if (suffix === '') return { ok: true, exponent: 0 };
  const whole = canonicalUnit(suffix);
  if (whole !== undefined && !(whole === 'm' && expected !== 'm')) {
    return { ok: true, exponent: 0, unit: whole };
  }
  let exponent: number;
  let rest: string;
  if (/^meg/i.test(suffix)) {
    exponent = 6;
    rest = suffix.slice(3);
  } else {
    const prefix = prefixFor(suffix[0]);
    if (!prefix) return fail(`unknown prefix or unit "${suffix}"`);
    exponent = prefix.exponent;
    rest = suffix.slice(1);
  }
  if (rest === '') {
    if (exponent === -2) return fail('write "c" only before a unit, as in "15 cm"');
    return { ok: true, exponent };
  }
  const restUnit = canonicalUnit(rest);
  if (restUnit === undefined) return fail(`unknown prefix or unit "${suffix}"`);
  if (exponent === -2 && restUnit !== 'm') return fail('centi is only used for lengths ("15 cm")');
  return { ok: true, exponent, unit: restUnit };
}

function describe(unit: string): string {
  return unit === '' ? 'a plain number' : `a ${QUANTITIES[unit]} in ${unit}`;
}

function fail(error: string): { ok: false; error: string } {
  return { ok: false, error };
}

/**
 * Writes a value with an SI prefix chosen so the mantissa is in [1, 1000):
 * `formatEngineering(15e-12, 'F')` → "15 pF", `formatEngineering(2.5e-9, 's')` → "2.50 ns".
 *
 * `digits` significant figures are kept, except that a whole-number mantissa drops its
 * decimals ("15 pF", "9 MΩ", not "15.0 pF", "9.00 MΩ"). Values beyond tera or below yocto
 * keep the last prefix; NaN and ±Infinity are written as they are.
 *
 * @param value in SI base units
 * @param unit symbol to append (`'ohm'` is written as Ω); `''` for a plain number
 * @param digits significant figures, 1–15
 */
export function formatEngineering(value: number, unit: string, digits = 3): string {
  const symbol = unit === 'ohm' ? 'Ω' : unit;
  const join = (mantissa: string, prefix: string) => `${mantissa} ${prefix}${symbol}`.trimEnd();
  if (!Number.isFinite(value)) return join(String(value), '');
  if (value === 0) return join('0', '');
  const precision = Math.min(15, Math.max(1, Math.round(digits)));
  let exponent = clampExponent(Math.floor(Math.log10(Math.abs(value)) / 3) * 3);
  let mantissa = roundTo(value / 10 ** exponent, precision);
  // log10 and rounding can both push the mantissa across a power of 1000 (999.7 → "1.00 k").
  if (Math.abs(mantissa) >= 1000 && exponent < 12) {
    exponent += 3;
    mantissa = roundTo(value / 10 ** exponent, precision);
  } else if (Math.abs(mantissa) < 1 && exponent > -24) {
    exponent -= 3;
    mantissa = roundTo(value / 10 ** exponent, precision);
  }
  return join(writeMantissa(mantissa, precision), prefixSymbolFor(exponent));
}

function clampExponent(exponent: number): number {
  return Math.min(12, Math.max(-24, exponent));
}

function roundTo(value: number, precision: number): number {
  return Number(value.toPrecision(precision));
}

function writeMantissa(mantissa: number, precision: number): string {
  if (Number.isInteger(mantissa)) return String(mantissa);
  const text = mantissa.toPrecision(precision);
  return text.includes('e') ? String(mantissa) : text;
}
