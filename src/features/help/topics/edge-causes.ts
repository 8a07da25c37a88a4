import type { HelpTopic } from './types';

export const BANDWIDTH_TOPIC: HelpTopic = {
  slug: 'bandwidth',
  cause: 'bandwidth',
  title: 'Bandwidth too low for the edge',
  lead: 'Edges look slower than they are; fast square waves turn into sines.',
  onScreen: `- Measured **rise times are longer** than the part's data sheet or simulation, and do not improve when the circuit is made faster.
- Fast square waves look **rounded, even sinusoidal**, and their amplitude drops.
- A small "BW" marker next to the channel, or a 1x probe, is often the giveaway.`,
  physics: `Every stage between the circuit and the screen — probe, scope front end, any bandwidth-limit filter — behaves roughly like a low-pass filter. A single-pole low-pass with bandwidth BW turns an ideal step into an exponential whose 10 %–90 % rise time is $\\ln 9 / (2\\pi \\cdot \\text{BW})$, which is the familiar $0.35 / \\text{BW}$.

Stages in cascade add their rise times **in quadrature** (root of the sum of squares). So the edge you see is never faster than the slowest stage, and a system only 1–2× faster than the edge measures mostly itself. A 1x passive probe has only a few MHz of bandwidth; a 20 MHz limit filter alone makes every edge at least 17.5 ns.

A sine's amplitude below the bandwidth is less certain than its edge: one pole passes $1/\\sqrt{1 + (f/\\text{BW})^2}$, 89 % at half the bandwidth, but scope front ends are built flatter (Gaussian to maximally flat) and may pass nearly all of it there; every shape is −3 dB at the bandwidth. The engine allows that spread when it compares a sine's amplitude, so a full reading at half the bandwidth is no error, and a reading anywhere between the two does not count against another cause.

Count each stage once. A probe's data-sheet bandwidth is usually the bandwidth *with the scope it is matched to*: that figure is the system's, not a second stage. Leave the probe's bandwidth blank for a matched probe and the engine takes the scope's figure as the whole system's; a 500 MHz probe and a 500 MHz scope added again in quadrature would wrongly make a 354 MHz system. A bandwidth-limit filter is always a stage of its own.`,
  formulas: [
    { tex: String.raw`t_r \approx \frac{0.35}{\text{BW}}`, meaning: 'one stage (exactly ln 9 / 2π = 0.3497)' },
    { tex: String.raw`t_\text{shown} = \sqrt{t_\text{signal}^2 + t_\text{probe}^2 + t_\text{scope}^2 + t_\text{limit}^2}`, meaning: 'stages in cascade' },
    { tex: String.raw`\text{BW}_\text{needed} \approx (3 \ldots 5) \times \frac{0.35}{t_\text{edge}}`, meaning: 'rule of thumb for a true reading' },
    { tex: String.raw`\frac{V_\text{pp,shown}}{V_\text{pp}} = \tanh\frac{T}{4\tau}`, meaning: 'a square wave of period T through one pole τ' },
  ],
  example: `A 2 ns edge on a matched 500 MHz probe and scope (0.7 ns) with the 20 MHz limit on (17.5 ns): √(2² + 0.7² + 17.5²) ns ≈ **17.6 ns**.`,
  diagnose: {
    'probe.attenuation': 10,
    'scope.attenuationSetting': 10,
    'scope.bandwidthHz': 500e6,
    'scope.bandwidthLimitHz': 20e6,
    'signal.expectedAmplitudeV': 3.3,
    'signal.frequencyHz': 10e6,
    'signal.riseTimeS': 2e-9,
    'signal.kind': 'square',
    'observed.riseTimeS': 17.6e-9,
  },
  fix: `Switch bandwidth limits off for edge measurements; use 10x, not 1x; use a scope and probe 3–5 times faster than the edge; report the system's own rise time next to every measured edge.`,
  sources: [
    { label: 'IEEE Std 181-2011, transitions and pulse terms', note: '10 % and 90 % reference levels, rise time' },
    { label: 'Single-pole step response 1 − e^(−t/τ): t₉₀ − t₁₀ = τ·ln 9, f₃dB = 1/(2πτ)', note: 'derivation' },
    { label: 'Root-sum-square rise-time rule', note: 'common practice; exact for Gaussian stages' },
    { label: 'Butterworth (maximally flat) magnitude 1/√(1 + (f/f_c)^2n)', note: 'filter theory; n = 4 bounds how flat a front end is taken to be' },
    { label: '1x passive probes reach only a few MHz', note: 'common practice' },
    { label: 'A probe\'s rated bandwidth is usually given with its matched scope (system figure)', note: 'common practice' },
  ],
};

