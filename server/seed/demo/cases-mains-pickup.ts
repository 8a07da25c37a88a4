import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const electrodeSetup = {
  probe: { ...PROBES.p03 },
  scope: { ...SCOPES.sc02, attenuationSetting: 10 },
  circuit: { sourceResistanceOhm: 20e6, nodeDescription: 'Electrode input J3, before the buffer' },
  // the electrode's own 0.41 V; the probe's 10 MΩ against its 20 MΩ keeps a third (see the loading case)
  signal: { expectedAmplitudeV: 0.41, kind: 'dc' as const },
  observed: { amplitudeV: 0.137, humFrequencyHz: 50, description: '0.137 V with about 80 mVpp of 50 Hz on it' },
};

export const MAINS_PICKUP_CASES: DemoCase[] = [
  {
    key: 'hum-usb-loop',
    author: 'oskar.nwachukwu',
    createdAt: t('07-01 10:00'),
    title: '50 Hz hum on every channel — ground loop through the laptop charger',
    summary: 'All channels showed about 80 mVpp of 50 Hz hum while the WM-7 was connected by USB to a laptop on its earthed charger.',
    narrative: `Measuring the WM-7 noise floor. Every channel, even with the probe tip on the board's own ground, shows **about 80 mVpp at 50 Hz** (with some 150 Hz in it).

I blamed the scope (SC-02 was just back from calibration), then the bench supply. Unplugging things one by one: the hum disappears when the **laptop charger** is unplugged. The charger is earthed at a socket across the room; the two sockets' earths differ by about 0.1 V at 50 Hz. Laptop USB shield → WM-7 ground → probe shield → scope → protective earth closed the loop, and the loop current through the probe's shield shows up as a voltage at the tip.

| Configuration | Hum |
|---|---|
| laptop on charger, USB connected | 80 mVpp |
| laptop on battery | < 2 mVpp |
| charger in, USB isolator fitted | < 2 mVpp |`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      circuit: { nodeDescription: 'WM-7 analogue ground, probe tip shorted to it', mainsFrequencyHz: 50 },
      signal: { expectedAmplitudeV: 0.002, kind: 'dc' },
      observed: { amplitudeV: 0.08, humFrequencyHz: 50, description: '80 mVpp, 50 Hz, on every channel' },
    },
    statedCause: 'mains-pickup',
    fix: 'USB isolator between laptop and DUT for noise measurements, or run the laptop on battery; one earth point for the bench.',
    lessonSummary: 'Hum at mains frequency on every channel, even with the tip on ground: look for a ground loop before blaming the circuit.',
    tags: ['ground-loop', 'wrenmoor', 'audio', 'hum'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('07-01 10:20'), do: 'submit' },
      { at: t('07-02 09:00'), do: 'verify', by: 'lucia.varga', note: 'Tip on ground still shows it, and it goes with the loop: a ground loop at mains frequency. Verified.' },
    ],
  },
  {
    key: 'hum-electrode',
    author: 'aoife.renner',
    createdAt: t('10-09 10:10'),
    title: 'Electrode front end: 80 mVpp of 50 Hz on a 0.14 V level',
    summary: 'The high-impedance electrode input of the SN-2 soil fixture showed 50 Hz hum riding on its level when the bench lamp was on.',
    narrative: `Same fixture as my loading case. Besides the low level (the probe's 10 MΩ against the electrode's 20 MΩ), the trace carries about **80 mVpp of 50 Hz**. It grows when I move the bench lamp's cord closer and disappears with the lamp unplugged.`,
    setup: electrodeSetup,
    statedCause: 'mains-pickup',
    tags: ['hum', 'skerrynode', 'high-impedance', 'fixture'],
    attach: ['capture'],
    steps: [
      { at: t('10-09 10:30'), do: 'submit' },
      {
        at: t('10-10 08:50'),
        do: 'send_back',
        by: 'lucia.varga',
        note: 'Right cause: a twentieth of a picofarad from a 230 V cord into a node of a few MΩ is tens of millivolts. Please record the mains frequency in the setup, describe where the cord was, and add the repeat with the fixture in its shielded box so the case shows the fix.',
      },
    ],
  },
  {
    key: 'hum-real-ripple',
    author: 'oskar.nwachukwu',
    createdAt: t('09-03 11:00'),
    title: 'Hum on the WM-7 headphone output only',
    summary: 'Filed as mains pickup: the headphone output carried 100 Hz hum that the line output did not.',
    narrative: 'Headphone output shows 12 mVpp of hum, line output is clean, same probe and scope. Pickup in the headphone cable?',
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      circuit: { mainsFrequencyHz: 50 },
      signal: { expectedAmplitudeV: 0.001, kind: 'dc' },
      observed: { amplitudeV: 0.012, humFrequencyHz: 100 },
    },
    statedCause: 'mains-pickup',
    tags: ['hum', 'wrenmoor', 'audio'],
    steps: [
      { at: t('09-03 11:15'), do: 'submit' },
      {
        at: t('09-04 09:30'),
        do: 'retire',
        by: 'lucia.varga',
        note: 'Not a measurement error: the hum is at 100 Hz, twice the mains, on one output only, with the same probe and ground that show nothing on the other output. That is rectifier ripple reaching the headphone amplifier\'s supply, a circuit fault (filed on the WM-7 tracker). Retired.',
      },
    ],
  },
];
