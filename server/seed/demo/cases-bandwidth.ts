import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

export const BANDWIDTH_CASES: DemoCase[] = [
  {
    key: 'bw-limit-on',
    author: 'aoife.renner',
    createdAt: t('06-24 10:00'),
    title: 'Edge "measures" 17 ns: the 20 MHz bandwidth limit was on',
    summary: 'A 2 ns logic edge measured 16.9 ns on the power-bench scope because the channel\'s 20 MHz limit filter was switched on.',
    narrative: `Rise-time check of the SN-2 SPI clock for the validation report. Spec: < 5 ns. Measured: **16.9 ns** on SC-04.

I was about to write it up as a failure and ask for a stronger driver. Then I noticed the little "BW" marker next to the channel number: the **20 MHz bandwidth limit** was on — the power team uses it to tame switching noise.

Rise times add roughly in quadrature, and a 20 MHz single pole alone has t_r ≈ 0.35 / 20 MHz = 17.5 ns:

| Stage | Bandwidth | t_r |
|---|---|---|
| signal | — | 2 ns |
| probe P-03 | 500 MHz | 0.7 ns |
| scope SC-04 | 500 MHz | 0.7 ns |
| limit filter | 20 MHz | 17.5 ns |
| **total** | | **17.6 ns** |

The measured 16.9 ns is a little under the 17.6 ns sum because a 10 MHz square gives a 20 MHz pole only six time constants per half period: the tops barely settle (3.25 V), and the 90 % point comes early.

With the limit off: 2.2 ns. Pass.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'spring', groundLeadM: 0.01 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10, bandwidthLimitOn: true, bandwidthLimitHz: 20e6 },
      circuit: { sourceResistanceOhm: 25 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 10e6, riseTimeS: 2e-9, kind: 'square' },
      observed: { riseTimeS: 16.9e-9, amplitudeV: 3.25 },
    },
    statedCause: 'bandwidth',
    fix: 'Switch the bandwidth limit off for edge measurements; note its state in every rise-time report.',
    lessonSummary: 'Check the bandwidth-limit indicator before measuring any edge.',
    lessonDetail: 't_r ≈ 0.35 / BW for each stage, added in quadrature: a 20 MHz limit alone makes every edge at least 17.5 ns.',
    tags: ['rise-time', 'bandwidth-limit', 'skerrynode'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('06-24 10:30'), do: 'submit' },
      { at: t('06-24 15:00'), do: 'comment', by: 'rhys.tanaka', body: 'Guilty — we leave the limit on for the switch-node ripple. I will put a label on SC-04.' },
      { at: t('06-25 08:30'), do: 'verify', by: 'lucia.varga', note: 'Engine predicts 17.6 ns against 16.9 ns measured. The stage table is a model for others.' },
      { at: t('06-25 08:31'), do: 'pin', by: 'lucia.varga' },
    ],
  },
  {
    key: 'bw-1x-spi',
    author: 'oskar.nwachukwu',
    createdAt: t('07-14 16:10'),
    title: 'SPI clock edges 60 ns slow with the probe at 1x',
    summary: 'A 2 MHz SPI clock with 3 ns edges showed 60 ns rise times; the switchable probe was at 1x (a few MHz of bandwidth).',
    narrative: `Debugging a flaky SPI flash on the WM-7. The clock edges looked terrible — **60 ns** rise, almost a sine. I suspected the level shifter and even ordered a faster one.

The probe was a P-17 at **1x**. At 1x its cable's resistive conductor (about 250 Ω) and its ~100 pF make a single pole near 6 MHz: 0.35 / 6 MHz ≈ 58 ns, right on what I saw. At 10x: 3.4 ns.

The flash problem was a firmware timing bug, not the edges.`,
    setup: {
      probe: { ...PROBES.p17, attenuation: 1 },
      scope: { ...SCOPES.sc02, attenuationSetting: 1 },
      circuit: { sourceResistanceOhm: 25, nodeDescription: 'SPI SCK at flash U3' },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 2e6, riseTimeS: 3e-9, kind: 'square' },
      observed: { riseTimeS: 60e-9, amplitudeV: 3.29 },
    },
    statedCause: 'bandwidth',
    fix: 'Use the probe at 10x for anything with edges.',
    lessonSummary: '1x probes have a few MHz of bandwidth: never judge an edge at 1x.',
    tags: ['spi', 'wrenmoor', '1x-probe', 'rise-time'],
    attach: ['capture'],
    steps: [
      { at: t('07-14 16:30'), do: 'submit' },
      { at: t('07-15 09:45'), do: 'verify', by: 'moderator', note: 'Verified; the engine agrees. Cancel the level-shifter order?' },
      { at: t('07-15 10:00'), do: 'comment', by: 'oskar.nwachukwu', body: 'Cancelled.' },
    ],
  },
  {
    key: 'bw-gan-100mhz',
    author: 'mateo.brennan',
    createdAt: t('08-26 11:15'),
    title: 'GaN half-bridge edge reads 3.7 ns on scope B; the real edge is about 1 ns',
    summary: 'The 48 V switch node of the LS-48 GaN prototype measured 3.7 ns on the 100 MHz scope; the device switches in about 1 ns.',
    narrative: `We are evaluating a GaN half-bridge for the next LS-48. The vendor data and the double-pulse test on the SI bench say the switch node slews in about **1 ns**.

On scope B (100 MHz) I measured **3.7 ns** and concluded the gate resistor was too large. Halved it: no change on the screen, which was the clue.

\`\`\`
t_scope  = 0.35 / 100 MHz  = 3.5 ns
t_probe  = 0.35 / 500 MHz  = 0.7 ns
t_shown  = √(1.0² + 0.7² + 3.5²) ns ≈ 3.7 ns
\`\`\`

The scope was measuring itself. A rule of thumb I now keep: the system should be 3–5× faster than the edge you want to see.

The case shows the safety caution: 48 V pulses are above the app's own conservative warning threshold (IEC 61010-1:2010, 6.3.1 puts hazardous live at 33 V rms, 46.7 V peak or 70 V DC in normal conditions), and the bus can source a lot of current. Spring ground on power ground (at earth on this bench), no clip leads near the bridge, bus off before moving the probe.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'spring', groundLeadM: 0.01 },
      scope: { ...SCOPES.sc03, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 1, nodeDescription: 'Half-bridge switch node, GaN prototype; spring ground on power ground', highestVoltageV: 48, referenceV: 0, mainsConnected: false },
      signal: { expectedAmplitudeV: 48, riseTimeS: 1e-9, kind: 'pulse' },
      observed: { riseTimeS: 3.7e-9, amplitudeV: 48 },
    },
    statedCause: 'bandwidth',
    fix: 'Measure GaN edges on SC-01 (1 GHz) with a spring ground; report the measurement system\'s rise time next to every edge.',
    lessonSummary: 'The scope must be 3–5× faster than the edge, or it measures itself.',
    tags: ['gan', 'larkspan', 'rise-time', 'switch-node'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('08-26 11:40'), do: 'submit' },
      { at: t('08-26 17:20'), do: 'comment', by: 'lucia.varga', body: 'On SC-01 with the spring I get 1.2 ns, consistent with your 1 ns plus 0.5 ns of system.' },
      { at: t('08-27 09:00'), do: 'verify', by: 'rhys.tanaka', note: 'Textbook quadrature example. Verified.' },
    ],
  },
  {
    key: 'bw-radio-spi',
    author: 'engineer',
    createdAt: t('11-18 13:40'),
    title: 'Radio SPI rise time fails at the board edge — and rings',
    summary: 'The 8 MHz SPI clock to the SN-2 radio measured 2.0 ns (limit 1.5 ns) with 60 % overshoot ringing at 110 MHz, on the 200 MHz bench scope with the clip lead.',
    narrative: `Compliance check for the radio module: SCK rise time at the module pins must be < 1.5 ns. Measured **2.0 ns** on SC-02 with the P-03, and every edge overshoots by about **60 %**, ringing at **110 MHz**.

I think the rise time is mostly the scope: 0.35 / 200 MHz = 1.75 ns on its own. The ringing looks like the 15 cm clip lead (110 MHz, same as the buck case). Probably both at once. Will repeat on SC-01 with a spring.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 22 },
      signal: { expectedAmplitudeV: 1.8, frequencyHz: 8e6, riseTimeS: 1e-9, kind: 'square' },
      observed: { riseTimeS: 2.0e-9, overshootPct: 61, ringingFrequencyHz: 110e6, amplitudeV: 1.82 },
    },
    statedCause: 'bandwidth',
    tags: ['spi', 'skerrynode', 'rise-time'],
    attach: ['capture'],
    steps: [
      { at: t('11-18 14:00'), do: 'submit' },
      { at: t('11-19 10:20'), do: 'comment', by: 'lucia.varga', body: '@engineer please add the SC-01 repeat before I review; I would like the case to show both numbers.' },
      { at: t('11-19 11:05'), do: 'comment', by: 'engineer', body: 'SC-01 with spring: 1.3 ns. Will update the write-up tomorrow.' },
    ],
  },
  {
    key: 'bw-usb-draft',
    author: 'aoife.renner',
    createdAt: t('11-29 15:00'),
    title: 'USB full-speed edges on the 200 MHz scope',
    summary: 'Draft: are USB full-speed edges (4–20 ns) trustworthy on SC-02?',
    narrative: 'Probably fine: 1.75 ns system rise vs ≥ 4 ns edges. Writing this down so nobody worries about it again.',
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 3.3, riseTimeS: 4e-9, kind: 'pulse' },
      observed: { riseTimeS: 4.4e-9 },
    },
    statedCause: 'bandwidth',
    tags: ['usb', 'rise-time'],
    steps: [],
  },
  {
    key: 'bw-open-drain',
    author: 'sunniva.dahl',
    createdAt: t('09-08 09:30'),
    title: 'I²C edges 300 ns: scope too slow?',
    summary: 'The CV-12 I²C clock showed 300 ns rise times; filed as a bandwidth problem.',
    narrative: 'The I²C clock rises in **300 ns**. I assumed the scope or probe was too slow.',
    setup: {
      probe: { attenuation: 10, bandwidthHz: 200e6 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 400e3, kind: 'square' },
      observed: { riseTimeS: 300e-9 },
    },
    statedCause: 'bandwidth',
    tags: ['i2c', 'cindervale'],
    steps: [
      { at: t('09-08 09:45'), do: 'submit' },
      {
        at: t('09-08 14:00'),
        do: 'retire',
        by: 'lucia.varga',
        note: 'Not a measurement error: a 200 MHz system rises in under 2 ns, so 300 ns is the real edge. I²C is open-drain; the rise time is the pull-up (4.7 kΩ) charging the bus capacitance. Real, and within the 400 kHz spec. Retired.',
      },
      { at: t('09-08 14:30'), do: 'comment', by: 'sunniva.dahl', body: 'Thanks, that makes sense. I learned more from this than from the data sheet.' },
    ],
  },
];
