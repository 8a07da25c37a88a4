import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

export const OTHER_CASES: DemoCase[] = [
  {
    key: 'other-usb-hum',
    author: 'oskar.nwachukwu',
    createdAt: t('07-01 10:00'),
    title: '50 Hz hum on every channel — ground loop through the laptop charger',
    summary: 'All channels showed 80 mVpp of 50 Hz hum while the WM-7 was connected to a laptop on its charger.',
    narrative: `Measuring the WM-7 noise floor. Every channel, even with the probe tip on the board's ground, shows **80 mVpp at 50 Hz**.

I blamed the scope (SC-02 was just back from calibration), then the bench supply. Unplugging things one by one: the hum disappears when the **laptop charger** is unplugged. The laptop's USB ground, the scope's protective earth and the charger's Y-capacitor leakage made a loop.

| Configuration | Hum |
|---|---|
| laptop on charger, USB connected | 80 mVpp |
| laptop on battery | < 2 mVpp |
| charger in, USB isolator fitted | < 2 mVpp |`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 0.002, kind: 'dc' },
      observed: { amplitudeV: 0.08, description: '80 mVpp, 50 Hz, on every channel' },
    },
    statedCause: 'other',
    statedCauseOther: 'Ground loop through the USB host and its charger',
    fix: 'USB isolator between laptop and DUT for noise measurements, or run the laptop on battery.',
    lessonSummary: 'Hum on every channel at mains frequency: look for a ground loop before blaming the circuit.',
    tags: ['ground-loop', 'wrenmoor', 'audio', 'hum'],
    wave: { shape: 'dc', levelV: 0, spanS: 60e-3, noiseV: 0.002, humV: 0.04 },
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('07-01 10:20'), do: 'submit' },
      { at: t('07-02 09:00'), do: 'verify', by: 'lucia.varga', note: 'Outside the engine\'s six causes, and well documented. Verified as "other".' },
    ],
  },
  {
    key: 'other-floating-scope',
    author: 'kwabena.osei',
    createdAt: t('08-24 09:15'),
    title: 'Do not float the scope: the RCD tripped while probing the PB-300 primary',
    summary: 'Lifting the scope\'s earth to probe a mains-referenced node of the Pellbright PB-300 tripped the RCD; the right tool was a differential probe.',
    narrative: `**Read the safety note at the end before repeating anything here.**

I needed the voltage across the PFC MOSFET of a PB-300, which sits on the mains-referenced primary. The ground clip of a passive probe is tied to protective earth through the scope, so clipping it to the primary return shorted that node to earth — the **RCD tripped** at once. Nobody was hurt; the unit and probe survived.

My first instinct (I admit it) was to float the scope with an earth-lift adapter. Tomasz stopped me: a floating scope puts the chassis, the BNC shells and every other probe ground at mains potential.

What we did instead: a **high-voltage differential probe** (rated 1000 V CAT II), unit on the isolation transformer, scope properly earthed.

**Safety:** mains-connected equipment, up to 400 V on the PFC bus. Never float a scope. Use a differential or isolated probe rated for the voltage and measurement category, check the probe's derating with frequency, and follow local codes and licensed practice.`,
    setup: {
      probe: { model: 'HV differential probe, 1000 V CAT II, 100x', attenuation: 100, nominalAttenuation: 100 },
      scope: { ...SCOPES.sc03, attenuationSetting: 100 },
      circuit: { nodeDescription: 'PFC MOSFET drain-source, primary side', mainsConnected: true, highestVoltageV: 400 },
      signal: { expectedAmplitudeV: 650, frequencyHz: 50, kind: 'sine' },
      observed: { amplitudeV: 650, description: 'With the differential probe: rectified-mains envelope as expected' },
    },
    statedCause: 'other',
    statedCauseOther: 'Passive probe ground clipped to a mains-referenced node (earthed through the scope)',
    fix: 'Differential probe rated for the voltage; scope stays earthed; unit on the isolation transformer.',
    lessonSummary: 'Never clip a passive probe ground to a mains-referenced node, and never float the scope: use a differential probe.',
    lessonDetail: 'Above 30 V rms, 42.4 V peak or 60 V DC, or anywhere on mains-connected equipment, use differential or isolated probing rated for the voltage and category.',
    tags: ['safety', 'mains', 'pellbright', 'differential-probe'],
    wave: { shape: 'sine', amplitudeV: 650, frequencyHz: 50, spanS: 60e-3, noiseV: 2 },
    attach: ['screenshot', 'capture'],
    steps: [
      { at: t('08-24 09:40'), do: 'submit' },
      { at: t('08-24 13:00'), do: 'comment', by: 'admin', body: 'Earth-lift adapters have been removed from the lab. The differential probe now lives on the mains bench with a tag on it.' },
      { at: t('08-25 08:30'), do: 'verify', by: 'rhys.tanaka', note: 'Safety note present and correct. Verified as "other"; pinned for the checklist.' },
      { at: t('08-25 08:31'), do: 'pin', by: 'rhys.tanaka' },
    ],
  },
  {
    key: 'other-aliasing',
    author: 'aoife.renner',
    createdAt: t('10-22 16:00'),
    title: '1 MHz PWM shows up as a 2 kHz wave at 10 ms/div',
    summary: 'At a slow timebase the 1 MHz LED PWM of the PB-300 appeared as a clean 2 kHz wave: the sample rate had dropped below the signal frequency.',
    narrative: `Zoomed out to 10 ms/div to look at the dimming envelope and saw a beautiful **2 kHz** square wave that does not exist in the design.

At that timebase the scope's memory depth gave a sample rate of only 1.002 MS/s — just above the 1 MHz PWM — so the PWM aliased down to the difference frequency. With peak-detect acquisition the real envelope appeared.

Not one of the engine's six causes, hence "other".`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e6, kind: 'square' },
      observed: { amplitudeV: 3.3, description: 'A 2 kHz wave that is not in the design' },
    },
    statedCause: 'other',
    statedCauseOther: 'Aliasing: sample rate too low at a slow timebase',
    fix: 'Peak-detect acquisition, or more memory depth so the sample rate stays well above the signal.',
    lessonSummary: 'A clean waveform that should not exist at a slow timebase: check the sample rate.',
    tags: ['aliasing', 'pellbright', 'sample-rate'],
    steps: [
      { at: t('10-22 16:20'), do: 'submit' },
      { at: t('10-23 10:00'), do: 'comment', by: 'moderator', body: 'Could you add a screenshot of the 2 kHz alias and of the peak-detect view? Then it is ready.' },
    ],
  },
  {
    key: 'other-averaging-runt',
    author: 'sunniva.dahl',
    createdAt: t('11-20 10:30'),
    title: 'Averaging hid a runt pulse',
    summary: 'Draft: with 64× averaging a runt pulse on the CV-12 alert line was invisible.',
    narrative: `Notes:
- alert line occasionally triggers the host interrupt
- with averaging on, the line looks perfect
- single-shot trigger on a runt found a 1.2 V pulse, 40 ns wide

To do: find what causes the runt. The measurement lesson is: averaging only shows what repeats.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 3.3, kind: 'pulse' },
    },
    statedCause: 'other',
    statedCauseOther: 'Acquisition averaging hides events that do not repeat',
    tags: ['cindervale', 'acquisition'],
    steps: [],
  },
];
