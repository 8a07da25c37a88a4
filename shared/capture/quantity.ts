/** A number read from a preamble value, with the unit written after it. */
export interface Quantity {
  value: number;
  /** The unit after the number with its prefix removed, lower-cased ("v", "sa/s", "hz", "ohm"); '' when none. */
  unit: string;
  /** True when a prefix (m, µ, k, M, G…) was applied. */
  prefixed: boolean;
}

// source: BIPM SI Brochure, 9th ed., 2019, Table 7 (SI prefixes)
const PREFIX: Record<string, number> = { p: 1e-12, n: 1e-9, u: 1e-6, µ: 1e-6, μ: 1e-6, m: 1e-3, k: 1e3, K: 1e3, M: 1e6, G: 1e9 };
const NUMBER = /^([-+]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][-+]?\d+)?)\s*(.*)$/u;
// Units a preamble value may carry; a prefix is only split off in front of one of these.
const UNITS = ['v/div', 'v', 'volt', 'volts', 's', 'sec', 'sa/s', 'sps', 's/s', 'sa', 'pts', 'hz', 'ohm', 'ohms', 'ω', 'Ω', 'r', 'div', 'x'];

/**
 * Reads "500mV", "0,5 V/div", "1GSa/s", "20 MHz", "1MΩ", "50 Ohm", "1e-9 s", "2.5E+03": a decimal
 * number (point, or comma when `decimalComma`), then an optional SI prefix and unit. A bare
 * prefix letter is a prefix ("1M" is a megohm); "M" before a unit is mega, "m" milli.
 * Returns null when the text does not start with a number.
 */
export function readQuantity(text: string, decimalComma = true): Quantity | null {
  const match = NUMBER.exec(text.trim().replace(/^"|"$/gu, '').trim());
  if (!match) return null;
  const numberText = match[1];
  if (!decimalComma && numberText.includes(',')) return null;
  const value = Number(numberText.replace(',', '.'));
  if (!Number.isFinite(value)) return null;
  let rest = match[2].trim();
  let scale = 1;
  let prefixed = false;
  const first = rest.charAt(0);
  if (first in PREFIX) {
    const after = rest.slice(1).trim();
    const afterLower = after.toLowerCase();
    if (after === '' || UNITS.some((unit) => afterLower.startsWith(unit.toLowerCase()))) {
      scale = PREFIX[first];
      prefixed = true;
      rest = after;
    }
  }
  return { value: value * scale, unit: rest.toLowerCase().replace(/\s+/gu, ''), prefixed };
}
