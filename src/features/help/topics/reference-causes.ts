import type { HelpTopic } from './types';

export const COMMON_MODE_TOPIC: HelpTopic = {
  slug: 'common-mode',
  cause: 'common-mode',
  title: 'Common-mode or reference error',
  lead: "A differential probe lets part of the reference node's swing through; a grounded probe on a floating node is a short, not a measurement.",
  onScreen: `- Spikes or steps in step with a **switching node** appear on a signal that should be clean, such as a high-side gate drive.
- Touching both differential inputs to the same point still shows a trace.
- With a passive probe: a **bang, a tripped breaker or a dead circuit** when the ground clip touched a node away from earth.`,
  physics: `A differential probe measures the difference between its two inputs and should ignore what they share: the **common mode**, here the reference node's swing from earth. It does so only by its common-mode rejection ratio: it passes **V_cm × 10^(−CMRR/20)**. Rejection is high at mains frequencies (60–80 dB is usual) and falls with frequency, so the fast edges of a switching node leak most.

A passive (or single-ended active) probe has no such input: its ground clip is **protective earth** through the scope. Clipped to a node away from earth it shorts that node to earth. That is a **hazard**, never a measurement: fault currents can destroy the probe, the scope or the circuit, and floating the scope to avoid it puts its case at the node's voltage. So when a case records a single-ended probe with its reference on such a node, the engine never calls the trace true, however right it reads: any other error it finds (a probe switch, a long lead) is offered only together with the short.`,
  formulas: [
    { tex: String.raw`V_\text{leak} = V_\text{cm} \times 10^{-\text{CMRR}/20}`, meaning: 'common mode passed by a differential probe' },
    { tex: String.raw`\text{CMRR} = 20 \log_{10}\frac{V_\text{cm}}{V_\text{leak}}`, meaning: 'the rejection an observed leak implies' },
  ],
  example: `A half-bridge switch node swings 400 V; a differential probe with 50 dB of rejection at 100 kHz passes 400 V × 10^(−50/20) ≈ **1.26 V** of it — beside a 10 V gate signal, 13 % of it.`,
  diagnose: {
    'probe.kind': 'differential',
    'probe.cmrrDb': 50,
    'circuit.referenceV': 400,
    'circuit.highestVoltageV': 400,
    'signal.expectedAmplitudeV': 10,
    'signal.frequencyHz': 100e3,
    'signal.kind': 'square',
    'observed.amplitudeV': 11.3,
  },
  fix: `Use a differential probe (or an isolated input) rated for the voltage and its measurement category, with enough rejection at the signal's edge rates; keep its leads short, matched and twisted. Never float the scope. Follow local codes and licensed practice.`,
  sources: [
    { label: 'Common-mode rejection ratio, CMRR = 20·log10(A_diff / A_cm)', note: 'definition' },
    { label: 'IEC 61010-1:2010, 6.3.1', note: 'hazardous-live levels; see the Safety page' },
    { label: 'Passive probe grounds are tied to protective earth through the scope', note: 'common practice' },
  ],
};

