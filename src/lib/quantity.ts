import { formatEngineering, parseEngineering } from '../../shared/units/engineering';

/**
 * Units a form field can ask for. `x` is a ratio written "10x" (probe attenuation); `%` is a
 * plain percentage; `dB` a level in decibels; `#` a plain count (divisions); the rest are SI
 * units read with engineering prefixes (`Sa/s` and `V/div` too: "1 GSa/s", "500 mV/div").
 */
export type QuantityUnit = 'F' | 'Ω' | 'Hz' | 's' | 'V' | 'm' | 'x' | '%' | 'Sa/s' | 'V/div' | 'dB' | '#';

/** Suffixes a field drops before reading the number, and the unit the rest is read in. */
const SUFFIXES: Partial<Record<QuantityUnit, { re: RegExp; unit: string }>> = {
  x: { re: /\s*[xX×]$/, unit: '' },
  '%': { re: /\s*%$/, unit: '' },
  'Sa/s': { re: /\s*(?:Sa\/s|S\/s|sps|SPS)$/, unit: '' },
  'V/div': { re: /\s*\/\s*div$/i, unit: 'V' },
  dB: { re: /\s*dB$/i, unit: '' },
  '#': { re: /(?!)/, unit: '' },
};

export type QuantityReading = { kind: 'empty' } | { kind: 'ok'; value: number } | { kind: 'error'; message: string };

/** Reads what was typed into a quantity field; an empty field is "not recorded", not an error. */
export function readQuantity(text: string, unit: QuantityUnit): QuantityReading {
  let t = text.trim();
  if (t === '') return { kind: 'empty' };
  const suffix = SUFFIXES[unit];
  if (suffix) t = t.replace(suffix.re, '');
  const parsed = parseEngineering(t, suffix ? suffix.unit : unit);
  if (!parsed.ok) return { kind: 'error', message: explain(parsed.error, unit) };
  return { kind: 'ok', value: parsed.value };
}

function explain(error: string, unit: QuantityUnit): string {
  const example = EXAMPLES[unit];
  return `Cannot read this: ${error}. Try e.g. ${example}.`;
}

const EXAMPLES: Record<QuantityUnit, string> = {
  F: '"15 pF" or "15p"',
  'Ω': '"9 MΩ", "9Meg" or "50 ohm"',
  Hz: '"120 MHz" or "120M"',
  s: '"2.5 ns" or "2.5n"',
  V: '"3.3 V" or "500m"',
  m: '"15 cm" or "0.15"',
  x: '"10x" or "10"',
  '%': '"12 %" or "-5"',
  'Sa/s': '"1 GSa/s" or "500M"',
  'V/div': '"500 mV/div" or "0.5"',
  dB: '"60 dB" or "40"',
  '#': '"8" or "10"',
};

/** A value for reading at a glance: 3 significant figures, engineering prefix. */
export function showQuantity(value: number, unit: QuantityUnit, digits = 3): string {
  if (unit === 'x') return `${Number(value.toPrecision(Math.max(digits, 6)))}x`;
  if (unit === '%') return `${Number(value.toPrecision(digits))} %`;
  if (unit === 'dB') return `${Number(value.toPrecision(digits))} dB`;
  if (unit === '#') return String(Number(value.toPrecision(digits)));
  return formatEngineering(value, unit, digits);
}

/** A value written back into its field without losing precision ("2.5 ns", not "2.50000 ns"). */
export function editableQuantity(value: number | null | undefined, unit: QuantityUnit): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  if (unit === 'x' || unit === '%') return `${Number(value.toPrecision(12))}${unit === 'x' ? 'x' : ' %'}`;
  if (unit === 'dB') return `${Number(value.toPrecision(12))} dB`;
  if (unit === '#') return String(Number(value.toPrecision(12)));
  return formatEngineering(value, unit, 12).replace(/^(-?\d+\.\d*?)0+(?=\s|$)/, '$1').replace(/\.(?=\s|$)/, '');
}
