/**
 * Phrase banks for the bench casebook: the invented Quillfen Instruments team writing up
 * measurements that lied, year after year. Every sentence is ours; `{x}` slots are filled per case.
 */
import type { Cause } from '../../../shared/schemas/diagnosis';

export type Rand = () => number;
export const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
export const between = (r: Rand, lo: number, hi: number) => lo + Math.floor(r() * (hi - lo + 1));

/** The company's invented products, with the tag the team files them under. */
export const PRODUCTS = [
  { name: 'Larkspan LS-48 motor drive', tag: 'larkspan' },
  { name: 'Skerrynode SN-2 sensor node', tag: 'skerrynode' },
  { name: 'Pellbright PB-300 LED driver', tag: 'pellbright' },
  { name: 'Cindervale CV-12 battery monitor', tag: 'cindervale' },
  { name: 'Wrenmoor WM-7 audio interface', tag: 'wrenmoor' },
  { name: 'Thistlebeck TB-5 charger', tag: 'thistlebeck' },
  { name: 'Orrinmere OM-9 gateway', tag: 'orrinmere' },
  { name: 'Fallowdene FD-3 pump controller', tag: 'fallowdene' },
] as const;

export const NODES = [
  'the gate of the low-side FET', 'the 3.3 V rail', 'the SPI clock at the flash', 'the buck switch node', 'the reference divider',
  'the crystal output', 'the ADC input', 'the current-sense amplifier output', 'the I2C data line', 'the bias network',
  'the PWM output', 'the thermistor divider', 'the audio line output', 'the hall sensor output', 'the bootstrap capacitor',
  'the UART transmit pin', 'the reset line', 'the 12 V input', 'the phase node', 'the opamp buffer output',
];

const SYMPTOMS: Record<Cause | 'other', string[]> = {
  'attenuation-mismatch': ['reads ten times too low', 'shows a tenth of the rail', 'reads 10x high', 'amplitude off by a round factor'],
  'termination-mismatch': ['almost flat on the screen', 'a spike on every edge and nothing between', 'thousands of times too small', 'vanishes when probed'],
  loading: ['sags when probed', 'drops as soon as the probe touches it', 'amplitude falls with frequency', 'reads low on the 1x probe'],
  bandwidth: ['edges rounded off', 'rise time five times the datasheet', 'looks like a sine wave', 'slow edges on a fast driver'],
  compensation: ['spikes on every corner', 'rounded corners on a square wave', 'overshoot that is not there', 'tilted tops after moving the probe'],
  'ground-lead': ['rings after every edge', 'rings at 150 MHz', 'huge overshoot on the rising edge', 'ringing that moved with the ground clip'],
  aliasing: ['shows a slow wave that is not there', 'frequency reads wrong at long timebase', 'beats that change with the timebase'],
  clipping: ['flat tops at the screen edge', 'peaks cut off', 'recovers slowly after each pulse'],
  'ac-coupling': ['tops droop on a slow square wave', 'DC level reads zero', 'baseline wanders with duty cycle'],
  'common-mode': ['a switching edge on a quiet shunt', 'differential reading follows the switch node', 'trip when the ground clip touched'],
  'mains-pickup': ['50 Hz hum on a quiet node', 'hum that changes with the cable route', 'slow wobble on the baseline'],
  'generator-load': ['twice the set amplitude', 'half the set amplitude', 'generator reads wrong into the scope'],
  other: ['odd trace nobody could explain', 'reading changed between benches', 'trace looked wrong for a day'],
};

