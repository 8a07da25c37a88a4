import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const busSetup = {
  probe: { ...PROBES.p22, groundKind: 'clip-lead' as const, groundLeadM: 0.15 },
  scope: { ...SCOPES.sc03, attenuationSetting: 10 },
  // what the bus really was, read again with the channel at 100x
  signal: { expectedAmplitudeV: 334, kind: 'dc' as const },
  observed: { amplitudeV: 33.4 },
};

export const ATTENUATION_CASES: DemoCase[] = [
  {
    key: 'att-3v3-rail',
    author: 'engineer',
    createdAt: t('05-19 10:05'),
    title: 'SN-2 3V3 rail reads 330 mV — channel left at 1x',
    summary: 'The 3.3 V rail of a Skerrynode SN-2 showed 330 mV; the 10x probe was on a channel still set to 1x.',
    narrative: `Bring-up of SN-2 rev B, board 4. The regulator output looked dead on the scope: a flat line at **330 mV**.

First guess was the LDO in foldback, so I checked the load current on the bench supply — 18 mA, normal. The radio was even advertising, which it cannot do at 330 mV.

Then I put the DMM on the same pad: 3.29 V. The scope channel was still set to **1x** from Mateo's current-shunt work that morning, and the probe on it is the 10x P-03. The display was exactly one tenth.

| Instrument | Reading |
|---|---|
| DMM | 3.29 V |
| SC-02 ch 2 (set to 1x, 10x probe) | 0.33 V |
| SC-02 ch 2 (set to 10x) | 3.30 V |`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc02, attenuationSetting: 1 },
      circuit: { sourceResistanceOhm: 0.05, nodeDescription: 'LDO output, C14 positive pad' },
      signal: { expectedAmplitudeV: 3.3, kind: 'dc' },
      observed: { amplitudeV: 0.33, description: 'Flat line at 330 mV' },
    },
    statedCause: 'attenuation-mismatch',
    fix: 'Set the channel to 10x to match the probe. The reading became 3.30 V.',
    lessonSummary: "Before the first reading, check that the channel's probe setting matches the probe on it.",
    lessonDetail: 'A round factor (10, 100) between expectation and screen is almost always a setting, not the circuit. Channels keep their setting when the probe is swapped.',
    tags: ['power-rail', 'skerrynode', 'bring-up'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('05-19 10:40'), do: 'submit' },
      { at: t('05-20 09:03'), do: 'verify', by: 'moderator', note: 'Engine agrees (exactly 1/10). Clear write-up with the DMM cross-check.' },
      { at: t('05-20 09:05'), do: 'pin', by: 'moderator' },
      { at: t('05-20 11:12'), do: 'comment', by: 'mateo.brennan', body: 'Sorry — that was my channel. I now put a sticky note on the scope when I change the probe setting.' },
    ],
  },
  {
    key: 'att-gate-118v',
    author: 'mateo.brennan',
    createdAt: t('06-02 16:20'),
    title: 'LS-48 high-side gate shows 118 V: probe switch at 1x — and a passive ground clip on the switch node',
    summary: 'The high-side gate of the LS-48 appeared to swing 118 V (switchable probe at 1x, channel at 10x); worse, the passive probe\'s ground clip sat on the switch node. The lesson is the differential probe.',
    narrative: `**Read the safety note first: this measurement should not have been made this way.**

Looking at Q3 gate-source on the LS-48 power stage (48 V bus from the bench supply). The driver runs from a 12 V bootstrap, so the gate should sit about 12 V above the source.

The scope showed edges of **118 V**. I believed the bootstrap was pumping up and spent an hour on the bootstrap diode and the driver's UVLO.

Rhys asked what probe it was. A P-17, the *switchable* one, with its slide switch at **1x**; the channel was at 10x, and the scope cannot sense the switch. So everything was shown ten times too large (the edges were slow too: at 1x this probe has only a few MHz).

Then he asked where the ground clip was. On Q3's source — **the switch node**, which jumps between 0 and 48 V every PWM cycle. A passive probe's ground is the scope's protective earth. Clipping it to the switch node tied that node to earth: the only reason nothing blew was that the bench supply happened to be floating and no other probe was on the board. With the second channel's ground on power ground, the two ground clips would have shorted the low-side switch through the scope.

**Safety:** a passive probe's ground clip is earthed through the scope, so it may only go on a node at earth potential. To look at a high-side gate, use a differential probe rated for the node's voltage (or an isolated probing system), keep the scope earthed, never float it, check the probe's voltage rating and its derating with frequency, and follow local codes and licensed practice.`,
    setup: {
      probe: { ...PROBES.p17, attenuation: 1, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10 },
      circuit: {
        sourceResistanceOhm: 2,
        nodeDescription: 'Q3 gate to source, high side, phase A; ground clip on Q3 source (the switch node)',
        referenceV: 48,
        highestVoltageV: 60,
        mainsConnected: false,
      },
      signal: { expectedAmplitudeV: 11.8, frequencyHz: 20e3, kind: 'square' },
      observed: { amplitudeV: 118, riseTimeS: 66e-9, description: '118 V square edges, slow rise' },
    },
    statedCause: 'attenuation-mismatch',
    fix: 'Repeated with a differential probe (rated 100 V, set 10x on a 10x channel) across gate and source, passive probes off the power stage: the gate swings 11.8 V above the switch node with 15 ns edges.',
    lessonSummary: 'A high-side gate is a differential measurement: use a differential probe, never a passive ground clip on the switch node — and check a switchable probe\'s switch.',
    lessonDetail: 'A passive probe\'s ground is protective earth; on a switch node it shorts that node to earth through the scope. The factor of ten was the P-17 at 1x on a 10x channel: shown = true × setting ÷ actual.',
    tags: ['gate-drive', 'switchable-probe', 'larkspan', 'safety', 'differential-probe'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('06-02 16:45'), do: 'submit' },
      { at: t('06-03 08:30'), do: 'comment', by: 'rhys.tanaka', body: 'The 118 V is the switch at 1x. The part that worries me more is the ground clip on Q3\'s source: please rewrite this around the differential probe and put the safety note at the top.' },
      { at: t('06-03 09:10'), do: 'comment', by: 'admin', body: 'The P-17s go to the firmware benches; the power bench keeps fixed 10x probes and now has two 100 V differential probes, labelled for high-side work.' },
      { at: t('06-03 11:00'), do: 'verify', by: 'rhys.tanaka', note: 'Engine agrees on the factor of ten, and flags the ground clip on a node 48 V from earth as a hazard; the safety note says what to do instead. Verified and pinned for the lesson, not the trick.' },
      { at: t('06-03 11:02'), do: 'pin', by: 'rhys.tanaka' },
    ],
  },
  {
    key: 'att-3v3-dup',
    author: 'aoife.renner',
    createdAt: t('06-10 13:15'),
    title: '3.3 V rail only 330 mV on SN-2 rev C',
    summary: 'Rail measured 330 mV on the scope during rev C validation, 3.3 V on the meter.',
    narrative: 'Rev C validation, board 11. Scope says 330 mV on the 3V3 rail, meter says 3.29 V. Channel 3 of SC-02 was set to 1x with a 10x probe on it.',
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 1 },
      signal: { expectedAmplitudeV: 3.3, kind: 'dc' },
      observed: { amplitudeV: 0.33 },
    },
    statedCause: 'attenuation-mismatch',
    fix: 'Channel set to 10x.',
    tags: ['power-rail', 'skerrynode'],
    steps: [
      { at: t('06-10 13:30'), do: 'submit' },
      { at: t('06-11 10:00'), do: 'duplicate', by: 'moderator', of: 'att-3v3-rail', note: 'Same bench, same channel, same mistake as the case Ines filed in May; please add anything new there as a comment.' },
      { at: t('06-11 10:02'), do: 'comment', by: 'aoife.renner', body: 'Fair. I searched for "330 mV" and did not find it — the Bench search now does, after the tags were added.' },
    ],
  },
  {
    key: 'att-100x-bus',
    author: 'kwabena.osei',
    createdAt: t('08-05 15:40'),
    title: 'PB-300 DC bus reads 33 V: 100x probe on a channel set to 10x',
    summary: 'On a returned Pellbright PB-300 the bus read 33.4 V: the 100x probe was on a 10x channel. Corrected, it read 334 V — the rectified mains peak, so the boost PFC was not running.',
    narrative: `Field return from a customer site, unit complained of flicker. Measured the bulk capacitor voltage to see if the PFC stage was running.

Scope showed **33.4 V** DC with about 1 V of 100 Hz ripple. I thought the bus was collapsing.

But 33 V on a bus fed from rectified 240 V mains is impossible — even with no PFC it would sit near the mains peak, about 340 V. The P-22 is a 100x probe; the channel was set to 10x. Factor of ten again.`,
    setup: { ...busSetup, circuit: { nodeDescription: 'Bulk capacitor C5, PFC output' } },
    statedCause: 'attenuation-mismatch',
    fix: 'Set the channel to 100x. The bus reads 334 V with 10 V of 100 Hz ripple, so the PFC is fine; the flicker must be the dimmer.',
    lessonSummary: 'A high-voltage probe needs its own ratio on the channel — and once the number is right, check it against what the circuit should do.',
    lessonDetail: 'Shown = true × channel setting ÷ probe ratio: 334 V × 10 ÷ 100 = 33.4 V. A boost PFC bus sits above the mains peak (typically 380–400 V); a bus at the mains peak means the boost stage is not switching.',
    tags: ['pellbright', 'mains', 'field-return', 'hv-probe', 'safety'],
    attach: ['capture'],
    steps: [
      { at: t('08-05 16:00'), do: 'submit' },
      {
        at: t('08-06 09:20'),
        do: 'send_back',
        by: 'rhys.tanaka',
        note: 'The factor of ten is right, but two things. This is a mains-connected unit with a bus near 400 V: record that in the setup (mains connected, mains frequency, highest voltage, the voltage of the node your ground clip is on) and say how the unit was powered, so the safety caution shows. And 334 V is not "fine" for a boost PFC: it regulates near 390 V, so 334 V is just the rectified peak. Was the PFC switching?',
      },
      {
        at: t('08-06 14:05'),
        do: 'revise',
        patch: {
          fix: 'Set the channel to 100x: the bus read 334 V with 10 V of 100 Hz ripple. A boost PFC holds its bus near 390 V, so 334 V (the peak of 240 V mains less two diode drops) meant the PFC was idle: its controller\'s supply capacitor had dried out. Replaced; the bus sits at 392 V and the flicker is gone.',
          setup: {
            ...busSetup,
            circuit: {
              nodeDescription: 'Bulk capacitor C5, PFC output; ground clip on the bridge negative, unit behind the isolation transformer',
              mainsConnected: true,
              mainsFrequencyHz: 50,
              highestVoltageV: 400,
              referenceV: 0,
            },
          },
          narrative: `Field return from a customer site, unit complained of flicker. Measured the bulk capacitor voltage to see if the PFC stage was running.

**Safety:** mains-connected unit, bus up to about 400 V. It was powered through the bench isolation transformer; probe P-22 (100x, rated 1000 V CAT II); its ground clip on the bridge negative only, clipped on with the unit off; hands off while energised. Behind the transformer that clip makes the bridge negative the earth reference; without the transformer it would have shorted a mains-referenced node to earth. Use a differential probe whenever you are unsure, check the probe's rating and its derating with frequency, and follow local codes and licensed practice.

Scope showed **33.4 V** DC with about 1 V of 100 Hz ripple. I thought the bus was collapsing.

But 33 V on a bus fed from rectified 240 V mains is impossible — even with no PFC it would sit near the mains peak, about 340 V. The P-22 is a 100x probe; the channel was set to 10x. Factor of ten again.

With the channel at 100x the bus read **334 V**, and I first wrote "PFC fine". Rhys pointed out that a boost PFC regulates near 390 V: 334 V is the rectified peak of 240 V mains, so the PFC was not switching at all. Its controller's VCC capacitor had dried out; with a new one the bus sits at 392 V and the flicker is gone.`,
        },
      },
      { at: t('08-06 14:10'), do: 'submit' },
      { at: t('08-07 08:45'), do: 'verify', by: 'rhys.tanaka', note: 'Factor of ten confirmed by the engine, safety fields and note present, and the real fault found. Verified.' },
    ],
  },
  {
    key: 'att-adc-ref',
    author: 'sunniva.dahl',
    createdAt: t('09-15 11:30'),
    title: 'CV-12 ADC reference shows 0.25 V instead of 2.5 V',
    summary: 'The 2.5 V reference of the Cindervale CV-12 measured 0.25 V on scope B.',
    narrative: `Checking the reference before calibrating the cell-voltage ADC. Reference should be 2.500 V.

Scope B shows 0.25 V. Meter shows 2.499 V. I think the channel is set wrong but scope B's menus are hard to read — I set it to 10x and it reads 2.50 V now.

Not sure whether the probe was a 10x or the switchable one in 10x; both would give the same here.`,
    setup: {
      probe: { attenuation: 10, nominalAttenuation: 10 },
      scope: { ...SCOPES.sc03, attenuationSetting: 1 },
      circuit: { sourceResistanceOhm: 1, nodeDescription: 'U7 REF pin' },
      signal: { expectedAmplitudeV: 2.5, kind: 'dc' },
      observed: { amplitudeV: 0.25 },
    },
    statedCause: 'attenuation-mismatch',
    fix: 'Channel 1 of scope B set to 10x.',
    lessonSummary: 'Cross-check the first reading of a new setup with a meter.',
    tags: ['cindervale', 'reference'],
    attach: ['capture'],
    steps: [
      { at: t('09-16 08:50'), do: 'submit' },
      { at: t('09-16 15:30'), do: 'comment', by: 'lucia.varga', body: 'Looks right. Can you check which probe it was before I verify? If it was a P-17, please add the switch position.' },
    ],
  },
  {
    key: 'att-field-tenth',
    author: 'kwabena.osei',
    createdAt: t('10-20 17:05'),
    title: 'Sensor supply reads a tenth of nominal on site',
    summary: 'On a customer site the 5 V sensor supply of a Skerrynode gateway read about 0.5 V.',
    narrative: 'Portable scope, customer site. 5 V sensor rail read ~0.5 V. Swapped probe and it was fine. Filing so it is recorded.',
    setup: {
      signal: { expectedAmplitudeV: 5, kind: 'dc' },
      observed: { amplitudeV: 0.5 },
    },
    statedCause: 'attenuation-mismatch',
    tags: ['field-service', 'skerrynode'],
    steps: [
      { at: t('10-20 17:10'), do: 'submit' },
      {
        at: t('10-21 09:40'),
        do: 'send_back',
        by: 'moderator',
        note: 'The engine cannot say much without the probe ratio and the channel setting: it assumed they match. Please add which probe you had (and the switch position if switchable), what the channel was set to, and the probe you swapped to.',
      },
    ],
  },
  {
    key: 'att-dac-20db',
    author: 'oskar.nwachukwu',
    createdAt: t('11-24 10:10'),
    title: 'WM-7 line output 20 dB low on the scope',
    summary: 'Wrenmoor WM-7 line out measured 20 dB below the analyser reading.',
    narrative: `Draft — still checking.

- 1 kHz sine at 0 dBFS, analyser says 2.0 Vrms at the line out
- scope shows about 0.2 Vrms
- exactly 20 dB, which smells like a 10x/1x thing again`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 1 },
      signal: { expectedAmplitudeV: 5.66, frequencyHz: 1e3, kind: 'sine' },
      observed: { amplitudeV: 0.566 },
    },
    statedCause: 'attenuation-mismatch',
    tags: ['audio', 'wrenmoor'],
    steps: [],
  },
];