export const COMPENSATION_TOPIC: HelpTopic = {
  slug: 'compensation',
  cause: 'compensation',
  title: 'Probe compensation out of adjustment',
  lead: 'Square-wave corners spike up or round off and creep to the final level; fast signals read high or low with flat tops.',
  onScreen: `- On a low-frequency square wave (the scope's 1 kHz calibrator is ideal) the **corners spike** above the top (over-compensated) or are **rounded** below it (under-compensated).
- The error decays **smoothly and slowly** — over tens to hundreds of microseconds — with no ringing.
- On signals much faster than that decay (a clock of several MHz) there is no visible corner at all: the **whole amplitude is off** by the same percentage, with flat tops.
- It appears after the probe was moved to another scope or channel: **more input capacitance rounds the corners** (and reads fast signals low), less makes them spike.`,
  physics: `A 10x passive probe is two RC sections in series: the tip resistor R1 with a small capacitor C1 across it, over the scope input R2 with everything in parallel with it, C2 (input, cable, trimmer). At low frequency the resistors set the ratio; at high frequency the capacitors do. The divider is flat for all frequencies only when the two sections have the same time constant, $R_1 C_1 = R_2 C_2$ — that is what the trimmer adjusts. Only passive divider probes carry such a trimmer: active, differential and current probes have their input network set where they are built, so the engine does not offer a trimmer error for them.

When they differ, an edge first jumps to the capacitive ratio and then settles to the resistive one with the divider's time constant. A signal much faster than that time constant never settles: it is divided by the capacitive ratio throughout, so its amplitude is off by the corner error and its tops are flat.

Every input has a slightly different capacitance, and it sits in C2. Moving a probe adjusted on a 16 pF input to a 20 pF one adds 4 pF to C2: the capacitive ratio drops, the probe is now **under**-compensated, and the corners round off. Adding capacitance never makes a spike.`,
  formulas: [
    { tex: String.raw`\text{jump} = \frac{C_1}{C_1 + C_2}`, meaning: 'level right after the edge' },
    { tex: String.raw`\text{settle} = \frac{R_2}{R_1 + R_2}`, meaning: 'level it decays to' },
    { tex: String.raw`\tau = (R_1 \parallel R_2) \, (C_1 + C_2)`, meaning: 'how long the decay takes' },
    { tex: String.raw`R_1 C_1 = R_2 C_2`, meaning: 'flat: correctly compensated' },
    { tex: String.raw`\text{corner} = \left(\frac{\text{jump}}{\text{settle}} - 1\right) \times 100\,\%`, meaning: 'overshoot (+) or undershoot (−)' },
  ],
  example: `A 10x probe with 11 pF at the tip has C1 ≈ 12.2 pF and C2 = 110 pF when trimmed; τ ≈ 0.9 MΩ × 122 pF ≈ **110 µs**, which is why a 1 kHz square shows the corners best.

Moved to a scope with 4 pF more input: C2 = 114 pF, jump = 12.2 / 126.2 = 0.0968 against settle = 0.1, corner = **−3.2 %** (rounded), settling over about 114 µs. On a 12 MHz clock the same probe reads the whole clock 3.2 % low, flat-topped.`,
  diagnose: {
    'probe.attenuation': 10,
    'scope.attenuationSetting': 10,
    'scope.inputResistanceOhm': 1000000,
    'scope.inputCapacitanceF': 20e-12,
    'signal.expectedAmplitudeV': 5,
    'signal.frequencyHz': 1000,
    'signal.kind': 'square',
    'observed.amplitudeV': 5,
    'observed.overshootPct': -3,
  },
  fix: `Connect the probe to the scope's calibrator square wave on the channel you will use and turn the trimmer until the top is flat — no spike, no rounding. Repeat whenever the probe changes channel or scope. If a fast clock reads a few percent off, check the compensation on the calibrator before doubting the clock.`,
  sources: [
    { label: 'Circuit analysis of the compensated RC divider (Laplace transform of Z2/(Z1+Z2))', note: 'derivation' },
    { label: 'Compensating on the calibrator square wave', note: 'common practice' },
  ],
};

