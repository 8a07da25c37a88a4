import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

export const TERMINATION_CASES: DemoCase[] = [
  {
    key: 'term-clock-vanish',
    author: 'aoife.renner',
    createdAt: t('06-16 09:25'),
    title: '25 MHz clock turns into a row of needles on SC-01: input left at 50 Ω after a TDR session',
    summary: 'A 3.3 V, 25 MHz clock showed as ±2.6 V needles at every edge with nothing flat between; the SC-01 channel was still at 50 Ω with a 10x passive probe on it.',
    narrative: `Wanted a quick look at the 25 MHz reference clock on the SN-2 radio board. Used SC-01 because it was free.

Instead of a square wave I got **a needle at every edge**: about +2.6 V on the rising edges, −2.6 V on the falling ones, each dying away within ten nanoseconds, and nothing flat in between. My first thought was a broken oscillator ringing, so I checked the enable pin (high) and the supply (fine).

Lucía walked past and asked whether I had looked at the input impedance. The channel was at **50 Ω**, left over from her TDR measurements. A 10x passive probe is R1 = 9 MΩ ∥ C1 made for 1 MΩ ∥ C2; on 50 Ω it becomes a complex divider:

\`\`\`
DC and slow signals:  50 Ω / (9 MΩ + 50 Ω)   → 1/180 000 (the flat parts vanish)
each edge:            C1 / (C1 + C2) = 12.2 pF / 122 pF ≈ 0.1
                      → 3.3 V × 0.1 × 10 (channel) ≈ 3.3 V needle on screen
decay:                50 Ω × (C1 + C2) ≈ 6 ns
\`\`\`

The 1.5 ns edge is not much faster than those 6 ns, so the needles reach about 2.6 V. Set the input to 1 MΩ: a clean 3.3 V clock.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'spring', groundLeadM: 0.01 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 30, nodeDescription: 'Y2 oscillator output, R40 pad' },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 25e6, riseTimeS: 1.5e-9, kind: 'square' },
      observed: { amplitudeV: 5.2, description: 'Needles of about ±2.6 V at each edge (5.2 V peak to peak), decaying within ~10 ns; no flat top' },
    },
    statedCause: 'termination-mismatch',
    fix: 'Set the channel input to 1 MΩ. For fast work on the 50 Ω input, use a probe made for 50 Ω (a low-impedance divider probe or an active probe).',
    lessonSummary: 'A passive high-impedance probe needs the 1 MΩ input: edges that come through as needles with nothing flat between mean a 50 Ω input.',
    lessonDetail: 'On 50 Ω a 10x passive probe divides DC by about 180 000, but each edge passes its capacitive divider C1/(C1+C2) (about a tenth) and decays with 50 Ω·(C1+C2), a few ns. Mind the 50 Ω input\'s rating too: a fast edge of a few hundred volts puts tens of volts across it.',
    tags: ['clock', 'skerrynode', '50-ohm-input'],
    attach: ['screenshot', 'capture'],
    steps: [
      { at: t('06-16 10:00'), do: 'submit' },
      { at: t('06-16 10:30'), do: 'comment', by: 'lucia.varga', body: 'My fault for not resetting SC-01. I have added "inputs back to 1 MΩ" to the TDR procedure.' },
      { at: t('06-17 08:15'), do: 'verify', by: 'lucia.varga', note: 'Needle height and decay match the capacitive divider; the DC path explains why nothing flat is left. Verified.' },
      { at: t('06-17 08:16'), do: 'pin', by: 'lucia.varga' },
    ],
  },
  {
    key: 'term-pwm-mv',
    author: 'engineer',
    createdAt: t('07-22 14:00'),
    title: 'PB-300 dimming PWM at 0.18 mV with needles at every edge on SC-01',
    summary: 'The 3.3 V dimming PWM on the isolated, low-voltage side of the Pellbright PB-300 showed as a 0.18 mV square with needles running off the screen at every edge.',
    narrative: `Same trap as Aoife's clock case, slower signal. The dimming PWM at the **digital isolator's output** (secondary side of the PB-300, 3.3 V logic, 25 kHz) read as a **0.18 mV** square at 50 µV/div, with a needle at each edge that ran off the screen.

I had searched the casebook for "millivolts" *after* spending twenty minutes suspecting the isolator. The clock case came up first. Input was on 50 Ω.

At 25 kHz the flat tops last 20 µs, long enough for the DC divider to show: 3.3 V × 10 × 50 Ω / 9 MΩ ≈ 0.18 mV. The needles are the edges coming through C1/(C1+C2), about 2 V on screen and gone in a few ns.

Note: only the secondary side was probed; the primary was not touched and the unit ran from the isolation transformer anyway.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 50, nodeDescription: 'Digital isolator U9 output, secondary side', mainsConnected: true, mainsFrequencyHz: 50, highestVoltageV: 400, referenceV: 0 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 25e3, riseTimeS: 3e-9, kind: 'square' },
      observed: { amplitudeV: 0.00018, description: '0.18 mV square; a needle off the screen at each edge' },
    },
    statedCause: 'termination-mismatch',
    fix: 'Input back to 1 MΩ.',
    lessonSummary: 'Search the casebook before debugging: a tiny square with needles at its edges is a passive probe on a 50 Ω input.',
    tags: ['pellbright', '50-ohm-input', 'pwm'],
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
    title: 'I²S bit clock: 1.8 V needles and a 0.1 mV square on SC-01',
    summary: 'The 3.07 MHz I²S bit clock of the WM-7 codec showed needles of about 1.8 V at each edge and a 0.1 mV square between them: a passive probe on a 50 Ω input.',
    narrative: `Yes, this again. Bit clock (3.072 MHz, 1.8 V logic) showed **needles of about ±1.8 V** at the edges; zoomed in between them, a square of about **0.1 mV**.

| What | Value |
|---|---|
| probe | P-03, 10x passive |
| input | 50 Ω (found afterwards) |
| expected | 1.8 V |
| flat part | ~0.1 mV (DC divider, 50 Ω / 9 MΩ) |
| needles | ~1.8 V, gone within ~10 ns (C1/(C1+C2), 50 Ω·(C1+C2)) |

I read the flat part off a very noisy trace, so I would not trust it to better than a factor of 2.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10, inputResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 1.8, frequencyHz: 3.072e6, kind: 'square' },
      observed: { amplitudeV: 0.0001, description: 'Needles of ~±1.8 V at each edge; ~0.1 mV square between them' },
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
