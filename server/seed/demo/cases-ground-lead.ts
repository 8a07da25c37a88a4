import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const fetSetup = {
  probe: { ...PROBES.p03, groundKind: 'spring' as const, groundLeadM: 0.01 },
  scope: { ...SCOPES.sc02, attenuationSetting: 10 },
  circuit: { sourceResistanceOhm: 10, nodeDescription: 'Balancing FET Q21 gate' },
  signal: { expectedAmplitudeV: 10, frequencyHz: 1e3, riseTimeS: 20e-9, kind: 'square' as const },
  observed: { ringingFrequencyHz: 40e6, overshootPct: 25 },
};

export const GROUND_LEAD_CASES: DemoCase[] = [
  {
    key: 'gl-buck-ring',
    author: 'mateo.brennan',
    createdAt: t('06-09 15:30'),
    title: 'Buck switch node rings at 110 MHz — it was the 15 cm ground clip',
    summary: 'The 12 V buck switch node of the LS-48 auxiliary supply showed 66 % overshoot and 110 MHz ringing; with a ground spring it was clean.',
    narrative: `Aux supply of the LS-48 (12 V in, 400 kHz buck). Switch node shows a nasty **66 % overshoot** on every rising edge with ringing at **~110 MHz** that is still there 150 ns later.

I was sure we needed a snubber and had already ordered an RC snubber kit. Before fitting it Rhys asked me to repeat the measurement with the ground spring instead of the clip lead.

With the spring: overshoot about 8 %, ringing at a much higher frequency and gone in a few ns. The 66 % was the probe.

A 15 cm lead is roughly 190 nH; with the probe's 11 pF that resonates at

\`\`\`
f = 1 / (2π √(L·C)) = 1 / (2π √(190 nH × 11 pF)) ≈ 110 MHz
\`\`\`

and a 5 Ω source hardly damps it (ζ ≈ 0.02). The snubber kit went back on the shelf.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 5, nodeDescription: 'Aux buck switch node, L4 pad' },
      signal: { expectedAmplitudeV: 12, frequencyHz: 400e3, riseTimeS: 3e-9, kind: 'square' },
      observed: { ringingFrequencyHz: 110e6, overshootPct: 66, amplitudeV: 12, description: '66 % overshoot, 110 MHz ringing' },
    },
    statedCause: 'ground-lead',
    fix: 'Use the ground spring on the probe tip, or solder a probe socket next to the switch node.',
    lessonSummary: 'Fast edges: use the ground spring, never the 15 cm clip lead.',
    lessonDetail: 'The clip lead and the tip capacitance form a series LC near 100 MHz; any edge faster than a few ns rings it.',
    tags: ['switch-node', 'larkspan', 'ringing', 'buck'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('06-09 16:00'), do: 'submit' },
      { at: t('06-10 08:45'), do: 'comment', by: 'rhys.tanaka', body: 'Measured it myself with the spring for comparison: 8 % overshoot. I attach nothing because Mateo\'s capture says it all.' },
      { at: t('06-10 09:00'), do: 'verify', by: 'rhys.tanaka', note: 'Engine infers a 15 cm lead from the ringing frequency, which is what was used. Verified.' },
      { at: t('06-10 09:01'), do: 'pin', by: 'rhys.tanaka' },
    ],
  },
  {
    key: 'gl-spi-spring',
    author: 'oskar.nwachukwu',
    createdAt: t('07-28 10:30'),
    title: 'SPI clock "ringing" disappears with a ground spring',
    summary: 'A 10 MHz SPI clock showed 55 % overshoot and 110 MHz ringing with the clip lead; the spring removed it.',
    narrative: 'Second time I fell for this (see the buck case). SCK overshoot **55 %**, ringing ~110 MHz. Spring on: clean. Filing it with my capture because the SPI case is the one firmware people will search for.',
    setup: {
      probe: { ...PROBES.p03, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 33 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 10e6, riseTimeS: 1.5e-9, kind: 'square' },
      observed: { ringingFrequencyHz: 110e6, overshootPct: 55 },
    },
    statedCause: 'ground-lead',
    fix: 'Ground spring.',
    lessonSummary: 'Ringing near 100 MHz with a clip lead is the lead until proven otherwise.',
    tags: ['spi', 'wrenmoor', 'ringing'],
    attach: ['capture'],
    steps: [
      { at: t('07-28 10:40'), do: 'submit' },
      { at: t('07-29 09:10'), do: 'verify', by: 'lucia.varga' },
    ],
  },
  {
    key: 'gl-taped-lead',
    author: 'aoife.renner',
    createdAt: t('09-01 13:00'),
    title: 'Ringing frequency moves when the ground clip moves',
    summary: 'The LS-48 phase node rang at 88 MHz with 50 % overshoot; the ground lead had been extended with tape and wire.',
    narrative: `Validation of the LS-48 phase node at 24 V. Ringing at **88 MHz**, overshoot **50 %**, and the ringing frequency *changed* when I moved the ground clip around — which no circuit resonance would do.

I had not written down the lead length because I did not think it mattered. The engine infers about **22 cm** of lead from the 88 MHz (11 pF needs ~300 nH; a straight 0.5 mm wire reaches that at 22 cm). Looking at the probe: someone had extended the clip lead with a piece of wire and tape to reach the heatsink ground. Measured it: 22 cm.

Lesson for me: if the ringing moves when you move the lead, it is the lead.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'clip-lead' },
      scope: { ...SCOPES.sc04, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 8, nodeDescription: 'Phase B output, 24 V test bus' },
      signal: { expectedAmplitudeV: 24, frequencyHz: 20e3, riseTimeS: 5e-9, kind: 'square' },
      observed: { ringingFrequencyHz: 88e6, overshootPct: 50 },
    },
    statedCause: 'ground-lead',
    fix: 'Removed the extension; ground at the phase node with a spring. The ringing moved above 500 MHz and dropped to a few percent.',
    lessonSummary: 'If the ringing changes when you move the ground lead, the ringing is the lead.',
    tags: ['larkspan', 'ringing', 'phase-node'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('09-01 13:20'), do: 'submit' },
      { at: t('09-02 10:00'), do: 'comment', by: 'rhys.tanaka', body: 'Found two more "extended" leads in the drawer. They are in the bin now.' },
      { at: t('09-02 10:15'), do: 'verify', by: 'rhys.tanaka', note: 'Engine\'s implied 22 cm against 22 cm measured: verified.' },
    ],
  },
  {
    key: 'gl-pa-supply',
    author: 'engineer',
    createdAt: t('10-13 11:20'),
    title: 'Radio PA supply shows 80 % overshoot at turn-on',
    summary: 'The SN-2 PA supply switch showed 80 % overshoot and ringing near 110 MHz with the clip lead.',
    narrative: `PA supply load switch turn-on, 3.0 V, edge ~2 ns. Overshoot **80 %**, ringing ~110 MHz. With the 15 cm lead.

Pretty sure this is the ground lead again (110 MHz, same as the buck case) but I have not yet repeated it with a spring because the board has no room for one near the switch. Will solder a probe socket on board 7.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc01, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 6 },
      signal: { expectedAmplitudeV: 3, frequencyHz: 1e3, riseTimeS: 2e-9, kind: 'square' },
      observed: { ringingFrequencyHz: 110e6, overshootPct: 80, amplitudeV: 3 },
    },
    statedCause: 'ground-lead',
    tags: ['skerrynode', 'radio', 'ringing'],
    attach: ['capture'],
    steps: [{ at: t('10-13 11:40'), do: 'submit' }],
  },
  {
    key: 'gl-fet-spring',
    author: 'sunniva.dahl',
    createdAt: t('10-30 14:00'),
    title: 'Balancing FET gate rings at 40 MHz',
    summary: 'The cell-balancing FET gate of the CV-12 showed 25 % overshoot ringing at 40 MHz.',
    narrative: 'Gate of Q21 rings at 40 MHz with 25 % overshoot. I used the ground spring. Ground lead problem?',
    setup: fetSetup,
    statedCause: 'ground-lead',
    tags: ['cindervale', 'ringing', 'gate-drive'],
    steps: [
      { at: t('10-30 14:10'), do: 'submit' },
      {
        at: t('10-31 09:30'),
        do: 'send_back',
        by: 'moderator',
        note: 'With a 1 cm spring and 11 pF the lead resonance is far above 500 MHz; to ring at 40 MHz the engine needs almost 90 cm of lead. Either the ground was not the spring, or this ringing is in the circuit (the gate loop itself). Please check which ground you used, attach the capture, and measure the gate loop with the spring again.',
      },
    ],
  },
  {
    key: 'gl-draft-long-lead',
    author: 'kwabena.osei',
    createdAt: t('11-25 11:00'),
    title: 'Ringing on the portable scope with the 30 cm lead',
    summary: 'Draft: 70 MHz ringing on a customer unit with the long ground lead of the field kit.',
    narrative: 'The field kit only has the 30 cm lead. Ringing ~70 MHz. Need a spring in the field kit — write up later.',
    setup: {
      probe: { attenuation: 10, groundKind: 'clip-lead', groundLeadM: 0.3 },
      scope: { attenuationSetting: 10, bandwidthHz: 500e6 },
      circuit: { sourceResistanceOhm: 10 },
      signal: { expectedAmplitudeV: 5, frequencyHz: 1e6, riseTimeS: 2e-9, kind: 'square' },
      observed: { ringingFrequencyHz: 70e6 },
    },
    statedCause: 'ground-lead',
    tags: ['field-service', 'ringing'],
    steps: [],
  },
];
