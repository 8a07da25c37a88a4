import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

export const GENERATOR_LOAD_CASES: DemoCase[] = [
  {
    key: 'gen-double',
    author: 'sunniva.dahl',
    createdAt: t('09-17 13:30'),
    title: 'Filter input shows 2 Vpp where the generator says 1 Vpp',
    summary: 'The bench generator, set to 1 Vpp, put 1.98 Vpp on the CV-12 filter input (100 kΩ): its amplitude setting assumed a 50 Ω load.',
    narrative: `Measuring the CV-12 anti-alias filter's gain at 10 kHz. Generator set to **1 Vpp**, scope at the filter input says **1.98 Vpp**. I suspected the probe setting, then the scope's calibration.

The generator has a 50 Ω output and its amplitude setting assumes a **50 Ω load**: it sets its internal EMF to 2 Vpp so that 1 Vpp would appear across 50 Ω. Into the filter's 100 kΩ almost the whole EMF appears:

\`\`\`
V = 2 Vpp × 100 kΩ / (100 kΩ + 50 Ω) ≈ 2.0 Vpp
\`\`\`

Setting the generator's load to "high-Z" makes its display read what the filter gets.`,
    setup: {
      probe: { ...PROBES.p03, groundKind: 'spring', groundLeadM: 0.01 },
      scope: { ...SCOPES.sc02, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 50, loadResistanceOhm: 100e3, nodeDescription: 'CV-12 filter input J5' },
      signal: { expectedAmplitudeV: 1, frequencyHz: 10e3, kind: 'sine', generatorLoad: '50-ohm' },
      observed: { amplitudeV: 1.98 },
    },
    statedCause: 'generator-load',
    fix: 'Set the generator\'s load setting to match what it drives (high-Z here), or measure the amplitude at the load and trust that.',
    lessonSummary: 'A generator\'s amplitude is for the load it assumes: set for 50 Ω into a high impedance it gives double.',
    tags: ['function-generator', 'cindervale', 'filter'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('09-17 13:50'), do: 'submit' },
      { at: t('09-18 08:40'), do: 'verify', by: 'moderator', note: 'EMF 2 Vpp behind 50 Ω into 100 kΩ: 1.998 Vpp. Verified.' },
    ],
  },
  {
    key: 'gen-half-50',
    author: 'aoife.renner',
    createdAt: t('11-28 15:20'),
    title: 'Generator into SC-01\'s 50 Ω input shows half',
    summary: 'Draft: 2 Vpp set on the generator, 1 Vpp on SC-01 with the cable straight into the 50 Ω input.',
    narrative: 'Cable straight from the generator into SC-01, input at 50 Ω (correct for a cable). Reads half of the setting. The generator was in high-Z mode from Sunniva\'s filter work: set for high-Z into 50 Ω it shows ½. Write up after lunch.',
    setup: {
      probe: { model: '50 Ω coaxial cable, 1 m', attenuation: 1, nominalAttenuation: 1 },
      scope: { ...SCOPES.sc01, attenuationSetting: 1, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 50, loadResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 2, frequencyHz: 1e6, kind: 'sine', generatorLoad: 'high-z' },
      observed: { amplitudeV: 1 },
    },
    statedCause: 'generator-load',
    tags: ['function-generator', '50-ohm-input'],
    steps: [],
  },
];
