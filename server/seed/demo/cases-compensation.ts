import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const mclkSetup = {
  probe: { ...PROBES.p03 },
  scope: { ...SCOPES.sc02, attenuationSetting: 10 },
  signal: { expectedAmplitudeV: 3.3, frequencyHz: 12.288e6, kind: 'square' as const },
  observed: { overshootPct: 8, description: 'Tops not flat, first part of each half period ~8 % high' },
};

export const COMPENSATION_CASES: DemoCase[] = [
  {
    key: 'comp-scope-b-rounded',
    author: 'kwabena.osei',
    createdAt: t('06-30 14:20'),
    title: 'Square corners round off by 3 % after moving the probe to scope B',
    summary: 'A 1 kHz, 5 V square wave showed rounded corners, each edge stopping about 3 % short and creeping up over ~0.1 ms, once the probe was moved from SC-02 to scope B.',
    narrative: `Repair bench. I took the P-03 from SC-02 and used it on scope B (SC-03) to look at a 1 kHz test square from the CV-12 self-test output.

Every edge stopped about **3 % short** of the final level and then crept up to it over roughly a tenth of a millisecond. Expected 5.0 V square corners.

First guess: the self-test driver sagging under load. But the shape was a smooth exponential, and it was the same on the scope's own calibrator output. Scope B's input has more capacitance than SC-02's (20 pF vs 16 pF), and the probe's trimmer had been set on SC-02.

The probe divider is flat only when R1·C1 = R2·C2. On scope B, C2 went up by 4 pF, so the edge now jumps to less than the DC ratio:

\`\`\`
C1 = 12.2 pF, C2 = 110 pF → 114 pF
edge:   C1 / (C1 + C2) = 0.0968   settle: R2 / (R1 + R2) = 0.1
corner: 0.0968 / 0.1 − 1 ≈ −3.2 %   τ = (R1 ∥ R2)(C1 + C2) ≈ 114 µs
\`\`\`

More input capacitance under-compensates: rounded corners, never spikes.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc03, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 50, nodeDescription: 'CV-12 self-test output TP6' },
      signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
      observed: { amplitudeV: 5, overshootPct: -3, description: 'Corners about 3 % short, creeping up over ~0.1 ms' },
    },
    statedCause: 'compensation',
    fix: "Adjust the probe's compensation trimmer on scope B's calibrator until the tops are flat.",
    lessonSummary: 'Compensate the probe every time it moves to another scope or channel.',
    lessonDetail: 'The edge jumps to C1/(C1+C2) and settles to R2/(R1+R2) with τ = (R1∥R2)(C1+C2) — about 100 µs for a 10x probe, so a 1 kHz square shows it best. A scope with more input capacitance raises C2: the corners round off until the trimmer is turned.',
    tags: ['probe-compensation', 'cindervale', 'repair-bench'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('06-30 14:45'), do: 'submit' },
      { at: t('07-01 09:00'), do: 'verify', by: 'moderator', note: 'A 4 pF larger C2 gives −3.2 % by the divider; the capture shows the same. Verified.' },
      { at: t('07-01 09:01'), do: 'pin', by: 'moderator' },
      { at: t('07-02 11:30'), do: 'comment', by: 'sunniva.dahl', body: 'This helped me today — same thing on SC-04.' },
    ],
  },
  {
    key: 'comp-rounded-tops',
    author: 'sunniva.dahl',
    createdAt: t('08-03 10:50'),
    title: '1 kHz test square looks rounded: under-compensated probe',
    summary: 'The corners of a 1 kHz, 5 V square wave were rounded off by 15 % and crept up to the final level.',
    narrative: `Measured the 1 kHz square from the function generator to check a filter. Corners were **rounded**: each edge only reached about 85 % and then crept slowly up to 5 V.

My first idea was that the generator output was loaded by the filter, so I disconnected the filter: same shape. Then I tried the scope's calibrator: same shape. So it was the probe.

Turned the trimmer clockwise (on this probe that raises the high-frequency gain) until the top was flat.

| Trimmer | Corner |
|---|---|
| as found | −15 % |
| ¼ turn | −4 % |
| ⅓ turn | flat |`,
    setup: {
      probe: { attenuation: 10, nominalAttenuation: 10, model: 'P-03 10x passive, 500 MHz' },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
      observed: { amplitudeV: 5, overshootPct: -15 },
    },
    statedCause: 'compensation',
    fix: 'Adjust the compensation trimmer on the calibrator square wave until the corners are square.',
    lessonSummary: 'Rounded corners that creep up to the final level: compensate the probe before blaming the source.',
    tags: ['probe-compensation', 'function-generator'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('08-03 11:10'), do: 'submit' },
      { at: t('08-04 08:30'), do: 'comment', by: 'rhys.tanaka', body: 'Good that you checked the calibrator — that is the step most people skip.' },
      { at: t('08-04 08:35'), do: 'verify', by: 'rhys.tanaka' },
    ],
  },
  {
    key: 'comp-hall-spike',
    author: 'mateo.brennan',
    createdAt: t('10-27 15:10'),
    title: 'Hall sensor output shows a 10 % corner spike',
    summary: 'The open-collector Hall sensor output of the LS-48 (2 kHz at speed) showed 10 % spikes at the rising corners.',
    narrative: `Hall A output at 2 kHz electrical: each rising corner has a spike of about **10 %** that decays smoothly. No ringing.

I compensated the probe on SC-04's calibrator this morning, so I am not sure — but the shape is exactly compensation-like. Could the pull-up and cable capacitance do the same?`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 5, frequencyHz: 2e3, kind: 'square' },
      observed: { overshootPct: 10 },
    },
    statedCause: 'compensation',
    tags: ['larkspan', 'hall-sensor', 'probe-compensation'],
    attach: ['capture'],
    steps: [
      { at: t('10-27 15:30'), do: 'submit' },
      { at: t('10-28 09:45'), do: 'comment', by: 'moderator', body: 'Was the probe moved to another channel after compensating? The trimmer is set per input, not per scope.' },
    ],
  },
  {
    key: 'comp-mclk',
    author: 'oskar.nwachukwu',
    createdAt: t('09-22 13:00'),
    title: 'Codec MCLK tops not flat',
    summary: 'The WM-7 codec master clock showed tops about 8 % high at the start of each half period.',
    narrative: 'MCLK (12.288 MHz) tops are not flat — first part of each half period about 8 % high. Looks like over-compensation to me.',
    setup: mclkSetup,
    statedCause: 'compensation',
    tags: ['audio', 'wrenmoor', 'clock'],
    steps: [
      { at: t('09-22 13:20'), do: 'submit' },
      {
        at: t('09-23 10:00'),
        do: 'send_back',
        by: 'lucia.varga',
        note: "The probe divider's time constant is about 100 µs; at 12 MHz a half period is 40 ns, so compensation cannot show as a tilt or a bump there. What it does show is the capacitive ratio: an over-compensated probe reads the whole clock high by its corner error, with flat tops. A bump at the start of each half period is more likely ringing. Please check the probe on the 1 kHz calibrator, record what you see there, and read the clock's amplitude against 3.3 V.",
      },
      {
        at: t('09-24 16:30'),
        do: 'revise',
        patch: {
          narrative: `MCLK (12.288 MHz) tops were not flat — first part of each half period about 8 % high.

After Lucía's note: on the 1 kHz calibrator the same probe shows an **8 % corner spike** with a slow decay, so the probe *is* over-compensated. And MCLK itself read 3.56 V instead of 3.3 V: 8 % high, as she said. Re-trimmed; the calibrator is flat and MCLK reads 3.3 V. The bump at the start of each half period did not change; I will look at the ground lead next.`,
          setup: { ...mclkSetup, signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e3, kind: 'square' }, observed: { overshootPct: 8, description: 'On the 1 kHz calibrator: 8 % corner spike, slow decay' } },
        },
      },
      { at: t('09-24 16:35'), do: 'submit' },
    ],
  },
];
