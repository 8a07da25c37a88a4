import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

export const OTHER_CASES: DemoCase[] = [
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
