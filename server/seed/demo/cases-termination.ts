import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

export const TERMINATION_CASES: DemoCase[] = [
  {
    key: 'term-clock-vanish',
    author: 'aoife.renner',
    createdAt: t('06-16 09:25'),
    title: '25 MHz clock shows 0.2 mV: SC-01 input left at 50 Ω after a TDR session',
    summary: 'A 3.3 V, 25 MHz clock almost vanished on SC-01; the channel input was still at 50 Ω and a 10x passive probe was on it.',
    narrative: `Wanted a quick look at the 25 MHz reference clock on the SN-2 radio board. Used SC-01 because it was free.

The trace was a fuzzy line. Turned the volts/div all the way down: a square wave of about **0.2 mV** buried in noise. My first thought was that the oscillator was not starting — we had a batch of those in spring — so I checked the enable pin (high) and the supply (fine).

Lucía walked past and asked whether I had looked at the input impedance. The channel was at **50 Ω**, left over from her TDR measurements. A passive 10x probe is a 9 MΩ divider made for a 1 MΩ input; into 50 Ω it divides by roughly (9 MΩ + 50 Ω) / 50 Ω ≈ 180 000 instead of 10:

\`\`\`
shown = 3.3 V × 10 × 50 Ω / (9 MΩ + 50 Ω) ≈ 0.18 mV
\`\`\`

which is what I saw. Set the input to 1 MΩ: 3.3 V clean clock.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'spring', groundLeadM: 0.01 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 30, nodeDescription: 'Y2 oscillator output, R40 pad' },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 25e6, riseTimeS: 1.5e-9, kind: 'square' },
      observed: { amplitudeV: 0.0002, description: 'Noisy square wave of ~0.2 mV' },
    },
    statedCause: 'termination-mismatch',
    fix: 'Set the channel input to 1 MΩ. For fast work on the 50 Ω input, use a probe made for 50 Ω (a low-impedance divider probe or an active probe).',
    lessonSummary: 'A passive high-impedance probe needs the 1 MΩ input: check the input menu when you inherit a scope.',
    lessonDetail: 'On 50 Ω a 10x passive probe divides by about 180 000, so a logic signal shrinks to a fraction of a millivolt. The scope gives no warning.',
    tags: ['clock', 'skerrynode', '50-ohm-input'],
    wave: { shape: 'edge', levelV: 0.00018, periodS: 40e-9, timeConstantS: 0.3e-9, spanS: 200e-9, noiseV: 0.00002 },
    attach: ['screenshot', 'capture'],
    steps: [
      { at: t('06-16 10:00'), do: 'submit' },
      { at: t('06-16 10:30'), do: 'comment', by: 'lucia.varga', body: 'My fault for not resetting SC-01. I have added "inputs back to 1 MΩ" to the TDR procedure.' },
      { at: t('06-17 08:15'), do: 'verify', by: 'lucia.varga', note: 'Engine predicts 0.18 mV against 0.2 mV observed. Verified.' },
      { at: t('06-17 08:16'), do: 'pin', by: 'lucia.varga' },
    ],
  },
  {
    key: 'term-pwm-mv',
    author: 'engineer',
    createdAt: t('07-22 14:00'),
    title: 'PB-300 dimming PWM at millivolts on SC-01',
    summary: 'The 3.3 V dimming PWM on the isolated side of the Pellbright PB-300 showed as about 0.2 mV.',
    narrative: `Same trap as Aoife's clock case, different signal. The dimming PWM on the **isolated, low-voltage side** of the PB-300 (3.3 V logic, 25 kHz) read **~0.2 mV**.

I had searched the casebook for "millivolts" *after* spending twenty minutes suspecting the opto-coupler. The clock case came up first. Input was on 50 Ω.

Note: only the secondary side was probed; the primary was not touched and the unit ran from the isolation transformer anyway.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 50, nodeDescription: 'Opto-coupler U9 output, secondary side' },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 25e3, kind: 'square' },
      observed: { amplitudeV: 0.00019 },
    },
    statedCause: 'termination-mismatch',
    fix: 'Input back to 1 MΩ.',
    lessonSummary: 'Search the casebook before debugging: a tiny, clean-looking trace is often a 50 Ω input.',
    tags: ['pellbright', '50-ohm-input', 'pwm'],
    wave: { shape: 'edge', levelV: 0.00019, periodS: 40e-6, timeConstantS: 5e-9, spanS: 120e-6, noiseV: 0.000015 },
    attach: ['capture'],
    steps: [
      { at: t('07-22 14:20'), do: 'submit' },
      { at: t('07-23 09:00'), do: 'verify', by: 'moderator', note: 'Verified. Could SC-01 power up with 1 MΩ inputs by default? @admin' },
      { at: t('07-23 10:10'), do: 'comment', by: 'admin', body: 'Done: SC-01 now recalls a "bay default" setup at power-on, all inputs 1 MΩ, 10x.' },
    ],
  },
  {
    key: 'term-probe-broken',
    author: 'kwabena.osei',
    createdAt: t('08-19 12:00'),
    title: 'Probe reads almost nothing on scope C',
    summary: 'A 10x probe showed only a few millivolts of a 5 V signal; suspected a 50 Ω input.',
    narrative: 'Scope C, ch 1. 5 V square from the calibrator reads a few mV. I think the input is at 50 Ω, like the clock case.',
    setup: {
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, inputResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
      observed: { amplitudeV: 0.004 },
    },
    statedCause: 'termination-mismatch',
    tags: ['field-service'],
    steps: [
      { at: t('08-19 12:10'), do: 'submit' },
      { at: t('08-19 16:45'), do: 'comment', by: 'lucia.varga', body: 'Scope C has no 50 Ω input at all — it is a 1 MΩ-only scope. Can you check the probe with an ohmmeter, tip to BNC centre?' },
      { at: t('08-20 08:30'), do: 'comment', by: 'kwabena.osei', body: 'Open circuit. The cable is broken just behind the tip. Probe binned.' },
      { at: t('08-20 09:00'), do: 'retire', by: 'lucia.varga', note: 'Not a termination problem: the probe cable was broken (open tip conductor). Retired; a probe continuity check is on the bench checklist.' },
    ],
  },
  {
    key: 'term-i2s-40uv',
    author: 'oskar.nwachukwu',
    createdAt: t('11-12 15:30'),
    title: 'I²S bit clock reads 40 µV on SC-01',
    summary: 'The 3.07 MHz I²S bit clock of the WM-7 codec showed 40 µV, on a 50 Ω input with a passive probe.',
    narrative: `Yes, this again. Bit clock (3.072 MHz, 1.8 V logic) showed **40 µV**.

| What | Value |
|---|---|
| probe | P-03, 10x passive |
| input | 50 Ω (found afterwards) |
| expected | 1.8 V |
| shown | ~40 µV |

Engine's prediction is about 0.1 mV; I read 40 µV off a very noisy trace so I would not trust my number to better than a factor of 2.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10, inputResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 1.8, frequencyHz: 3.072e6, kind: 'square' },
      observed: { amplitudeV: 0.00004 },
    },
    statedCause: 'termination-mismatch',
    fix: 'Input back to 1 MΩ.',
    lessonSummary: 'Reset the input impedance after any 50 Ω work.',
    tags: ['audio', 'wrenmoor', '50-ohm-input'],
    steps: [
      { at: t('11-12 15:45'), do: 'submit' },
      { at: t('11-13 09:30'), do: 'comment', by: 'moderator', body: 'Three of these now. I will look at whether the "bay default" recall can run on every scope, not only SC-01.' },
    ],
  },
  {
    key: 'term-cell-tap',
    author: 'sunniva.dahl',
    createdAt: t('11-27 16:40'),
    title: 'Cell tap voltage tiny on SC-01',
    summary: 'Cell 3 tap of the CV-12 harness showed millivolts instead of about 3.7 V.',
    narrative: 'Draft. Need to re-check the input setting tomorrow before I file this properly.',
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10, inputResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 3.7, kind: 'dc' },
      observed: { amplitudeV: 0.0002 },
    },
    statedCause: 'termination-mismatch',
    tags: ['cindervale'],
    steps: [],
  },
];
