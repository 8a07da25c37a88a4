import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const biasSetup = {
  probe: { ...PROBES.p03 },
  scope: { ...SCOPES.sc02, attenuationSetting: 10 },
  signal: { expectedAmplitudeV: 2.5, kind: 'dc' as const },
  observed: { amplitudeV: 2.38, description: 'Steady 2.38 V' },
};

export const LOADING_CASES: DemoCase[] = [
  {
    key: 'load-rc-osc',
    author: 'engineer',
    createdAt: t('05-27 13:45'),
    title: 'RC timing node drops to a third under a 1x probe',
    summary: 'A 100 kHz sine at a 47 kΩ timing node of the SN-2 wake-up oscillator read 0.39 V instead of 1.2 V with a 1x probe.',
    narrative: `The wake-up oscillator on the SN-2 uses a plain RC timing network; the node swings about **1.2 Vpp** at 100 kHz according to the simulation.

I probed it with the P-17 set to 1x (I wanted the sensitivity) and saw **0.39 Vpp**. I was convinced the comparator's hysteresis was wrong and spent the morning in the data sheet.

At 1x the probe is roughly 100 pF of cable and input hanging on a node that is driven through 47 kΩ:

\`\`\`
f_c = 1 / (2π · 47 kΩ · 100 pF) ≈ 34 kHz
|H(100 kHz)| ≈ 0.32   →  1.2 V × 0.32 ≈ 0.38 V
\`\`\`

With the switch at 10x (about 11 pF) the node reads 1.15 Vpp and the oscillator runs at its design frequency.`,
    setup: {
      probe: { ...PROBES.p17, attenuation: 1 },
      scope: { ...SCOPES.sc02, attenuationSetting: 1 },
      circuit: { sourceResistanceOhm: 47e3, nodeDescription: 'R12/C9 timing node, comparator U4 input' },
      signal: { expectedAmplitudeV: 1.2, frequencyHz: 100e3, kind: 'sine' },
      observed: { amplitudeV: 0.39, description: '0.39 Vpp where 1.2 Vpp was simulated' },
    },
    statedCause: 'loading',
    fix: 'Probe high-impedance nodes at 10x (≈ 11 pF), or buffer them; never 1x on an RC node.',
    lessonSummary: 'A 1x probe is about 100 pF: it loads any node above a few kΩ at audio frequencies and up.',
    tags: ['oscillator', 'skerrynode', '1x-probe'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('05-27 14:10'), do: 'submit' },
      { at: t('05-28 09:30'), do: 'verify', by: 'lucia.varga', note: 'Engine predicts 0.38 V, observed 0.39 V. Nicely argued.' },
      { at: t('05-28 09:31'), do: 'pin', by: 'lucia.varga' },
    ],
  },
  {
    key: 'load-bias-divider',
    author: 'sunniva.dahl',
    createdAt: t('07-07 10:20'),
    title: 'Mid-rail bias reads 2.38 V instead of 2.50 V',
    summary: 'A 1 MΩ / 1 MΩ divider from 5 V read 2.38 V on the scope and 2.50 V on the electrometer.',
    narrative: `The CV-12 current-sense amplifier is biased to mid-rail with two 1 MΩ resistors from 5 V (low quiescent current was the point). The scope reads **2.38 V**.

| Instrument | Input resistance | Reading |
|---|---|---|
| handheld DMM | 10 MΩ | 2.38 V |
| bench electrometer | > 10 GΩ | 2.500 V |
| scope + 10x probe | 10 MΩ | 2.38 V |

Both 10 MΩ instruments agree, which at first made me think the electrometer was wrong.`,
    setup: biasSetup,
    statedCause: 'loading',
    fix: 'Read high-impedance bias points with the electrometer or through a buffer; or account for the 10 MΩ load.',
    lessonSummary: 'A 10 MΩ probe is not infinite: on a 500 kΩ node it reads 5 % low.',
    tags: ['bias', 'cindervale', 'high-impedance'],
    attach: ['capture'],
    steps: [
      { at: t('07-07 10:40'), do: 'submit' },
      {
        at: t('07-07 16:00'),
        do: 'send_back',
        by: 'moderator',
        note: 'Good table. Please record the source impedance of the node: two 1 MΩ resistors make 500 kΩ Thevenin. Without it the engine sees a 5 % error it cannot attribute, and the case will not help the next person.',
      },
      { at: t('07-08 09:10'), do: 'revise', patch: { setup: { ...biasSetup, circuit: { sourceResistanceOhm: 500e3, nodeDescription: 'R30/R31 mid-rail divider, 1 MΩ each from 5 V' } } } },
      { at: t('07-08 09:12'), do: 'submit' },
      { at: t('07-09 08:40'), do: 'verify', by: 'rhys.tanaka', note: 'With the 500 kΩ recorded the engine agrees. Verified.' },
      { at: t('07-09 13:30'), do: 'comment', by: 'engineer', body: 'The same thing bit me on the SN-2 battery divider. 10 MΩ / (10 MΩ + 500 kΩ) = 0.952 — exactly your 2.38 V.' },
    ],
  },
  {
    key: 'load-xtal',
    author: 'oskar.nwachukwu',
    createdAt: t('08-12 11:00'),
    title: '32.768 kHz crystal collapses when probed at 1x',
    summary: 'The RTC crystal of the WM-7 fell to 0.7 Vpp and then stopped when the 1x probe touched the output pin.',
    narrative: `RTC drifting on two units, so I looked at the crystal. Touched XOUT with the probe at 1x: amplitude **fell from ~1.6 Vpp to 0.7 Vpp** and after a second or two the oscillation stopped completely.

I first blamed the load capacitors (we changed supplier in July). The engine suggests plain loading: 100 pF of 1x probe against the ~100 kΩ output of the inverter stage.

Re-measured with the 10x probe on XIN side through a 1 pF coupling: runs at 32.7681 kHz, amplitude normal. The drift turned out to be the crystal batch after all — separate case to follow.`,
    setup: {
      probe: { ...PROBES.p17, attenuation: 1 },
      scope: { ...SCOPES.sc02, attenuationSetting: 1 },
      circuit: { sourceResistanceOhm: 100e3, nodeDescription: 'RTC crystal XOUT' },
      signal: { expectedAmplitudeV: 1.6, frequencyHz: 32768, kind: 'sine' },
      observed: { amplitudeV: 0.7 },
    },
    statedCause: 'loading',
    fix: 'Do not probe crystal pins directly; use a 10x probe at a buffered clock output or a tiny coupling capacitor.',
    lessonSummary: 'Probing a crystal pin changes the crystal circuit: measure a buffered output.',
    tags: ['crystal', 'wrenmoor', '1x-probe'],
    attach: ['capture'],
    steps: [
      { at: t('08-12 11:20'), do: 'submit' },
      { at: t('08-13 10:00'), do: 'verify', by: 'moderator' },
    ],
  },
  {
    key: 'load-ph-front-end',
    author: 'aoife.renner',
    createdAt: t('10-06 14:30'),
    title: 'Electrode front end reads a third of the simulated level',
    summary: 'The high-impedance electrode input of a test fixture read 0.137 V where 0.41 V was expected.',
    narrative: `Validation fixture for the SN-2 soil-moisture variant: the electrode is modelled as 0.41 V behind about **20 MΩ**. Scope with the 10x probe reads **0.137 V**.

10 MΩ against 20 MΩ keeps one third. I am fairly sure that is all it is, but the fixture also has a guard ring that might not be driven — please check my reasoning.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 20e6, nodeDescription: 'Electrode input J3, before the buffer' },
      signal: { expectedAmplitudeV: 0.41, kind: 'dc' },
      observed: { amplitudeV: 0.137 },
    },
    statedCause: 'loading',
    fix: 'Measure after the buffer amplifier, never at the electrode.',
    lessonSummary: 'Anything above about 1 MΩ must be measured through a buffer.',
    tags: ['high-impedance', 'skerrynode', 'fixture'],
    steps: [
      { at: t('10-06 15:00'), do: 'submit' },
      { at: t('10-07 09:15'), do: 'comment', by: 'lucia.varga', body: 'Reasoning is right. The guard ring would only matter for leakage over hours, not for this. I will verify once you attach the capture.' },
    ],
  },
  {
    key: 'load-csa-droop',
    author: 'mateo.brennan',
    createdAt: t('09-29 10:00'),
    title: 'Current-sense amp output droops 20 % when probed',
    summary: 'The LS-48 phase-current amplifier output read 1.32 V instead of 1.65 V at zero current.',
    narrative: `Zero-current offset of the current-sense amplifier should be 1.65 V (mid-rail reference). Scope shows 1.32 V. I think the probe loads it.`,
    setup: {
      probe: { ...PROBES.p17 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 0.5, nodeDescription: 'U12 output (op-amp driven)' },
      signal: { expectedAmplitudeV: 1.65, kind: 'dc' },
      observed: { amplitudeV: 1.32 },
    },
    statedCause: 'loading',
    tags: ['larkspan', 'current-sense'],
    steps: [
      { at: t('09-29 10:15'), do: 'submit' },
      {
        at: t('09-30 08:50'),
        do: 'send_back',
        by: 'rhys.tanaka',
        note: 'An op-amp output (0.5 Ω) cannot be pulled down 20 % by a 10 MΩ probe: loading predicts 1.65 V here. Please re-measure with a meter, check the reference pin itself, and attach the capture. If the reference is really 1.32 V, this is the circuit, not the measurement.',
      },
      { at: t('09-30 11:30'), do: 'comment', by: 'mateo.brennan', body: 'Fair — the meter also says 1.32 V. Looking at the reference divider now.' },
    ],
  },
  {
    key: 'load-thermistor',
    author: 'kwabena.osei',
    createdAt: t('11-26 09:00'),
    title: 'Thermistor divider reads low with the 1x probe',
    summary: 'A 50 kΩ thermistor divider read 1.57 V instead of 1.65 V on a portable scope at 1x.',
    narrative: 'Notes from site, to be cleaned up: 1x probe, 1 MΩ input → 1 MΩ load on 50 kΩ. About 5 % low. Matches.',
    setup: {
      probe: { attenuation: 1, nominalAttenuation: 10, switchable: true },
      scope: { attenuationSetting: 1, inputResistanceOhm: 1e6 },
      circuit: { sourceResistanceOhm: 50e3 },
      signal: { expectedAmplitudeV: 1.65, kind: 'dc' },
      observed: { amplitudeV: 1.57 },
    },
    statedCause: 'loading',
    tags: ['field-service', 'thermistor'],
    steps: [],
  },
];
