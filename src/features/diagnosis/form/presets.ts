import type { DiagnoseValues } from './diagnose-fields';

export interface DiagnosePreset {
  /** Used in links: `/diagnose?preset=<id>`. */
  id: string;
  label: string;
  /** Fields to fill; every other field is cleared. Demo numbers, not measurements. */
  values: Partial<DiagnoseValues>;
}

const tenXOnFast = {
  'probe.attenuation': '10x',
  'scope.attenuationSetting': '10x',
  'scope.inputResistanceOhm': '1000000',
  'scope.bandwidthHz': '200 MHz',
} satisfies Partial<DiagnoseValues>;

/** Example setups that fill the form: each shows one way a measurement lies. */
export const PRESETS: DiagnosePreset[] = [
  {
    id: 'ten-x-read-at-one-x',
    label: '10x probe, channel at 1x',
    values: {
      ...tenXOnFast,
      'scope.attenuationSetting': '1x',
      'signal.expectedAmplitudeV': '3.3 V',
      'signal.frequencyHz': '1 kHz',
      'observed.amplitudeV': '330 mV',
    },
  },
  {
    id: 'passive-probe-into-50-ohm',
    label: 'Passive probe into 50 Ω',
    values: {
      ...tenXOnFast,
      'scope.inputResistanceOhm': '50',
      'circuit.sourceResistanceOhm': '50 Ω',
      'signal.expectedAmplitudeV': '5 V',
      'signal.frequencyHz': '10 MHz',
      'signal.kind': 'square',
      'observed.amplitudeV': '280 µV',
    },
  },
  {
    id: 'long-ground-clip',
    label: 'Long ground clip on a fast edge',
    values: {
      ...tenXOnFast,
      'probe.tipCapacitanceF': '12 pF',
      'probe.groundKind': 'clip-lead',
      'probe.groundLeadM': '15 cm',
      'probe.bandwidthHz': '500 MHz',
      'scope.bandwidthHz': '500 MHz',
      'circuit.sourceResistanceOhm': '33 Ω',
      'signal.expectedAmplitudeV': '3.3 V',
      'signal.frequencyHz': '10 MHz',
      'signal.riseTimeS': '1 ns',
      'signal.kind': 'square',
      'observed.amplitudeV': '3.3 V',
      'observed.overshootPct': '60 %',
      'observed.ringingFrequencyHz': '105 MHz',
    },
  },
  {
    id: 'one-x-on-high-impedance',
    label: '1x probe on a 1 MΩ node',
    values: {
      ...tenXOnFast,
      'probe.attenuation': '1x',
      'scope.attenuationSetting': '1x',
      'circuit.sourceResistanceOhm': '1 MΩ',
      'signal.expectedAmplitudeV': '2 V',
      'observed.amplitudeV': '1 V',
    },
  },
  {
    id: 'trimmer-out-of-adjustment',
    label: 'Trimmer out of adjustment',
    values: {
      ...tenXOnFast,
      'signal.expectedAmplitudeV': '3 V',
      'signal.frequencyHz': '1 kHz',
      'signal.kind': 'square',
      'observed.amplitudeV': '3 V',
      'observed.overshootPct': '15 %',
    },
  },
];
