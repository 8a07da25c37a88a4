import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

export const CLIPPING_CASES: DemoCase[] = [
  {
    key: 'clip-line-out',
    author: 'oskar.nwachukwu',
    createdAt: t('07-30 15:10'),
    title: 'WM-7 line output "distorts" at 0 dBFS: the trace ran off the screen',
    summary: 'A 2 V rms, 1 kHz sine from the WM-7 line output showed flat tops at ±2 V; the channel was at 0.5 V/div, so the screen only spanned ±2 V.',
    narrative: `Checking the WM-7 line output at full scale: 1 kHz, 0 dBFS, which the analyser reads as **2.0 V rms** (5.66 Vpp). On SC-02 the sine had **flat tops at +2.05 V and −2.05 V**, and the scope's FFT said 8 % distortion. I started looking at the output stage's rails.

The channel was at **0.5 V/div** with the offset at zero, eight divisions: the screen spans ±2 V, and the scope's ADC stops just past the screen's edge. Everything beyond that is simply not recorded — the capture holds flat tops because the scope could not see more, and its FFT was measuring that.

At 1 V/div: a clean 5.66 Vpp sine, 0.002 % distortion on the analyser.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'spring', groundLeadM: 0.01 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10, voltsPerDiv: 0.5, offsetV: 0, divisions: 8 },
      circuit: { sourceResistanceOhm: 100, nodeDescription: 'Line out left, J2 tip' },
      signal: { expectedAmplitudeV: 5.66, frequencyHz: 1e3, kind: 'sine' },
      observed: { amplitudeV: 4.1, clipped: true, description: 'Flat tops at ±2.05 V' },
    },
    statedCause: 'clipping',
    fix: 'Set the vertical scale so the whole signal fits with a division to spare (1 V/div here) before reading amplitude or distortion.',
    lessonSummary: 'Flat tops exactly at the screen edge are the screen, not the circuit: zoom out vertically first.',
    lessonDetail: 'The screen shows offset ± divisions/2 × V/div; the ADC records little beyond it. Amplitude, FFT and distortion measurements of a clipped trace describe the clipping.',
    tags: ['clipping', 'audio', 'wrenmoor', 'vertical-scale'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('07-30 15:30'), do: 'submit' },
      { at: t('07-31 09:40'), do: 'verify', by: 'lucia.varga', note: '±4 divisions × 0.5 V/div = ±2 V, exactly where the tops are. Verified.' },
      { at: t('07-31 10:05'), do: 'comment', by: 'oskar.nwachukwu', body: 'Also learned: the scope shows a small "clipped" marker next to the measurement. I had never noticed it.' },
    ],
  },
  {
    key: 'clip-gate-offset',
    author: 'mateo.brennan',
    createdAt: t('11-16 14:20'),
    title: 'Low-side gate only reaches 6 V?',
    summary: 'The LS-48 low-side gate drive appeared to stop at 6 V instead of 12 V, with a perfectly flat top.',
    narrative: `Low-side gate of Q4, 20 kHz. The gate rises to **6.1 V and stays perfectly flat** there. The driver is supposed to give 12 V. I set the channel to 1 V/div to see the Miller plateau and moved the trace down by 2 divisions (offset +2 V) to use the screen.

My first thought was a sagging driver supply. Then the Bench search for "flat top" found Oskar's line-out case, and a flat top *that* flat is suspicious. Filing it as clipping for review before I order new drivers; I have not yet repeated it at another scale.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'spring', groundLeadM: 0.01 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10, voltsPerDiv: 1, offsetV: 2, divisions: 8 },
      circuit: { sourceResistanceOhm: 4.7, nodeDescription: 'Q4 gate to source, low side (source on power ground)', referenceV: 0, highestVoltageV: 48 },
      signal: { expectedAmplitudeV: 12, frequencyHz: 20e3, kind: 'square' },
      observed: { amplitudeV: 6.1, clipped: true, description: 'Flat top at 6.1 V' },
    },
    statedCause: 'clipping',
    tags: ['clipping', 'larkspan', 'gate-drive'],
    attach: ['capture'],
    steps: [
      { at: t('11-16 14:35'), do: 'submit' },
      { at: t('11-17 08:40'), do: 'comment', by: 'rhys.tanaka', body: 'With 1 V/div and the centre at +2 V the screen ends at +6 V. Set 2 V/div before you order anything; I will review after that.' },
    ],
  },
];