const CAUSE_SENTENCES: Record<Cause | 'other', string[]> = {
  'attenuation-mismatch': [
    'The probe was switched to 1x but the channel still assumed 10x, so every volt was scaled by the wrong factor.',
    'Nobody checked the channel menu after swapping the probe; the scope cannot see the switch on this probe.',
    'Reading with a meter at the same node gave the expected value, exactly ten times what the scope claimed.',
  ],
  'termination-mismatch': [
    'The channel input had been left at 50 Ω from the previous user, and a passive probe into that divides by thousands.',
    'Only the fast edges came through, as short spikes decaying in a few nanoseconds.',
    'Switching the input back to 1 MΩ brought the full waveform back at once.',
  ],
  loading: [
    'The node sits behind a high resistance and the probe input was a large part of the load.',
    'Touching the node with the 1x probe pulled the level down visibly; the 10x probe moved it much less.',
    'The divider output reads right with a high-impedance meter and low with the probe.',
  ],
  bandwidth: [
    'The 20 MHz limit filter was still on from the ripple measurements the day before.',
    'The edges were limited by the probe and scope, not by the driver; rise times add roughly in quadrature.',
    'Taking the limit off and using the 10x probe showed the edges the datasheet promises.',
  ],
  compensation: [
    'The probe had come from another scope and the trimmer was never adjusted against this input.',
    'On the calibrator output the corners overshot clearly, the textbook picture of an overcompensated probe.',
    'Adjusting the trimmer until the calibrator square wave was flat fixed the trace.',
  ],
  'ground-lead': [
    'The long clip lead and the tip capacitance form a resonant circuit that every fast edge excites.',
    'Swapping the clip lead for the ground spring moved the ringing far up in frequency and it damped within a few nanoseconds.',
    'The ringing frequency matched the lead inductance with the probe capacitance within a few percent.',
  ],
  aliasing: [
    'The sample rate had dropped with the long timebase and the signal was above half of it.',
    'Shortening the timebase showed the real frequency immediately.',
  ],
  clipping: [
    'The signal ran off the screen and the input amplifier was overdriven.',
    'With a larger volts per division the peaks came back.',
  ],
  'ac-coupling': [
    'The channel was AC coupled, so the slow square wave drooped on every flat top.',
    'Switching to DC coupling showed the true level.',
  ],
  'common-mode': [
    'The differential probe was passing part of the common-mode swing of the switch node.',
    'Shorting both inputs to the same node showed the same edge: it was the probe, not the circuit.',
  ],
  'mains-pickup': [
    'The hum sat exactly at the mains frequency and changed when the cables were moved.',
    'Breaking the ground loop through the second instrument removed most of it.',
  ],
  'generator-load': [
    'The generator was set for a 50 Ω load and was driving a high-impedance input.',
    'Setting the generator load to high-Z made the scope and the generator agree.',
  ],
  other: [
    'We never found one clear cause; the fixture was rebuilt and the effect went away.',
    'The cable turned out to be damaged near the connector.',
  ],
};

const GENERAL = [
  'This was found during bring-up of {product} rev {rev}.',
  'I measured {node} on {product} while chasing a field return.',
  'The first reading disagreed with the simulation and with the datasheet.',
  'We spent most of a day suspecting the layout before checking the probe.',
  'The board itself turned out to be fine.',
  'Two of us repeated the measurement on another bench and saw the same thing.',
  'The capture is attached, with the scope settings as they were.',
  'A colleague suggested repeating the measurement with a different probe first.',
  'The same unit had passed production test the week before.',
  'I noted the timebase, the channel settings and the probe before changing anything.',
  'Nothing on the board was reworked between the two captures.',
  'After the change the trace matched what the circuit should do.',
  'I have added this so the next person on this bench finds it first.',
  'It took longer to believe the fix than to find it.',
  'The supply current did not change at all, which should have been a hint.',
  'We checked the other channel with the same probe and got the same result.',
];

const COMMENTS = [
  'Same thing happened to me on bench 2 last month.',
  'Could you attach the capture from before the fix as well?',
  'Worth adding this to the bench checklist.',
  'Checked on the SC-02 too, same result.',
  'Thanks, this saved me an afternoon.',
  'Is the probe in the kit on bench 3 the same type?',
  'I think the lesson could be one line shorter.',
  'We should label the switchable probes.',
  'Confirmed with the spring tip here as well.',
  'The datasheet figure assumes a 50 Ω source, by the way.',
];

