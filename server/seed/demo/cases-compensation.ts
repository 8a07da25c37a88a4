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
    key: 'comp-scope-b-spike',
    author: 'kwabena.osei',
    createdAt: t('06-30 14:20'),
    title: 'Square corners spike 18 % after moving the probe to scope B',
    summary: 'A 1 kHz, 5 V square wave showed 18 % spikes at every corner decaying over ~100 µs once the probe was moved from SC-02 to scope B.',
    narrative: `Repair bench. I took the P-03 from SC-02 and used it on scope B (SC-03) to look at a 1 kHz test square from the CV-12 self-test output.

Every corner had a **spike of about 18 %** that decayed over roughly a tenth of a millisecond before the top went flat. Expected 5.0 V flat tops.

First guess: the self-test driver oscillating. But the spike was a smooth exponential, no ringing, and it was the same on the scope's own calibrator output. Scope B's input has more capacitance than SC-02's (20 pF vs 16 pF), and the probe's trimmer had been set on SC-02.

The probe divider is flat only when R1·C1 = R2·C2. On scope B, C2 went up, so the trimmer needs readjusting — it just had not been done.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc03, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 50, nodeDescription: 'CV-12 self-test output TP6' },
      signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
      observed: { amplitudeV: 5, overshootPct: 18, description: '18 % spikes at the corners, exponential decay' },
    },
    statedCause: 'compensation',
    fix: "Adjust the probe's compensation trimmer on scope B's calibrator until the tops are flat.",
    lessonSummary: 'Compensate the probe every time it moves to another scope or channel.',
    lessonDetail: 'The edge jumps to C1/(C1+C2) and settles to R2/(R1+R2) with τ = (R1∥R2)(C1+C2) — about 100 µs for a 10x probe, so a 1 kHz square shows it best.',
    tags: ['probe-compensation', 'cindervale', 'repair-bench'],
    wave: { shape: 'compensation', levelV: 5, periodS: 1e-3, overshootPct: 18, spanS: 2e-3, noiseV: 0.02 },
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('06-30 14:45'), do: 'submit' },
      { at: t('07-01 09:00'), do: 'verify', by: 'moderator', note: 'Engine infers over-compensation from the 18 % corner. Verified.' },
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
      observed: { amplitudeV: 4.95, overshootPct: -15 },
    },
    statedCause: 'compensation',
    fix: 'Adjust the compensation trimmer on the calibrator square wave until the corners are square.',
    lessonSummary: 'Rounded corners that creep up to the final level: compensate the probe before blaming the source.',
    tags: ['probe-compensation', 'function-generator'],
    wave: { shape: 'compensation', levelV: 4.95, periodS: 1e-3, overshootPct: -15, spanS: 2e-3, noiseV: 0.015 },
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
    wave: { shape: 'compensation', levelV: 5, periodS: 0.5e-3, overshootPct: 10, spanS: 1e-3, noiseV: 0.02 },
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
        note: "The probe divider's time constant is about 100 µs; at 12 MHz a half period is 40 ns, so compensation cannot show as a tilt there — it only shifts the level slightly. The engine ranks bandwidth first for this reason. Please check the probe on the 1 kHz calibrator and record what you see there; the bump at 12 MHz is more likely ringing or the edge itself.",
      },
      {
        at: t('09-24 16:30'),
        do: 'revise',
        patch: {
          narrative: `MCLK (12.288 MHz) tops were not flat — first part of each half period about 8 % high.

After Lucía's note: on the 1 kHz calibrator the same probe shows an **8 % corner spike** with a slow decay, so the probe *is* over-compensated. Re-trimmed; the calibrator is flat now. The bump on MCLK got smaller but did not go away; I will look at the ground lead next.`,
          setup: { ...mclkSetup, signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e3, kind: 'square' }, observed: { overshootPct: 8, description: 'On the 1 kHz calibrator: 8 % corner spike, slow decay' } },
        },
      },
      { at: t('09-24 16:35'), do: 'submit' },
    ],
  },
  {
    key: 'comp-draft',
    author: 'engineer',
    createdAt: t('11-30 09:40'),
    title: 'Tilted tops on the SN-2 wake-up pulse',
    summary: 'Draft: the 1 ms wake-up pulse tilts downward by a few percent.',
    narrative: 'Could be compensation or the AC coupling of channel 4. Check the coupling setting first.',
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 500, kind: 'square' },
      observed: { overshootPct: 4 },
    },
    statedCause: 'compensation',
    tags: ['skerrynode'],
    steps: [],
  },
];
