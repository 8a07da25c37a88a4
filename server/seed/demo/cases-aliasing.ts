import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const boostSetup = {
  probe: { ...PROBES.p03, groundKind: 'spring' as const, groundLeadM: 0.01 },
  scope: { ...SCOPES.sc02, attenuationSetting: 10, sampleRateHz: 2.5e6 },
  circuit: { nodeDescription: 'Boost converter switch node, L7 pad' },
  signal: { expectedAmplitudeV: 5, frequencyHz: 2.45e6, kind: 'pulse' as const },
  observed: { amplitudeV: 5, frequencyHz: 50e3, description: 'A clean 50 kHz pulse train at 100 µs/div' },
};

export const ALIASING_CASES: DemoCase[] = [
  {
    key: 'alias-pwm-2khz',
    author: 'aoife.renner',
    createdAt: t('10-22 16:00'),
    title: '1 MHz LED PWM shows up as a 2 kHz wave at 250 µs/div',
    summary: 'At a slow timebase the ~1 MHz LED PWM of the PB-300 appeared as a clean 2 kHz wave: 2,500 points over 2.5 ms is 1 MS/s, below the signal frequency.',
    narrative: `Zoomed out to 250 µs/div to look at the dimming envelope and saw a beautiful **2 kHz** pulse train, 30 % duty, that does not exist in the design.

The record length was set to 2,500 points, so across 2.5 ms the scope sampled at only **1 MS/s**. The PWM oscillator runs at 1.002 MHz (its RC trim is 0.2 % fast), so each sample lands a little later in the PWM cycle than the one before, and the samples trace out the PWM at the difference frequency:

\`\`\`
f_alias = |f − k·f_s| = |1.002 MHz − 1 × 1 MS/s| = 2 kHz
\`\`\`

Changing the timebase to 200 µs/div moved the "signal" to a different frequency — the giveaway. With peak-detect acquisition the real envelope appeared.`,
    setup: {
      probe: { ...PROBES.p03 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10, sampleRateHz: 1e6 },
      circuit: { nodeDescription: 'LED driver PWM, secondary side', mainsConnected: true, mainsFrequencyHz: 50, highestVoltageV: 400, referenceV: 0 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 1.002e6, kind: 'square' },
      observed: { amplitudeV: 3.3, frequencyHz: 2e3, description: 'A 2 kHz wave that is not in the design' },
    },
    statedCause: 'aliasing',
    fix: 'Peak-detect acquisition, or more memory depth so the sample rate stays well above the signal (at least 2.5× its highest frequency of interest).',
    lessonSummary: 'A clean waveform that should not exist at a slow timebase: check the sample rate, then change the timebase and see if it moves.',
    lessonDetail: 'A signal above half the sample rate shows at |f − k·f_s|. The sample rate is record length ÷ time span, so it falls as you zoom out.',
    tags: ['aliasing', 'pellbright', 'sample-rate'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('10-22 16:20'), do: 'submit' },
      { at: t('10-23 10:00'), do: 'comment', by: 'moderator', body: 'Could you add the record length and sample rate to the setup? Then it is ready.' },
      { at: t('10-23 14:30'), do: 'comment', by: 'aoife.renner', body: 'Added: 2,500 points over 2.5 ms, 1 MS/s.' },
      { at: t('10-24 09:15'), do: 'verify', by: 'moderator', note: '|1.002 MHz − 1 MS/s| = 2 kHz, as captured. Verified.' },
    ],
  },
  {
    key: 'alias-boost-50k',
    author: 'oskar.nwachukwu',
    createdAt: t('11-10 11:30'),
    title: 'WM-7 boost converter "runs at 50 kHz"',
    summary: 'The WM-7 headphone boost converter appeared to switch at 50 kHz instead of 2.45 MHz on a long capture.',
    narrative: `I took a 1 ms capture of the boost converter's switch node to look at start-up, and the converter switches at **50 kHz**, not the 2.45 MHz of its data sheet. I suspect the controller drops into a burst mode at light load.`,
    setup: boostSetup,
    statedCause: 'aliasing',
    tags: ['aliasing', 'wrenmoor', 'sample-rate', 'boost'],
    attach: ['capture'],
    steps: [
      { at: t('11-10 11:45'), do: 'submit' },
      {
        at: t('11-11 09:20'),
        do: 'send_back',
        by: 'lucia.varga',
        note: 'Your capture has 2,500 points over 1 ms: 2.5 MS/s. A 2.45 MHz switch node read at 2.5 MS/s shows at |2.45 − 2.5| MHz = 50 kHz, so the stated cause is right — but the write-up still says burst mode. Please rewrite it as the aliasing case it is, and add a capture at 10 ns/div (or with peak detect) that shows the real switching.',
      },
    ],
  },
];
