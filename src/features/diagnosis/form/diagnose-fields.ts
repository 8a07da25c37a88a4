import { COUPLINGS, GENERATOR_LOADS, GROUND_KINDS, PROBE_KINDS, SIGNAL_KINDS } from '../../../../shared/schemas/diagnosis';
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
  'observed.frequencyHz',
  'observed.tiltPct',
  'observed.humFrequencyHz',
  'scope.sampleRateHz',
  'scope.voltsPerDiv',
  'scope.offsetV',
  'scope.divisions',
  'scope.acCornerHz',
  'scope.riseTimeS',
  'probe.cmrrDb',
  'circuit.referenceV',
  'circuit.highestVoltageV',
  'circuit.mainsFrequencyHz',
  'circuit.loadResistanceOhm',
  'signal.baseV',
] as const;
export const CHOICE_KEYS = [
  'probe.groundKind',
  'scope.inputResistanceOhm',
  'signal.kind',
  'observed.clipped',
  'scope.coupling',
  'probe.kind',
  'circuit.mainsConnected',
  'signal.generatorLoad',
] as const;

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
  /** How the chosen option goes into the request: a number, a yes/no, or the option itself. */
  reads?: 'number' | 'boolean';
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
const PROBE_KIND_LABELS: Record<(typeof PROBE_KINDS)[number], string> = {
  passive: 'Passive',
  active: 'Active (FET)',
  differential: 'Differential',
  current: 'Current probe',
};
const GENERATOR_LABELS: Record<(typeof GENERATOR_LOADS)[number], string> = { '50-ohm': 'Set for a 50 Ω load', 'high-z': 'Set for high impedance' };
const yesNo = (key: ChoiceKey, label: string, yes: string, no: string, hint?: string): ChoiceFieldDef => ({
  kind: 'choice',
  key,
  label,
  reads: 'boolean',
  hint,
  options: [NOT_RECORDED, { value: 'true', label: yes }, { value: 'false', label: no }],
});

export interface SectionDef {
  id: string;
  title: string;
  fields: FieldDef[];
  /** Folded until opened (or until one of its fields holds a value); the lead says what is inside. */
  collapsible?: { lead: string };
}

export const SECTIONS: SectionDef[] = [
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
        reads: 'number',
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
      q('observed.frequencyHz', 'Observed frequency', 'Hz', 'The repetition rate the scope showed.', '1 MHz'),
      q('observed.tiltPct', 'Observed tilt', '%', 'Droop across a flat top, % of the step.', '12 %'),
      q('observed.humFrequencyHz', 'Observed hum frequency', 'Hz', undefined, '50 Hz'),
      yesNo('observed.clipped', 'Clipped at the screen edge', 'Yes: tops or bottoms cut off', 'No: the whole trace on screen'),
    ],
  },
  {
    id: 'acquisition',
    title: 'Acquisition',
    collapsible: { lead: 'sample rate, vertical scale, coupling, rise time' },
    fields: [
      q('scope.sampleRateHz', 'Sample rate', 'Sa/s', 'What the scope really sampled at this timebase.', '1 GSa/s'),
      q('scope.voltsPerDiv', 'Vertical scale', 'V/div', undefined, '500 mV/div'),
      q('scope.offsetV', 'Offset', 'V', "Input voltage at the screen's centre line.", '0 V'),
      q('scope.divisions', 'Vertical divisions', '#', 'Blank for the usual 8.', '8'),
      { kind: 'choice', key: 'scope.coupling', label: 'Coupling', options: [NOT_RECORDED, ...COUPLINGS.map((k) => ({ value: k, label: k.toUpperCase() }))] },
      q('scope.acCornerHz', 'AC-coupling corner', 'Hz', 'Data-sheet figure with a low-impedance source.', '10 Hz'),
      q('scope.riseTimeS', 'Scope rise time', 's', 'Only when the data sheet gives one.', '1.2 ns'),
    ],
  },
  {
    id: 'grounding',
    title: 'Grounding and reference',
    collapsible: { lead: 'probe kind, CMRR, reference node, voltages, mains' },
    fields: [
      { kind: 'choice', key: 'probe.kind', label: 'Probe kind', options: [NOT_RECORDED, ...PROBE_KINDS.map((k) => ({ value: k, label: PROBE_KIND_LABELS[k] }))] },
      q('probe.cmrrDb', 'Probe CMRR', 'dB', "A differential probe's rejection at the signal frequency.", '60 dB'),
      q('circuit.referenceV', 'Reference node voltage', 'V', "Peak voltage from earth of the node the probe's ground or reference is on.", '0 V'),
      q('circuit.highestVoltageV', 'Highest voltage present', 'V', 'Anywhere a probe or lead could touch.', '12 V'),
      yesNo('circuit.mainsConnected', 'Mains connected', 'Yes', 'No', 'The equipment under test runs from the mains.'),
      q('circuit.mainsFrequencyHz', 'Mains frequency', 'Hz', undefined, '50 Hz'),
    ],
  },
  {
    id: 'source',
    title: 'Source',
    collapsible: { lead: 'what the source drives, generator setting, low level' },
    fields: [
      q('circuit.loadResistanceOhm', 'Load resistance', 'Ω', 'What the source really drives.', '1 MΩ'),
      {
        kind: 'choice',
        key: 'signal.generatorLoad',
        label: 'Generator load setting',
        hint: "The load the generator's amplitude setting assumes.",
        options: [NOT_RECORDED, ...GENERATOR_LOADS.map((k) => ({ value: k, label: GENERATOR_LABELS[k] }))],
      },
      q('signal.baseV', 'Signal low level', 'V', 'Blank for 0 V (a sine: −A/2).', '0 V'),
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
