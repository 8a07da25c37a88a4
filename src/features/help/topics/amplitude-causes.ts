import type { HelpTopic } from './types';

export const ATTENUATION_TOPIC: HelpTopic = {
  slug: 'attenuation-mismatch',
  cause: 'attenuation-mismatch',
  title: 'Attenuation setting mismatch',
  lead: 'The trace is the right shape but off by a round factor: 10, 1/10, 100.',
  onScreen: `- The waveform looks perfectly healthy, only its **size is wrong by a round factor** — a 3.3 V rail shows 330 mV, a 12 V gate shows 120 V.
- Timing, edges and noise look normal; a meter on the same node disagrees with the scope by exactly that factor.
- It often appears right after someone else used the channel, or after a probe was swapped.`,
  physics: `A passive probe divides the voltage at its tip by its ratio (10 for a 10x probe), and the scope multiplies what arrives by the ratio its channel is **set** to assume. When the two agree the screen shows the true voltage. When they do not, the screen is scaled by *setting ÷ actual*.

Most scopes sense a probe's ratio only through a coding pin on the connector, and many probes — especially **switchable 1x/10x** ones — have no such pin for their switch. So the scope cannot know; the person has to.`,
  formulas: [
    { text: 'V_shown = V_true × setting / actual', meaning: 'what the screen shows' },
    { text: 'actual = setting × V_expected / V_shown', meaning: 'the probe ratio an observation implies' },
  ],
  example: `A 10x probe on a channel left at 1x, on a 3.3 V rail: 3.3 V × 1 / 10 = **0.33 V** on screen. Set the channel to 10x and it reads 3.3 V.`,
  diagnose: {
    'probe.attenuation': 10,
    'scope.attenuationSetting': 1,
    'signal.expectedAmplitudeV': 3.3,
    'signal.kind': 'dc',
    'observed.amplitudeV': 0.33,
  },
  fix: `Set the channel's probe ratio to the probe actually on it. On a switchable probe, look at the switch itself. Cross-check the first reading of any new setup with a meter.`,
  sources: [
    { label: 'Definition of probe attenuation (ratio of tip voltage to output voltage)', note: 'common practice' },
    { label: 'Switch positions of switchable probes are usually not sensed by the scope', note: 'common practice' },
  ],
};

export const TERMINATION_TOPIC: HelpTopic = {
  slug: 'termination-mismatch',
  cause: 'termination-mismatch',
  title: 'High-impedance probe on a 50 Ω input',
  lead: 'A logic signal shrinks to a fraction of a millivolt, buried in noise.',
  onScreen: `- A signal of volts appears as **tens or hundreds of microvolts**, so small that the trace is mostly noise.
- The shape underneath is still recognisable when you turn the sensitivity all the way up.
- The channel's input menu says 50 Ω, often left over from work with coaxial cables or a low-impedance probe.`,
  physics: `A passive 10x probe is a divider built for a **1 MΩ** input: a 9 MΩ tip resistor over the scope's 1 MΩ gives exactly ten. Put the same probe on an input terminated in **50 Ω** and the bottom of the divider is 50 Ω instead of 1 MΩ, so the probe divides by about (9 MΩ + 50 Ω) / 50 Ω — roughly 180 000 — while the channel still multiplies by 10.

A 50 Ω input also has a power limit: it dissipates V² / 50 Ω, and typical inputs are rated about 5 V rms (half a watt). That is why a direct cable from a strong source into 50 Ω can damage the input, even though a 10x passive probe on 50 Ω is harmless to it.`,
  formulas: [
    { text: 'a_actual = (R_tip + R_in) / R_in', meaning: 'real division into the input' },
    { text: '(9 MΩ + 50 Ω) / 50 Ω ≈ 180 000', meaning: 'a 10x probe on 50 Ω' },
    { text: 'V_shown = V_true × a × R_in / (R_s + R_tip + R_in)', meaning: 'screen, channel at the probe ratio a' },
    { text: 'P = V_rms² / 50 Ω', meaning: 'power into a 50 Ω input' },
  ],
  example: `A 3.3 V clock through a 10x probe into 50 Ω: 3.3 V × 10 × 50 Ω / 9 MΩ ≈ **0.18 mV**.`,
  diagnose: {
    'probe.attenuation': 10,
    'scope.attenuationSetting': 10,
    'scope.inputResistanceOhm': 50,
    'signal.expectedAmplitudeV': 3.3,
    'signal.frequencyHz': 25e6,
    'signal.kind': 'square',
    'observed.amplitudeV': 0.0002,
  },
  fix: `Set the input to 1 MΩ for passive high-impedance probes. For fast work on a 50 Ω input use a probe made for it (a low-impedance divider probe or an active probe). Reset the input impedance after any 50 Ω session.`,
  sources: [
    { label: 'Resistive voltage divider', note: 'circuit law' },
    { label: '10x passive probes: 9 MΩ tip resistor into a 1 MΩ input', note: 'common practice' },
    { label: '50 Ω scope inputs rated about 5 V rms', note: 'common practice; check your scope' },
  ],
};

