import { SCOPES, t } from './bench';
import type { DemoCase } from './types';

/** A BNC-to-clip cable: a 1x connection with no divider. */
const clipCable = { model: 'BNC to clip-lead cable, 1x', attenuation: 1, nominalAttenuation: 1, groundKind: 'clip-lead' as const, groundLeadM: 0.1 };

export const AC_COUPLING_CASES: DemoCase[] = [
  {
    key: 'ac-heater-pwm',
    author: 'sunniva.dahl',
    createdAt: t('08-18 10:15'),
    title: 'Balance-drive square droops 16 % per half period: channel was AC coupled',
    summary: 'A 5 V, 100 Hz test square from the CV-12 showed tops sloping down by 0.78 V and centred on zero; the SC-02 channel was AC coupled.',
    narrative: `Checking the CV-12 balance-drive test signal (a 5 V, 100 Hz square from a logic buffer) with a BNC clip cable on SC-02.

The trace sat **centred on 0 V** (−2.5 V to +2.5 V) and every flat part **sloped**: each top started at +2.9 V and sagged to +2.1 V before the next edge. I suspected the buffer's supply decoupling.

The channel was **AC coupled** — left that way from someone's ripple measurement. AC coupling is a high-pass: the data sheet gives about 10 Hz with a low-impedance source, and a plain cable leaves it there (τ = 1/(2π·10 Hz) ≈ 15.9 ms). A square wave through it loses its DC level and droops:

\`\`\`
droop = step × tanh(T / 4τ) = 5 V × tanh(10 ms / 63.7 ms) ≈ 0.78 V (15.6 %)
\`\`\`

DC coupling: a flat 0 to 5 V square.`,
    setup: {
      probe: clipCable,
      scope: { ...SCOPES.sc02, attenuationSetting: 1, coupling: 'ac', acCornerHz: 10 },
      circuit: { sourceResistanceOhm: 50, nodeDescription: 'CV-12 balance-drive test point TP11' },
      signal: { expectedAmplitudeV: 5, frequencyHz: 100, kind: 'square' },
      observed: { amplitudeV: 4.96, tiltPct: 15.6, description: 'Centred on zero; each top droops by about 0.78 V' },
    },
    statedCause: 'ac-coupling',
    fix: 'DC coupling for anything whose level or shape matters; AC coupling only to look at small ripple on a DC rail.',
    lessonSummary: 'Sloping tops and a trace centred on zero: look at the channel\'s coupling before the circuit.',
    lessonDetail: 'AC coupling is a high-pass at about 10 Hz with a low-impedance source (a 10x probe\'s 9 MΩ lowers it about tenfold). A square of period T droops by tanh(T/4τ) of its step.',
    tags: ['ac-coupling', 'cindervale', 'droop'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('08-18 10:40'), do: 'submit' },
      { at: t('08-19 09:10'), do: 'comment', by: 'lucia.varga', body: 'Worth knowing: with a 10x probe the same channel droops ten times less, because the corner moves to about 1 Hz. That is why this bites with cables and 1x probes.' },
      { at: t('08-19 09:15'), do: 'verify', by: 'lucia.varga', note: 'tanh(T/4τ) with the 10 Hz corner gives 15.6 %, as captured. Verified.' },
    ],
  },
  {
    key: 'ac-wake-draft',
    author: 'engineer',
    createdAt: t('11-30 09:40'),
    title: 'Tilted tops on the SN-2 wake-up pulse',
    summary: 'Draft: the 1 ms wake-up pulse tilts downward by about 6 %.',
    narrative: 'Filed under compensation at first, but the probe is just a BNC clip cable and channel 4 is AC coupled: a 1 ms pulse against a 10 Hz corner (τ ≈ 16 ms) droops about 1 ms / 16 ms ≈ 6 %. Repeat with DC coupling before submitting.',
    setup: {
      probe: clipCable,
      scope: { ...SCOPES.sc02, attenuationSetting: 1, coupling: 'ac', acCornerHz: 10 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 10, kind: 'pulse' },
      observed: { tiltPct: 6 },
    },
    statedCause: 'ac-coupling',
    tags: ['skerrynode', 'ac-coupling'],
    steps: [],
  },
];
