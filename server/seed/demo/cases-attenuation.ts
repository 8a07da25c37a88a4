import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const busSetup = {
  probe: { ...PROBES.p22, groundKind: 'clip-lead' as const, groundLeadM: 0.15 },
  scope: { ...SCOPES.sc03, attenuationSetting: 10 },
  signal: { expectedAmplitudeV: 340, kind: 'dc' as const },
  observed: { amplitudeV: 34 },
};

export const ATTENUATION_CASES: DemoCase[] = [
  {
    key: 'att-3v3-rail',
    author: 'engineer',
    createdAt: t('05-19 10:05'),
    title: 'SN-2 3V3 rail reads 330 mV — channel left at 1x',
    summary: 'The 3.3 V rail of a Skerrynode SN-2 showed 330 mV; the 10x probe was on a channel still set to 1x.',
    narrative: `Bring-up of SN-2 rev B, board #4. The regulator output looked dead on the scope: a flat line at **330 mV**.

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
    wave: { shape: 'dc', levelV: 0.33, spanS: 1e-3, noiseV: 0.003 },
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
    title: 'LS-48 gate drive shows 118 V: probe switch at 1x, channel at 10x',
    summary: 'High-side gate of the Larkspan LS-48 appeared to swing 118 V; the switchable probe was at 1x while the channel assumed 10x.',
    narrative: `Looking at Q3 gate-source on the LS-48 power stage. Driver is supplied from a 12 V bootstrap, so the gate should swing about 12 V.

The scope showed edges of **118 V**. I genuinely believed the bootstrap was pumping up and spent an hour on the bootstrap diode and the driver's UVLO, and had a replacement driver in my hand.

Rhys asked what probe it was. It is a P-17, the *switchable* one, and the slide switch was at **1x**. The scope has no way to know that; the channel was at 10x. So everything was shown ten times too large.

Side note: at 1x this probe also has only a few MHz of bandwidth, so the edges looked slow as well. Two mistakes for the price of one.`,
    setup: {
      probe: { ...PROBES.p17, attenuation: 1, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 2, nodeDescription: 'Q3 gate to source, high side, phase A' },
      signal: { expectedAmplitudeV: 12, frequencyHz: 20e3, kind: 'square' },
      observed: { amplitudeV: 118, description: '118 V square edges, slow rise' },
    },
    statedCause: 'attenuation-mismatch',
    fix: 'Slide the probe switch to 10x (or set the channel to 1x). The gate now swings 11.8 V.',
    lessonSummary: 'On a switchable probe, look at the switch itself: the scope cannot sense its position.',
    tags: ['gate-drive', 'switchable-probe', 'larkspan'],
    wave: { shape: 'edge', levelV: 118, periodS: 50e-6, timeConstantS: 26e-9, spanS: 60e-6, noiseV: 0.6 },
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('06-02 16:45'), do: 'submit' },
      { at: t('06-03 08:30'), do: 'comment', by: 'rhys.tanaka', body: 'Happens to all of us. I have asked @admin whether we can retire the switchable probes from the power bench.' },
      { at: t('06-03 09:10'), do: 'comment', by: 'admin', body: 'Agreed — the P-17s go to the firmware benches; the power bench keeps fixed 10x probes only.' },
      { at: t('06-03 11:00'), do: 'verify', by: 'rhys.tanaka', note: 'Stated cause matches the engine. Good that the slow edge is mentioned too.' },
      { at: t('06-03 11:02'), do: 'pin', by: 'rhys.tanaka' },
    ],
  },
  {
    key: 'att-3v3-dup',
    author: 'aoife.renner',
    createdAt: t('06-10 13:15'),
    title: '3.3 V rail only 330 mV on SN-2 rev C',
    summary: 'Rail measured 330 mV on the scope during rev C validation, 3.3 V on the meter.',
    narrative: 'Rev C validation, board #11. Scope says 330 mV on the 3V3 rail, meter says 3.29 V. Channel 3 of SC-02 was set to 1x with a 10x probe on it.',
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
    title: 'PB-300 DC bus reads 34 V: 100x probe on a channel set to 10x',
    summary: 'On a returned Pellbright PB-300 the rectified mains bus read 34 V instead of about 340 V; the 100x probe was on a 10x channel.',
    narrative: `Field return from a customer site, unit complained of flicker. Measured the bulk capacitor voltage to see if the PFC stage was running.

Scope showed **34 V** DC with a little 100 Hz ripple. I thought the PFC had failed and the bus was collapsing, which would explain the flicker.

But 34 V on a bus that is fed from rectified 230 V mains is impossible — even with no PFC it would sit near 325 V. The P-22 is a 100x probe; the channel was set to 10x. Factor of ten again.`,
    setup: { ...busSetup, circuit: { nodeDescription: 'Bulk capacitor C5, PFC output' } },
    statedCause: 'attenuation-mismatch',
    fix: 'Set the channel to 100x. The bus reads 338 V with 4 V of 100 Hz ripple; the PFC is fine (the flicker turned out to be the dimmer).',
    lessonSummary: 'A high-voltage probe needs its own ratio on the channel: 100x probes are not 10x probes.',
    tags: ['pellbright', 'mains', 'field-return', 'hv-probe'],
    wave: { shape: 'dc', levelV: 33.8, spanS: 40e-3, noiseV: 0.08, humV: 0.2 },
    attach: ['capture'],
    steps: [
      { at: t('08-05 16:00'), do: 'submit' },
      {
        at: t('08-06 09:20'),
        do: 'send_back',
        by: 'rhys.tanaka',
        note: 'The physics is right, but this is a mains-connected unit at 340 V. Please record that in the setup (mains connected, highest voltage) and add how the unit was powered — isolation transformer or not — so the safety caution shows.',
      },
      {
        at: t('08-06 14:05'),
        do: 'revise',
        patch: {
          setup: { ...busSetup, circuit: { nodeDescription: 'Bulk capacitor C5, PFC output', mainsConnected: true, highestVoltageV: 400 } },
          narrative: `Field return from a customer site, unit complained of flicker. Measured the bulk capacitor voltage to see if the PFC stage was running.

**Safety:** the unit was powered through the bench isolation transformer, probe P-22 (100x, rated 1000 V CAT II), ground clip on the primary-side return only, hands off while energised.

Scope showed **34 V** DC with a little 100 Hz ripple. I thought the PFC had failed and the bus was collapsing, which would explain the flicker.

But 34 V on a bus that is fed from rectified 230 V mains is impossible — even with no PFC it would sit near 325 V. The P-22 is a 100x probe; the channel was set to 10x. Factor of ten again.`,
        },
      },
      { at: t('08-06 14:10'), do: 'submit' },
      { at: t('08-07 08:45'), do: 'verify', by: 'rhys.tanaka', note: 'Thanks for the safety paragraph. Verified.' },
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
    wave: { shape: 'dc', levelV: 0.25, spanS: 2e-3, noiseV: 0.002 },
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
