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

Most scopes sense a probe's ratio only through a coding pin on the connector, and many probes — especially **switchable 1x/10x** ones — have no such pin for their switch. So the scope cannot know; the person has to. For the same reason an exported capture records the channel's *setting*, not the probe that was really on it.`,
  formulas: [
    { tex: String.raw`V_\text{shown} = V_\text{true} \times \frac{\text{setting}}{\text{actual}}`, meaning: 'what the screen shows' },
    { tex: String.raw`\text{actual} = \text{setting} \times \frac{V_\text{expected}}{V_\text{shown}}`, meaning: 'the probe ratio an observation implies' },
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
  lead: 'DC and slow levels shrink to a fraction of a millivolt, while every edge comes through as a needle.',
  onScreen: `- A DC level or the flat parts of a slow square wave appear as **tens or hundreds of microvolts**.
- **Every edge comes through as a needle**: a spike about a tenth of the step (on the screen's scale, with a 10x probe and channel) that dies away within a few nanoseconds. A fast clock turns into a row of alternating needles with nothing flat between them — the shape is *not* the signal's.
- Sines lose more the lower their frequency: a 10 MHz sine keeps about a third of its size, a 25 kHz one a thousandth.
- The channel's input menu says 50 Ω, often left over from work with coaxial cables or a low-impedance probe.`,
  physics: `A passive 10x probe is a compensated divider built for a **1 MΩ** input: the tip's R1 = 9 MΩ with C1 across it, over the scope's 1 MΩ with C2 (cable, trimmer and input) across it, R1·C1 = R2·C2. With C_tip the capacitance the circuit sees at the tip, a compensated probe of ratio n has C1 = n·C_tip/(n−1) and C2 = n·C_tip — about 12 pF and 110 pF for an 11 pF probe.

On a **50 Ω** input the bottom of the divider becomes 50 Ω ∥ C2, and the divider is complex, Z2/(Z1+Z2):

- At DC and low frequency the resistors set it: 50 Ω / (9 MΩ + 50 Ω), about 1/180 000, while the channel still multiplies by 10.
- Above a few kHz, C1's reactance replaces the 9 MΩ and the ratio rises with frequency.
- A fast edge passes the capacitive divider $C_1/(C_1+C_2)$, about a tenth, and then decays through the 50 Ω with $\\tau = 50\\,\\Omega \\cdot (C_1 + C_2)$, about 6 ns. An edge slower than τ, or a probe and scope slower than τ, gives a lower needle. An amplitude read off such a trace may be the flat level, one needle or the needles' peak to peak (up at one edge, down at the next); the engine compares the reading nearest what you entered, and the table names which one it took.

A 50 Ω input also has a power limit: it dissipates V²/50 Ω, and typical inputs are rated about 5 V rms (half a watt). A passive probe does not make it safe: the needles put a tenth of every edge across the 50 Ω — 40 V for a 400 V switch node — and at a high switching rate they add up to real power. A direct cable from a strong source can damage the input outright.`,
  formulas: [
    { tex: String.raw`\frac{V_\text{input}}{V_\text{tip}} = \frac{Z_2}{Z_1 + Z_2},\quad Z_1 = R_1 \parallel C_1,\quad Z_2 = 50\,\Omega \parallel C_2`, meaning: 'the complex divider on 50 Ω' },
    { tex: String.raw`C_1 = \frac{n\,C_\text{tip}}{n - 1},\quad C_2 = n\,C_\text{tip}`, meaning: 'a compensated probe of ratio n' },
    { tex: String.raw`\frac{9\,\text{M}\Omega + 50\,\Omega}{50\,\Omega} \approx 180\,000`, meaning: 'DC division of a 10x probe on 50 Ω' },
    { tex: String.raw`\text{spike} = V_\text{step} \times n \times \frac{C_1}{C_1 + C_2}`, meaning: 'each edge on the screen (channel at n), ideal step' },
    { tex: String.raw`\tau = 50\,\Omega \times (C_1 + C_2)`, meaning: 'how fast each needle dies away' },
    { tex: String.raw`P = \frac{V_\text{rms}^2}{50\,\Omega}`, meaning: 'power into a 50 Ω input' },
  ],
  example: `An 11 pF 10x probe (C1 ≈ 12.2 pF, C2 = 110 pF) on a 50 Ω input, channel at 10x:

- a 3.7 V DC level shows 3.7 V × 10 × 50 Ω / 9 MΩ ≈ **0.21 mV**;
- each edge of a 3.3 V clock shows a needle of up to 3.3 V × 10 × 12.2/122.2 ≈ **3.3 V**, gone with τ = 50 Ω × 122 pF ≈ **6 ns** (a 1.5 ns edge from a 30 Ω driver reached about 2.6 V in our demo case);
- a 1 V sine at 10 MHz shows about **0.36 V**; at 25 kHz about 1 mV.`,
  diagnose: {
    'probe.attenuation': 10,
    'probe.tipCapacitanceF': 11e-12,
    'scope.attenuationSetting': 10,
    'scope.inputResistanceOhm': 50,
    'signal.expectedAmplitudeV': 3.7,
    'signal.kind': 'dc',
    'observed.amplitudeV': 0.0002,
  },
  fix: `Set the input to 1 MΩ for passive high-impedance probes. For fast work on a 50 Ω input use a probe made for it (a low-impedance divider probe or an active probe). Reset the input impedance after any 50 Ω session, and never put a high-voltage node on a 50 Ω input, through a probe or not.`,
  sources: [
    { label: 'Voltage divider with complex impedances', note: 'circuit law' },
    { label: 'Compensated RC divider: R1·C1 = R2·C2; edge ratio C1/(C1+C2)', note: 'derivation' },
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
  physics: `The probe is not a window but a component: a resistance in parallel with a capacitance, hung on the node. A 10x passive probe is about **10 MΩ ∥ 10–15 pF**; a 1x probe is the scope's 1 MΩ with the cable's capacitance, around **100 pF**. An active (FET) probe buffers the tip, so the scope's input takes no part: about **1 MΩ ∥ 1 pF** whatever its ratio, the figures the engine assumes when none are recorded. A current probe closes around a wire and loads no node.

Whatever drives the node has its own (Thevenin) resistance R_s. The probe and R_s form a divider. At DC only the resistances matter; at higher frequencies the probe's capacitance takes over and the divider falls with frequency, with a corner where the capacitance's reactance equals the parallel resistance. The same RC slows edges.

A source impedance you record is read as an estimate, good to a factor of about 1.6. Where even that spread leaves the load moving the trace, the record says so: a passive probe on a recorded 100 kΩ node cannot show a 20 ns edge, so such a reading is **unexplained** (check the recorded impedance), not put down to some other cause.`,
  formulas: [
    { tex: String.raw`\frac{V_\text{shown}}{V_\text{true}} = \frac{R_\text{in}}{R_s + R_\text{in}}`, meaning: 'DC divider' },
    { tex: String.raw`\left\lvert \frac{Z_p}{R_s + Z_p} \right\rvert,\quad Z_p = R_\text{in} \parallel \frac{1}{j\,2\pi f C}`, meaning: 'AC divider at frequency f' },
    { tex: String.raw`f_c = \frac{1}{2\pi \, (R_s \parallel R_\text{in}) \, C}`, meaning: 'corner of the loaded node' },
    { tex: String.raw`t_r \approx 2.2 \, (R_s \parallel R_\text{in}) \, C`, meaning: 'rise time the load alone adds' },
    { tex: String.raw`V_\text{pp,shown} = A \, \frac{R_\text{in}}{R_s + R_\text{in}} \tanh\frac{T}{4\tau},\quad \tau = (R_s \parallel R_\text{in}) \, C`, meaning: 'settled peak-to-peak of a square wave of period T' },
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
    { label: 'Probe loading figures (10 MΩ ∥ 10–15 pF at 10x, ~100 pF at 1x, ~1 MΩ ∥ 1 pF for an active probe)', note: 'common practice' },
  ],
};