export const GROUND_LEAD_TOPIC: HelpTopic = {
  slug: 'ground-lead',
  cause: 'ground-lead',
  title: 'Ground-lead ringing',
  lead: 'Fast edges overshoot and ring near 100 MHz, and the ringing moves when the lead moves.',
  onScreen: `- Every fast edge **overshoots and rings**, typically between 50 and 300 MHz, decaying over tens of nanoseconds.
- The ringing **changes when you move or coil the ground lead**, and almost vanishes with a ground spring.
- The circuit works fine; only the measurement rings.`,
  physics: `The probe's ground lead is a wire, and a wire has inductance — about 1 nH per millimetre for a thin lead, so a 15 cm clip lead is near 190 nH. Together with the capacitance at the probe tip it forms a **series resonant circuit** driven by the edge. The source resistance is the only damping, and a low-impedance driver barely damps it.

The straight-wire formula gives the inductance from length and wire radius; the resonance is $1/(2\\pi\\sqrt{LC})$; the damping ratio sets the overshoot. Counting only the source resistance gives an upper bound on the overshoot: the probe's lossy cable and the lead's own resistance damp it further. Working backwards, an observed ringing frequency gives the inductance and so the lead length — if that comes out as the length of the clip lead, the lead is the culprit. An edge much slower than the ring period excites it less.`,
  formulas: [
    { tex: String.raw`L \approx \frac{\mu_0 l}{2\pi} \left(\ln\frac{2l}{r} - \frac{3}{4}\right)`, meaning: 'straight round wire, length l, radius r' },
    { tex: String.raw`f_\text{ring} = \frac{1}{2\pi\sqrt{L C}}`, meaning: 'resonance with the tip capacitance' },
    { tex: String.raw`\zeta = \frac{R_s}{2} \sqrt{\frac{C}{L}}`, meaning: 'damping from the source resistance' },
    { tex: String.raw`\text{overshoot} = \exp\left(\frac{-\pi\zeta}{\sqrt{1 - \zeta^2}}\right) \times 100\,\%`, meaning: 'ideal step, ζ < 1' },
  ],
  example: `15 cm of 0.5 mm wire: L ≈ 190 nH. With 11 pF at the tip: f ≈ 1 / (2π √(190 nH × 11 pF)) ≈ **110 MHz**. A 5 Ω source gives ζ ≈ 0.02 — almost no damping.`,
  diagnose: {
    'probe.attenuation': 10,
    'probe.tipCapacitanceF': 11e-12,
    'probe.groundKind': 'clip-lead',
    'probe.groundLeadM': 0.15,
    'scope.attenuationSetting': 10,
    'scope.bandwidthHz': 500e6,
    'circuit.sourceResistanceOhm': 5,
    'signal.expectedAmplitudeV': 12,
    'signal.frequencyHz': 400000,
    'signal.riseTimeS': 3e-9,
    'signal.kind': 'square',
    'observed.ringingFrequencyHz': 110e6,
    'observed.overshootPct': 66,
  },
  fix: `Use the shortest return: a ground spring on the tip barrel or a probe socket soldered at the test point. A 1 cm return moves the resonance far above the scope's bandwidth.`,
  sources: [
    { label: 'E. B. Rosa, Bulletin of the Bureau of Standards 4 (1908); F. W. Grover, Inductance Calculations (1946)', note: 'self-inductance of a straight round wire' },
    { label: 'Second-order (series RLC) step response', note: 'ω_n = 1/√(LC), ζ = (R/2)√(C/L), overshoot exp(−πζ/√(1−ζ²))' },
    { label: 'Clip lead about 15 cm, ground spring about 1 cm', note: 'common practice' },
  ],
};
