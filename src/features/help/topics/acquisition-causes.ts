import type { HelpTopic } from './types';

export const ALIASING_TOPIC: HelpTopic = {
  slug: 'aliasing',
  cause: 'aliasing',
  title: 'Aliasing: sample rate too low',
  lead: 'A fast signal shows up slow: a MHz clock drawn as a few kHz, a PWM that drifts across the screen.',
  onScreen: `- The trace **looks slower than it is**: a 1 MHz clock drawn as a lazy 2 kHz wave, or a steady PWM that seems to crawl.
- The frequency on screen **jumps when you change the timebase**, where a real signal would stay put.
- Edges look uneven from cycle to cycle, or the trace looks like a smear of dots at long timebases.`,
  physics: `A digital scope does not see the signal, only samples of it taken f_s times a second. Samples can only describe frequencies up to **half the sample rate**, f_s/2. A sine above that produces exactly the same samples as a slower one at $\\lvert f - k f_s \\rvert$ (k the nearest whole multiple): the record cannot tell them apart, so the screen draws the slow one.

Most scopes lower the sample rate when the timebase gets longer (the memory is fixed), so a setup that was fine at 1 µs/div can alias at 1 ms/div. A square wave's harmonics fold too, long before its fundamental does.`,
  formulas: [
    { tex: String.raw`f_\text{shown} = \lvert f - k f_s \rvert,\quad k = \operatorname{round}(f / f_s)`, meaning: 'where a frequency above f_s/2 lands' },
    { tex: String.raw`f_\text{max} = f_s / 2`, meaning: 'the highest frequency the samples describe' },
    { tex: String.raw`f_s = (f \pm f_\text{shown}) / k`, meaning: 'the sample rates an observed alias implies' },
  ],
  example: `A 1 MHz clock recorded at 1.002 MSa/s (a long timebase): k = 1, so it shows at |1 MHz − 1.002 MSa/s| = **2 kHz**, 500 times slower than it is.`,
  diagnose: {
    'signal.frequencyHz': 1e6,
    'signal.kind': 'square',
    'scope.sampleRateHz': 1.002e6,
    'observed.frequencyHz': 2e3,
  },
  fix: `Sample at least 2.5 times the highest frequency present, 5–10 times a clock's fundamental to keep its edges: shorten the timebase or lengthen the record. Peak-detect mode shows what lies between samples; changing the timebase a step tells an alias (it moves) from a real signal (it stays).`,
  sources: [
    { label: 'Sampling theorem (Nyquist 1928, Shannon 1949)', note: 'a sampled spectrum repeats every f_s' },
    { label: 'Sample rate falls with the timebase at fixed memory depth', note: 'common practice' },
  ],
};

export const CLIPPING_TOPIC: HelpTopic = {
  slug: 'clipping',
  cause: 'clipping',
  title: 'Clipping: trace beyond the screen',
  lead: 'Tops cut flat at the edge of the screen: amplitude, overshoot and ringing read from them are wrong.',
  onScreen: `- **Tops flattened** exactly at the top (or bottom) of the graticule; measurements report a suspiciously round amplitude.
- Overshoot and ringing vanish, and automatic measurements may flag "clipped" or "over range".
- After a large overdrive the trace may take a while to come back, smearing what follows each cut.`,
  physics: `The screen shows a window: the offset (the input voltage at the centre line) plus and minus half the divisions times the vertical scale. The scope's converter covers little more than that window, so what lies outside is **cut flat**, not measured. V/div and offset are on the screen's scale — after the channel's probe-ratio setting.

When the input is driven far past the window, its amplifier saturates and may take microseconds to recover, so even the part that comes back on screen can be wrong for a while.`,
  formulas: [
    { tex: String.raw`\text{window} = \text{offset} \pm \frac{\text{divisions}}{2} \times \text{V/div}`, meaning: 'what the screen shows (8 divisions on most screens)' },
    { tex: String.raw`V_\text{shown} = \min(V_\text{high}, \text{top}) - \max(V_\text{low}, \text{bottom})`, meaning: 'what is left of the signal' },
  ],
  example: `A 0…5 V square at 0.5 V/div with the offset at 0 over 8 divisions: the window is −2 V…+2 V, so only 0…2 V is shown — **2 V** instead of 5 V, flat on top.`,
  diagnose: {
    'scope.voltsPerDiv': 0.5,
    'scope.offsetV': 0,
    'signal.expectedAmplitudeV': 5,
    'signal.frequencyHz': 1e3,
    'signal.kind': 'square',
    'observed.amplitudeV': 2,
    'observed.clipped': 'true',
  },
  fix: `Choose a scale that puts the whole signal on about six of the eight divisions and centre it with the offset. To look closely at a small part of a large signal, expect overdrive and check the scope's recovery time, or use a clamp or a differential measurement.`,
  sources: [
    { label: 'Graticule: offset at the centre line, V/div per division', note: 'common practice' },
    { label: 'Overdrive recovery of scope input amplifiers', note: 'common practice; check your scope' },
  ],
};

