import { formatEngineering, parseEngineering } from '../../shared/units/engineering';

/**
 * Units a form field can ask for. `x` is a ratio written "10x" (probe attenuation); `%` is a
 * plain percentage; the rest are SI units read with engineering prefixes.
 */
export type QuantityUnit = 'F' | 'Ω' | 'Hz' | 's' | 'V' | 'm' | 'x' | '%';

export type QuantityReading = { kind: 'empty' } | { kind: 'ok'; value: number } | { kind: 'error'; message: string };

/** Reads what was typed into a quantity field; an empty field is "not recorded", not an error. */
export function readQuantity(text: string, unit: QuantityUnit): QuantityReading {
  let t = text.trim();
  if (t === '') return { kind: 'empty' };
  if (unit === 'x') t = t.replace(/\s*[xX×]$/, '');
  if (unit === '%') t = t.replace(/\s*%$/, '');
  const parsed = parseEngineering(t, unit === 'x' || unit === '%' ? '' : unit);
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
};

/** A value for reading at a glance: 3 significant figures, engineering prefix. */
export function showQuantity(value: number, unit: QuantityUnit, digits = 3): string {
  if (unit === 'x') return `${Number(value.toPrecision(Math.max(digits, 6)))}x`;
  if (unit === '%') return `${Number(value.toPrecision(digits))} %`;
  return formatEngineering(value, unit, digits);
}

/** A value written back into its field without losing precision ("2.5 ns", not "2.50000 ns"). */
export function editableQuantity(value: number | null | undefined, unit: QuantityUnit): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  if (unit === 'x' || unit === '%') return `${Number(value.toPrecision(12))}${unit === 'x' ? 'x' : ' %'}`;
  return formatEngineering(value, unit, 12).replace(/^(-?\d+\.\d*?)0+(?=\s|$)/, '$1').replace(/\.(?=\s|$)/, '');
}
