import { GROUND_KINDS, SIGNAL_KINDS } from '../../../../shared/schemas/diagnosis';
import type { QuantityUnit } from '../../../lib/quantity';

/** Form fields, named by their path in the `POST /api/diagnosis` body so server issues land on them. */
export const QUANTITY_KEYS = [
  'probe.attenuation',
  'probe.tipCapacitanceF',
  'probe.groundLeadM',
  'probe.bandwidthHz',
  'scope.attenuationSetting',
  'scope.inputCapacitanceF',
  'scope.bandwidthHz',
  'scope.bandwidthLimitHz',
  'circuit.sourceResistanceOhm',
  'signal.expectedAmplitudeV',
  'signal.frequencyHz',
  'signal.riseTimeS',
  'observed.amplitudeV',
  'observed.riseTimeS',
  'observed.overshootPct',
  'observed.ringingFrequencyHz',
] as const;
export const CHOICE_KEYS = ['probe.groundKind', 'scope.inputResistanceOhm', 'signal.kind'] as const;

export type QuantityKey = (typeof QUANTITY_KEYS)[number];
export type ChoiceKey = (typeof CHOICE_KEYS)[number];
export type FieldKey = QuantityKey | ChoiceKey;
/** What the user typed, field by field; '' is "not recorded". */
export type DiagnoseValues = Record<FieldKey, string>;

export interface QuantityFieldDef {
  kind: 'quantity';
  key: QuantityKey;
  label: string;
  unit: QuantityUnit;
  hint?: string;
  placeholder?: string;
}
export interface ChoiceFieldDef {
  kind: 'choice';
  key: ChoiceKey;
  label: string;
  options: { value: string; label: string }[];
  hint?: string;
}
export type FieldDef = QuantityFieldDef | ChoiceFieldDef;

const q = (key: QuantityKey, label: string, unit: QuantityUnit, hint?: string, placeholder?: string): QuantityFieldDef => ({
  kind: 'quantity',
  key,
  label,
  unit,
  hint,
  placeholder: placeholder && `e.g. ${placeholder}`,
});

const GROUND_LABELS: Record<(typeof GROUND_KINDS)[number], string> = {
  'clip-lead': 'Clip lead',
  spring: 'Ground spring',
  none: 'No probe ground',
};
const SIGNAL_LABELS: Record<(typeof SIGNAL_KINDS)[number], string> = {
  square: 'Square wave / clock',
  sine: 'Sine',
  pulse: 'Single edge',
  dc: 'DC level',
  other: 'Other',
};
const NOT_RECORDED = { value: '', label: 'Not recorded' };

export const SECTIONS: { id: string; title: string; fields: FieldDef[] }[] = [
  {
    id: 'probe',
    title: 'Probe',
    fields: [
      q('probe.attenuation', 'Probe attenuation', 'x', 'What the probe really divides by; on a switchable probe, its switch.', '10x'),
      q('probe.tipCapacitanceF', 'Tip capacitance', 'F', 'Data-sheet figure, probe on its scope.', '12 pF'),
      { kind: 'choice', key: 'probe.groundKind', label: 'Ground', options: [NOT_RECORDED, ...GROUND_KINDS.map((k) => ({ value: k, label: GROUND_LABELS[k] }))] },
      q('probe.groundLeadM', 'Ground lead length', 'm', 'Kit clip lead ≈ 15 cm; spring ≈ 1 cm.', '15 cm'),
      q('probe.bandwidthHz', 'Probe bandwidth', 'Hz', undefined, '200 MHz'),
    ],
  },
  {
    id: 'scope',
    title: 'Scope channel',
    fields: [
      q('scope.attenuationSetting', 'Channel attenuation setting', 'x', 'What the channel menu says.', '10x'),
      {
        kind: 'choice',
        key: 'scope.inputResistanceOhm',
        label: 'Input',
        options: [
          { value: '1000000', label: '1 MΩ (high impedance)' },
          { value: '50', label: '50 Ω' },
          NOT_RECORDED,
        ],
      },
      q('scope.inputCapacitanceF', 'Scope input capacitance', 'F', undefined, '15 pF'),
      q('scope.bandwidthHz', 'Scope bandwidth', 'Hz', undefined, '200 MHz'),
      q('scope.bandwidthLimitHz', 'Bandwidth limit filter', 'Hz', 'Blank when the filter is off.', '20 MHz'),
    ],
  },
  {
    id: 'circuit',
    title: 'Circuit',
    fields: [q('circuit.sourceResistanceOhm', 'Source resistance', 'Ω', 'Output impedance of the node probed.', '50 Ω')],
  },
  {
    id: 'signal',
    title: 'Signal',
    fields: [
      q('signal.expectedAmplitudeV', 'Expected amplitude', 'V', undefined, '3.3 V'),
      q('signal.frequencyHz', 'Signal frequency', 'Hz', 'Blank for DC or a single edge.', '1 kHz'),
      q('signal.riseTimeS', 'Signal rise time', 's', 'The edge the source really makes, 10–90 %.', '2.5 ns'),
      { kind: 'choice', key: 'signal.kind', label: 'Signal kind', options: [NOT_RECORDED, ...SIGNAL_KINDS.map((k) => ({ value: k, label: SIGNAL_LABELS[k] }))] },
    ],
  },
  {
    id: 'observed',
    title: 'What the scope showed',
    fields: [
      q('observed.amplitudeV', 'Observed amplitude', 'V', undefined, '330 mV'),
      q('observed.riseTimeS', 'Observed rise time', 's', undefined, '4 ns'),
      q('observed.overshootPct', 'Observed overshoot', '%', 'Negative for undershoot or rounded corners.', '12 %'),
      q('observed.ringingFrequencyHz', 'Observed ringing frequency', 'Hz', undefined, '120 MHz'),
    ],
  },
];

export const FIELDS: FieldDef[] = SECTIONS.flatMap((s) => s.fields);
export const FIELD_BY_KEY = Object.fromEntries(FIELDS.map((f) => [f.key, f])) as Record<FieldKey, FieldDef>;

export const BLANK_VALUES: DiagnoseValues = Object.fromEntries(FIELDS.map((f) => [f.key, ''])) as DiagnoseValues;

/** A first visit: the usual 10x probe on a 1 MΩ, 200 MHz channel, nothing else recorded. */
export const DEFAULT_VALUES: DiagnoseValues = {
  ...BLANK_VALUES,
  'probe.attenuation': '10x',
  'scope.attenuationSetting': '10x',
  'scope.inputResistanceOhm': '1000000',
  'scope.bandwidthHz': '200 MHz',
};