export const LOADING_TOPIC: HelpTopic = {
  slug: 'loading',
  cause: 'loading',
  title: 'Circuit loading by the probe',
  lead: 'The probe changes the node it measures: lower amplitude, slower edges, a stopped oscillator.',
  onScreen: `- A **high-impedance node reads low**: a 1 MΩ / 1 MΩ bias divider shows 2.38 V instead of 2.50 V.
- **AC signals shrink with frequency** at nodes driven through kilohms, and edges round off.
- Oscillators shift frequency or **stop** when touched; the circuit behaves differently with the probe on.`,
  physics: `The probe is not a window but a component: a resistance in parallel with a capacitance, hung on the node. A 10x passive probe is about **10 MΩ ∥ 10–15 pF**; a 1x probe is the scope's 1 MΩ with the cable's capacitance, around **100 pF**.

Whatever drives the node has its own (Thevenin) resistance R_s. The probe and R_s form a divider. At DC only the resistances matter; at higher frequencies the probe's capacitance takes over and the divider falls with frequency, with a corner where the capacitance's reactance equals the parallel resistance. The same RC slows edges.`,
  formulas: [
    { text: 'V_shown / V_true = R_in / (R_s + R_in)', meaning: 'DC divider' },
    { text: '|Z_p / (R_s + Z_p)|,  Z_p = R_in ∥ 1/(j·2πf·C)', meaning: 'AC divider at frequency f' },
    { text: 'f_c = 1 / (2π · (R_s ∥ R_in) · C)', meaning: 'corner of the loaded node' },
    { text: 't_r ≈ 2.2 · (R_s ∥ R_in) · C', meaning: 'rise time the load alone adds' },
  ],
  example: `A 1x probe (≈ 100 pF) on a node driven through 47 kΩ: f_c = 1 / (2π · 47 kΩ · 100 pF) ≈ 34 kHz, so a 100 kHz sine keeps only about **32 %** of its amplitude.`,
  diagnose: {
    'probe.attenuation': 1,
    'scope.attenuationSetting': 1,
    'circuit.sourceResistanceOhm': 47000,
    'signal.expectedAmplitudeV': 1.2,
    'signal.frequencyHz': 100000,
    'signal.kind': 'sine',
    'observed.amplitudeV': 0.39,
  },
  fix: `Use the 10x position (about ten times less capacitance than 1x). Measure high-impedance points after a buffer, or with an active probe. Never probe crystal pins directly.`,
  sources: [
    { label: 'Voltage-divider rule with complex impedances', note: 'circuit law' },
    { label: 'Single-pole rise time 2.2·RC (10 %–90 %)', note: 'from the RC step response' },
    { label: 'Probe loading figures (10 MΩ ∥ 10–15 pF at 10x, ~100 pF at 1x)', note: 'common practice' },
  ],
};
