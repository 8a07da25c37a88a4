import { PROBES, SCOPES, t } from './bench';
import type { DemoCase } from './types';

const SAFETY = `**Safety:** mains-connected equipment, up to 400 V on the PFC bus, and the primary return swings to about 325 V from earth with the mains. A passive probe's ground clip is tied to protective earth through the scope: it may only go on a node at earth potential. Never float the scope. Use a differential or isolated probe rated for the voltage and measurement category, check its derating with frequency, and follow local codes and licensed practice.`;

export const COMMON_MODE_CASES: DemoCase[] = [
  {
    key: 'cm-floating-scope',
    author: 'kwabena.osei',
    createdAt: t('08-24 09:15'),
    title: 'Do not float the scope: the RCD tripped when a passive ground clip touched the PB-300 primary',
    summary: 'Clipping a passive probe\'s ground to the mains-referenced primary return of the Pellbright PB-300 tripped the RCD; the right tool was a differential probe, which showed the 400 V drain pulses cleanly.',
    narrative: `**Read the safety note at the end before repeating anything here.**

I needed the drain-source voltage of the PFC MOSFET in a PB-300: pulses from 0 to the 400 V bus at 65 kHz. The MOSFET's source is the primary return, which is referenced to the mains, not to earth: through the bridge it swings down to about −325 V from earth every other half cycle.

The ground clip of a passive probe is tied to protective earth through the scope, so clipping it to the primary return shorted that node to earth — the **RCD tripped** at once. Nobody was hurt; the unit and probe survived.

My first instinct (I admit it) was to float the scope with an earth-lift adapter. Tomasz stopped me: a floating scope puts the chassis, the BNC shells and every other probe ground at mains potential.

What we did instead: a **high-voltage differential probe** (100x, rated 1000 V CAT II), scope properly earthed. It showed the drain pulses cleanly: 0 to 400 V at 65 kHz. Its common-mode rejection (about 60 dB here) keeps the 325 V swing of the reference node down to a fraction of a volt on screen.

${SAFETY}`,
    setup: {
      probe: { ...PROBES.p22, groundKind: 'clip-lead', groundLeadM: 0.15 },
      scope: { ...SCOPES.sc03, attenuationSetting: 100 },
      circuit: {
        nodeDescription: 'PFC MOSFET drain to source; ground clip on the source (primary return)',
        mainsConnected: true,
        mainsFrequencyHz: 50,
        referenceV: 325,
        highestVoltageV: 400,
      },
      signal: { expectedAmplitudeV: 400, frequencyHz: 65e3, kind: 'pulse' },
      observed: { description: 'No trace: the RCD tripped as the ground clip touched. The attached capture is the repeat with the differential probe: 0 to 400 V pulses at 65 kHz.' },
    },
    statedCause: 'common-mode',
    fix: 'Differential probe rated for the voltage and category, scope earthed; passive probes only on earth-referenced nodes (or with the unit on an isolation transformer, one reference point only).',
    lessonSummary: 'Never clip a passive probe ground to a mains-referenced node, and never float the scope: use a differential probe.',
    lessonDetail: 'IEC 61010-1:2010, 6.3.1 treats more than 33 V rms, 46.7 V peak or 70 V DC as hazardous live in normal conditions (16 V, 22.6 V and 35 V in wet locations). On mains-connected equipment, or on any node away from earth, use differential or isolated probing rated for the voltage and category.',
    tags: ['safety', 'mains', 'pellbright', 'differential-probe'],
    attach: ['screenshot', 'capture'],
    steps: [
      { at: t('08-24 09:40'), do: 'submit' },
      { at: t('08-24 13:00'), do: 'comment', by: 'admin', body: 'Earth-lift adapters have been removed from the lab. The differential probe now lives on the mains bench with a tag on it.' },
      { at: t('08-25 08:30'), do: 'verify', by: 'rhys.tanaka', note: 'The engine marks a passive ground on a node 325 V from earth as a hazard; safety note present and correct. Verified and pinned for the checklist.' },
      { at: t('08-25 08:31'), do: 'pin', by: 'rhys.tanaka' },
    ],
  },
  {
    key: 'cm-shunt-cmrr',
    author: 'mateo.brennan',
    createdAt: t('10-15 16:40'),
    title: 'High-side shunt reads 68 mV where 20 mV is expected',
    summary: 'The LS-48 high-side current shunt, read with a differential probe, showed a 68 mV step at every PWM edge for a 4 A (20 mV) current.',
    narrative: `Phase A high-side shunt: 5 mΩ, 4 A steady, so 20 mV. With the 10x differential probe across it the trace steps by **68 mV** in time with the PWM.

The shunt rides on the switch node, which jumps 0 → 48 V. The probe's data sheet gives its common-mode rejection as 60 dB at 20 kHz: 48 V × 10^(−60/20) = 48 mV of the switch node leaks into the difference, and 20 + 48 = 68 mV. Shorting both leads together on the shunt's high end shows the 48 mV alone.`,
    setup: {
      probe: { model: 'DP-10 differential probe, 10x, 25 MHz', kind: 'differential', attenuation: 10, nominalAttenuation: 10, cmrrDb: 60, bandwidthHz: 25e6 },
      scope: { ...SCOPES.sc04, attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 0.005, nodeDescription: 'R_sense A, high side; reference lead on the switch node', referenceV: 48, highestVoltageV: 48, mainsConnected: false },
      signal: { expectedAmplitudeV: 0.02, frequencyHz: 20e3, kind: 'square' },
      observed: { amplitudeV: 0.068, description: '68 mV step at every PWM edge' },
    },
    statedCause: 'common-mode',
    tags: ['larkspan', 'current-sense', 'differential-probe', 'cmrr'],
    attach: ['capture', 'screenshot'],
    steps: [
      { at: t('10-15 17:00'), do: 'submit' },
      { at: t('10-16 10:30'), do: 'comment', by: 'lucia.varga', body: 'The shorted-leads test is the right confirmation. For small signals on a switching node an isolated probe or a shunt amplifier on the board does far better than 60 dB.' },
    ],
  },
];