const FIXES: Record<Cause | 'other', string> = {
  'attenuation-mismatch': 'Set the channel attenuation to match the probe (or switch the probe back to 10x) and re-read.',
  'termination-mismatch': 'Set the channel input back to 1 MΩ before using a passive probe.',
  loading: 'Use the 10x probe or an active probe on high-impedance nodes, and check the level with a meter.',
  bandwidth: 'Turn off the bandwidth limit filter and use a probe rated for the edge speed.',
  compensation: 'Compensate the probe on this scope\'s calibrator output before measuring.',
  'ground-lead': 'Use the ground spring (or a probe socket) instead of the long clip lead on fast edges.',
  aliasing: 'Keep the sample rate well above twice the highest frequency; shorten the timebase to check.',
  clipping: 'Keep the whole signal on screen; increase volts per division or add offset.',
  'ac-coupling': 'Use DC coupling for slow signals and DC levels.',
  'common-mode': 'Check the differential probe\'s common-mode rejection at the switching frequency; short both inputs to test.',
  'mains-pickup': 'Break the ground loop and keep signal cables away from mains wiring.',
  'generator-load': 'Set the generator\'s load setting to match what it drives.',
  other: 'Rebuild the fixture and replace the damaged cable.',
};

const LESSONS: Record<Cause | 'other', string> = {
  'attenuation-mismatch': 'Check the channel attenuation every time you pick up a probe.',
  'termination-mismatch': 'Never put a passive probe into a 50 Ω input.',
  loading: 'A probe is a load: know the node impedance before you trust the reading.',
  bandwidth: 'Look for the bandwidth limit before blaming slow edges on the driver.',
  compensation: 'Compensate the probe on the scope you are using.',
  'ground-lead': 'Fast edges: ground spring, not the clip lead.',
  aliasing: 'Check the sample rate when the timebase is long.',
  clipping: 'Never measure a signal that runs off the screen.',
  'ac-coupling': 'DC coupling unless you mean it.',
  'common-mode': 'Test the differential probe on the common mode alone first.',
  'mains-pickup': 'Hum at the mains frequency is usually the setup, not the circuit.',
  'generator-load': 'Match the generator\'s load setting to the real load.',
  other: 'Suspect the cables and fixture too.',
};

export interface CaseText {
  title: string;
  summary: string;
  narrative: string;
  fix: string;
  lessonSummary: string;
  lessonDetail: string | null;
}

const fill = (s: string, product: string, node: string, rev: string) => s.replace('{product}', product).replace('{node}', node).replace('{rev}', rev);

/**
 * A write-up for one case. Narratives run from a couple of sentences to a long bench diary
 * (a heavy-tailed length, as real write-ups have), in paragraphs.
 */
export function caseText(r: Rand, cause: Cause | 'other', product: string): CaseText {
  const node = pick(r, NODES);
  const rev = String.fromCharCode(65 + between(r, 0, 4));
  const symptom = pick(r, SYMPTOMS[cause]);
  const title = `${node[0].toUpperCase()}${node.slice(1, 60)} ${symptom}`.slice(0, 160);
  const summary = `On ${product}, ${node} ${symptom}; ${pick(r, CAUSE_SENTENCES[cause]).toLowerCase()}`.slice(0, 280);
  // heavy-tailed sentence count: mostly 4–15, sometimes 60+
  const sentences = Math.min(90, Math.round(3 + 8 * Math.exp(r() * 2.2 - 0.6)));
  const paragraphs: string[] = [];
  let current: string[] = [];
  for (let i = 0; i < sentences; i++) {
    const own = r() < 0.35;
    current.push(fill(own ? pick(r, CAUSE_SENTENCES[cause]) : pick(r, GENERAL), product, node, rev));
    if (current.length >= between(r, 2, 5)) {
      paragraphs.push(current.join(' '));
      current = [];
    }
  }
  if (current.length) paragraphs.push(current.join(' '));
  return {
    title,
    summary,
    narrative: paragraphs.join('\n\n'),
    fix: FIXES[cause],
    lessonSummary: LESSONS[cause],
    lessonDetail: r() < 0.4 ? pick(r, CAUSE_SENTENCES[cause]) : null,
  };
}

export const commentBody = (r: Rand) => pick(r, COMMENTS);