export const MAINS_PICKUP_TOPIC: HelpTopic = {
  slug: 'mains-pickup',
  cause: 'mains-pickup',
  title: 'Mains hum or ground loop',
  lead: 'A 50 or 60 Hz wave (or its harmonics) rides on every trace, whatever the circuit does.',
  onScreen: `- **Hum on every channel**: a slow wave under the signal, locked to the mains (trigger on "line" and it stands still).
- It changes when cables move, when the generator or a laptop is plugged in, or when the circuit is powered from a battery.
- A spectrum shows lines at 50 Hz or 60 Hz, often at 100/120 Hz and odd multiples.`,
  physics: `Two earthed instruments joined by a probe ground or a cable shield close a **loop through the building wiring**. Any current in that loop (leakage, magnetic coupling from nearby transformers) drops a small voltage along the shield — and that voltage is added to the measurement. High-impedance nodes also pick up the electric field of mains wiring directly.

Either way the disturbance is locked to the mains, so it lies at the mains frequency and its **harmonics**: a loop shows mostly the fundamental, rectifier charging currents the second harmonic (100 or 120 Hz), non-linear loads odd multiples.`,
  formulas: [
    { tex: String.raw`f_\text{hum} = n \times f_\text{mains},\quad n = 1, 2, 3 \ldots`, meaning: 'where mains-locked hum lies' },
    { tex: String.raw`n = \operatorname{round}\frac{f_\text{hum}}{f_\text{mains}}`, meaning: 'which harmonic an observed line is' },
  ],
  example: `A line at **100 Hz** on 50 Hz mains is harmonic n = 100 / 50 = 2: rectifier charging current in a shared ground, not a ground loop's 50 Hz.`,
  diagnose: {
    'circuit.mainsConnected': 'true',
    'circuit.mainsFrequencyHz': 50,
    'signal.expectedAmplitudeV': 1,
    'signal.frequencyHz': 1e3,
    'signal.kind': 'sine',
    'observed.humFrequencyHz': 100,
  },
  fix: `Break the loop: one ground point, scope and circuit on the same outlet strip, short probe grounds, no second ground path through a generator, USB cable or another channel; twist or shield leads to high-impedance nodes. **Never lift a protective earth** to do it; use a differential or isolated probe instead.`,
  sources: [
    { label: 'IEC 60038', note: '50 Hz and 60 Hz supply systems' },
    { label: 'Fourier series of a mains-locked disturbance', note: 'lines at whole multiples of f_mains' },
    { label: 'Ground loops between earthed instruments', note: 'common practice' },
  ],
};

export const GENERATOR_LOAD_TOPIC: HelpTopic = {
  slug: 'generator-load',
  cause: 'generator-load',
  title: 'Generator load setting mismatch',
  lead: 'The scope reads double (or half) what the generator is set to.',
  onScreen: `- A generator set to 1 Vpp shows **2 Vpp** on a scope's 1 MΩ input — it **reads double**.
- Or the reverse: set for high-Z, it shows **half** into a 50 Ω termination.
- The shape is perfect; only the amplitude is off by a factor near 2.`,
  physics: `A lab generator has a 50 Ω output resistance. It cannot know what it drives, so its amplitude setting **assumes a load**. Set for 50 Ω, it makes its internal voltage twice the setting, so a 50 Ω load (a divider of two) gets exactly the setting — and a high impedance gets the whole internal voltage: **double**. Set for high-Z, the internal voltage equals the setting: a high impedance gets the setting, 50 Ω gets **half**.

In general the load sees V_set × k × R_L / (R_L + 50 Ω), with k = 2 for the 50 Ω setting and 1 for high-Z.`,
  formulas: [
    { tex: String.raw`V_\text{shown} = V_\text{set} \times \frac{2 R_L}{R_L + 50\,\Omega}`, meaning: 'generator set for 50 Ω' },
    { tex: String.raw`V_\text{shown} = V_\text{set} \times \frac{R_L}{R_L + 50\,\Omega}`, meaning: 'generator set for high-Z' },
    { tex: String.raw`R_L = \frac{r \times 50\,\Omega}{k - r},\quad r = \frac{V_\text{shown}}{V_\text{set}}`, meaning: 'the load an observation implies' },
  ],
  example: `Set to 1 Vpp for a 50 Ω load, cabled straight into a 1 MΩ input: 1 V × 2 × 1 MΩ / (1 MΩ + 50 Ω) ≈ **2.0 V**. Put a 50 Ω feed-through at the input and it reads 1 V.`,
  diagnose: {
    'probe.attenuation': 1,
    'scope.attenuationSetting': 1,
    'scope.inputResistanceOhm': 1e6,
    'circuit.sourceResistanceOhm': 50,
    'circuit.loadResistanceOhm': 1e6,
    'signal.expectedAmplitudeV': 1,
    'signal.generatorLoad': '50-ohm',
    'signal.frequencyHz': 1e3,
    'signal.kind': 'sine',
    'observed.amplitudeV': 2,
  },
  fix: `Set the generator's load setting to what it really drives: high-Z for a 1 MΩ scope input or a circuit input, 50 Ω only into a 50 Ω termination — or terminate the line in 50 Ω at the far end.`,
  sources: [
    { label: 'Voltage-divider rule for a Thevenin source', note: 'circuit law; checked with ngspice' },
    { label: '50 Ω generator outputs with a load setting', note: 'common practice' },
  ],
};
