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

/** A 3.3 V, 1 ns clock probed through a 15 cm clip lead (the ground-lead and combined presets). */
const clipLeadOnFast = {
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
      ...clipLeadOnFast,
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
  {
    id: 'consistent-setup',
    label: 'Consistent setup',
    // everything recorded and the trace what the chain predicts: the engine should call it true
    values: {
      ...tenXOnFast,
      'probe.tipCapacitanceF': '9.5 pF',
      'probe.groundKind': 'spring',
      'probe.groundLeadM': '1 cm',
      'probe.bandwidthHz': '500 MHz',
      'scope.bandwidthHz': '500 MHz',
      'circuit.sourceResistanceOhm': '33 Ω',
      'signal.expectedAmplitudeV': '3.3 V',
      'signal.frequencyHz': '10 MHz',
      'signal.riseTimeS': '2 ns',
      'signal.kind': 'square',
      'observed.amplitudeV': '3.3 V',
      'observed.riseTimeS': '2.2 ns',
      'observed.frequencyHz': '10 MHz',
    },
  },
  {
    id: 'ten-x-at-one-x-long-lead',
    label: '10x read at 1x on a 15 cm lead',
    values: {
      ...clipLeadOnFast,
      'scope.attenuationSetting': '1x',
      'observed.amplitudeV': '330 mV',
      'observed.overshootPct': '60 %',
      'observed.ringingFrequencyHz': '105 MHz',
    },
  },
  {
    id: 'slow-sample-rate',
    label: 'Clock on a long timebase',
    // 8 MHz sampled at 2.5 MSa/s: the nearest multiple is 7.5 MHz, so the screen shows 500 kHz
    values: {
      ...tenXOnFast,
      'scope.sampleRateHz': '2.5 MSa/s',
      'signal.expectedAmplitudeV': '3.3 V',
      'signal.frequencyHz': '8 MHz',
      'signal.kind': 'square',
      'observed.amplitudeV': '3.3 V',
      'observed.frequencyHz': '500 kHz',
    },
  },
  {
    id: 'trace-off-screen',
    label: 'Trace beyond the screen',
    // 500 mV/div over 8 divisions shows −2 V to +2 V: a 0–5 V square loses its top 3 V
    values: {
      ...tenXOnFast,
      'scope.voltsPerDiv': '500 mV/div',
      'scope.offsetV': '0 V',
      'scope.divisions': '8',
      'signal.expectedAmplitudeV': '5 V',
      'signal.baseV': '0 V',
      'signal.frequencyHz': '100 kHz',
      'signal.kind': 'square',
      'observed.amplitudeV': '2 V',
      'observed.clipped': 'true',
    },
  },
  {
    id: 'ac-coupled-square',
    label: 'AC-coupled slow square',
    // 1x probe, 10 Hz corner: τ ≈ 15.9 ms, a 100 Hz square droops by tanh(T/4τ) ≈ 16 %
    values: {
      ...tenXOnFast,
      'probe.attenuation': '1x',
      'scope.attenuationSetting': '1x',
      'scope.coupling': 'ac',
      'scope.acCornerHz': '10 Hz',
      'circuit.sourceResistanceOhm': '50 Ω',
      'signal.expectedAmplitudeV': '3.3 V',
      'signal.frequencyHz': '100 Hz',
      'signal.kind': 'square',
      'observed.amplitudeV': '3.3 V',
      'observed.tiltPct': '16 %',
    },
  },
  {
    id: 'shunt-on-a-48-v-rail',
    label: 'Shunt on a 48 V rail',
    // 40 dB of rejection passes 1 % of the 48 V the reference swings: 0.48 V on a 100 mV reading
    values: {
      ...tenXOnFast,
      'probe.kind': 'differential',
      'probe.cmrrDb': '40 dB',
      'probe.attenuation': '10x',
      'circuit.referenceV': '48 V',
      'circuit.highestVoltageV': '48 V',
      'signal.expectedAmplitudeV': '100 mV',
      'signal.frequencyHz': '100 kHz',
      'signal.kind': 'square',
      'observed.amplitudeV': '580 mV',
    },
  },
  {
    id: 'hum-on-a-sensor',
    label: 'Hum on a sensor line',
    // the 1 kHz signal reads right; a 50 Hz line rides on it (the amplitude is the signal's, the hum is extra)
    values: {
      ...tenXOnFast,
      'circuit.sourceResistanceOhm': '10 kΩ',
      'circuit.mainsConnected': 'true',
      'circuit.mainsFrequencyHz': '50 Hz',
      'signal.expectedAmplitudeV': '20 mV',
      'signal.frequencyHz': '1 kHz',
      'signal.kind': 'sine',
      'observed.amplitudeV': '20 mV',
      'observed.frequencyHz': '1 kHz',
      'observed.humFrequencyHz': '50 Hz',
    },
  },
  {
    id: 'generator-set-for-50-ohm',
    label: 'Generator set for 50 Ω into 1 MΩ',
    // set for 50 Ω, the generator's EMF is twice the set amplitude; a 1 MΩ input shows all of it
    values: {
      'probe.attenuation': '1x',
      'scope.attenuationSetting': '1x',
      'scope.inputResistanceOhm': '1000000',
      'scope.bandwidthHz': '200 MHz',
      'circuit.sourceResistanceOhm': '50 Ω',
      'circuit.loadResistanceOhm': '1 MΩ',
      'signal.generatorLoad': '50-ohm',
      'signal.expectedAmplitudeV': '1 V',
      'signal.frequencyHz': '1 MHz',
      'signal.kind': 'sine',
      'observed.amplitudeV': '2 V',
    },
  },
];