export const AC_COUPLING_TOPIC: HelpTopic = {
  slug: 'ac-coupling',
  cause: 'ac-coupling',
  title: 'AC coupling droop or lost DC level',
  lead: 'Tops of a slow square droop, a DC level reads zero, the trace centres on its average.',
  onScreen: `- The **tops of a slow square droop** toward the centre and the bottoms rise: an "AC coupling droop".
- A DC rail reads **0 V**, and a logic signal sits around zero instead of between 0 and 3.3 V.
- Low-frequency sines come out smaller than they are.`,
  physics: `AC coupling puts a capacitor in series with the input: with the 1 MΩ input resistor it is a **first-order high-pass** with a corner of a few Hz (the data-sheet figure, for a low-impedance source; about 10 Hz if not recorded). A passive probe's tip resistor is in series with the input at these frequencies, so a 10x probe lowers the corner tenfold: f_c × R_in / (R_tip + R_in).

Each edge of a square passes whole; during the flat part the level decays toward zero with $\\tau = 1/(2\\pi f_c)$. In steady state the top droops by $\\tanh(T/4\\tau)$ of the step (T the period) — for slow droop about π·f_c/(2f).`,
  formulas: [
    { tex: String.raw`f_\text{eff} = f_c \times \frac{R_\text{in}}{R_s + R_\text{tip} + R_\text{in}}`, meaning: 'corner behind a probe tip resistor' },
    { tex: String.raw`\text{tilt} = \tanh\frac{T}{4\tau} = \tanh\frac{\pi f_c}{2f}`, meaning: 'droop across each top, share of the step' },
    { tex: String.raw`\lvert H \rvert = \frac{f}{\sqrt{f^2 + f_c^2}}`, meaning: 'what a sine keeps' },
    { tex: String.raw`\text{DC} \to 0`, meaning: 'a steady level is blocked' },
  ],
  example: `A 50 Hz square through a 1x probe on a channel AC-coupled at 10 Hz: tanh(π × 10 Hz / (2 × 50 Hz)) = tanh(0.314) ≈ **30 %** droop on every top. With a 10x probe the corner falls to 1 Hz and the droop to about 3.1 %.`,
  diagnose: {
    'probe.attenuation': 1,
    'scope.attenuationSetting': 1,
    'scope.coupling': 'ac',
    'scope.acCornerHz': 10,
    'signal.frequencyHz': 50,
    'signal.kind': 'square',
    'signal.expectedAmplitudeV': 5,
    'observed.tiltPct': 30,
  },
  fix: `Use DC coupling, and take a large DC level out with the offset control instead. If AC coupling must stay (a small ripple on a large rail), keep its corner far below the signal — a 10x probe helps — and do not read tops or DC levels from it.`,
  sources: [
    { label: 'Steady-state response of a first-order RC high-pass to a square wave', note: 'circuit analysis; checked with ngspice' },
    { label: 'AC-coupling corners of 1 MΩ inputs, a few Hz to about 10 Hz', note: 'common practice; check your scope' },
  ],
};
