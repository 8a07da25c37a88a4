import type { Assumption } from '../../../../shared/schemas/diagnosis';
import { formatEngineering } from '../../../../shared/units/engineering';
import { FIELD_BY_KEY, type FieldKey } from './diagnose-fields';

/** Fields the engine may assume that the form does not ask for. */
const EXTRA_FIELD_LABELS: Record<string, string> = {
  'probe.tipResistanceOhm': 'Tip resistance',
  'probe.groundWireRadiusM': 'Ground wire radius',
};

export function fieldLabel(path: string): string {
  return FIELD_BY_KEY[path as FieldKey]?.label ?? EXTRA_FIELD_LABELS[path] ?? path;
}

const RATIO_FIELDS = new Set(['probe.attenuation', 'scope.attenuationSetting']);
const CHOICE_WORDS: Record<string, string> = {
  'clip-lead': 'clip lead',
  spring: 'ground spring',
  none: 'no probe ground',
  square: 'square wave',
  pulse: 'single edge',
  dc: 'DC',
  sine: 'sine',
  other: 'other',
  passive: 'passive probe',
  active: 'active probe',
  differential: 'differential probe',
  current: 'current probe',
  ac: 'AC',
  '50-ohm': 'set for 50 Ω',
  'high-z': 'set for high impedance',
};

/** An assumed value as people read it: "10x", "12 pF", "single edge". */
export function assumptionValue(a: Assumption): string {
  if (typeof a.value === 'string') return CHOICE_WORDS[a.value] ?? a.value;
  if (RATIO_FIELDS.has(a.field)) return `${Number(a.value.toPrecision(6))}x`;
  if (a.field === 'signal.frequencyHz' && a.value === 0) return 'none (DC / single edge)';
  return a.unit === '' ? String(Number(a.value.toPrecision(4))) : formatEngineering(a.value, a.unit);
}

/** Estimates the engine reports, with a label and how to print them; the unit follows the key's suffix otherwise. */
const ESTIMATES: Record<string, { label: string; unit?: string; ratio?: 'x' | '%' }> = {
  shownToTrueRatio: { label: 'Shown ÷ true', ratio: 'x' },
  impliedProbeAttenuation: { label: 'Probe ratio the reading implies', ratio: 'x' },
  actualAttenuation: { label: 'Attenuation in effect', ratio: 'x' },
  inputResistanceOhm: { label: 'Input resistance' },
  dcRatio: { label: 'DC divider keeps', ratio: '%' },
  amplitudeRatio: { label: 'Amplitude reaching the scope', ratio: '%' },
  cornerFrequencyHz: { label: 'RC corner' },
  loadedRiseTimeS: { label: 'Rise time from the load alone' },
  impliedSourceResistanceOhm: { label: 'Source impedance the reading implies' },
  systemRiseTimeS: { label: 'Probe + scope rise time' },
  systemBandwidthHz: { label: 'Probe + scope bandwidth' },
  effectiveBandwidthHz: { label: 'Bandwidth the edge implies' },
  timeConstantS: { label: 'Settling time constant τ' },
  balancedTipCapacitanceF: { label: 'C1 that balances the divider' },
  tipCapacitanceF: { label: 'C1 the corners imply' },
  jumpRatio: { label: 'Edge jumps to', ratio: '%' },
  settleRatio: { label: 'Settles to', ratio: '%' },
  state: { label: 'Probe is' },
  adjust: { label: 'Trimmer' },
  impliedInductanceH: { label: 'Loop inductance the ringing implies' },
  impliedLeadLengthM: { label: 'Lead length the ringing implies' },
  inductanceH: { label: 'Lead inductance' },
  naturalFrequencyHz: { label: 'Lead resonance' },
  dampingRatio: { label: 'Damping ratio ζ', unit: '' },
  ringingFrequencyHz: { label: 'Ringing frequency' },
};

const SUFFIX_UNITS: [RegExp, string][] = [
  [/Hz$/, 'Hz'],
  [/Ohm$/, 'Ω'],
  [/S$/, 's'],
  [/F$/, 'F'],
  [/H$/, 'H'],
  [/M$/, 'm'],
  [/V$/, 'V'],
];

export function estimateLabel(key: string): string {
  return ESTIMATES[key]?.label ?? key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
}

export function estimateValue(key: string, value: number | string): string {
  if (typeof value === 'string') return key === 'adjust' ? `${value} the high-frequency gain` : value;
  const def = ESTIMATES[key];
  if (def?.ratio === '%') return `${Number((value * 100).toPrecision(3))} %`;
  if (def?.ratio === 'x') return value >= 1000 ? Math.round(value).toLocaleString('en') : Number(value.toPrecision(3)).toString();
  const unit = def?.unit ?? SUFFIX_UNITS.find(([re]) => re.test(key))?.[1] ?? '';
  return unit === '' ? String(Number(value.toPrecision(3))) : formatEngineering(value, unit);
}
