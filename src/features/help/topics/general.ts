import type { HelpTopic } from './types';

export const SAFETY_TOPIC: HelpTopic = {
  slug: 'safety',
  title: 'Safety: mains, hazardous voltages and references away from earth',
  lead: 'When a case involves mains-connected equipment, a probe reference away from earth or hazardous-live voltages, read this first.',
  onScreen: `Falsetrace shows a red caution on a case, in the editor and on the Diagnose screen when any recorded voltage calls for it — not only the expected amplitude:

- the equipment under test is **connected to the mains**;
- the node a probe's ground or reference lead is on is **away from earth** (a switch node, a high-side source, a mains-referenced primary) — with a passive probe this is a **hazard**, not a measurement;
- the expected amplitude, the reference node's voltage or the highest voltage present is above the **hazardous-live** levels of IEC 61010-1:2010, 6.3.1: **33 V rms, 46.7 V peak or 70 V DC** in normal conditions, and **16 V rms, 22.6 V peak or 35 V DC** in wet locations.

Where Falsetrace warns from a lower threshold than the standard's, that threshold is our own conservative choice, and the caution says so.`,
  physics: `A passive probe's ground clip is **not floating**: it is tied to the scope's chassis and through the power cord to protective earth. Clip it to a node that is not at earth potential — anywhere on the primary side of a mains supply, the switch node of a half bridge, the source of a high-side switch — and you short that node to earth through the probe. At best a fuse or residual-current device trips; at worst the ground lead vaporises or a second probe's ground completes a short through the scope.

**Floating the scope** (lifting its earth to get around this) is worse: the chassis, every BNC shell and every other probe's ground then sit at the node's potential, within reach of your hands.

Probes have voltage ratings that fall with frequency (derating), and ratings per measurement category (CAT II, CAT III…) for the energy available where you measure. A 50 Ω input has a power rating of its own (typically about 5 V rms).`,
  formulas: [
    { tex: String.raw`33\ \text{V rms} \cdot 46.7\ \text{V peak} \cdot 70\ \text{V DC}`, meaning: 'hazardous live, normal conditions (IEC 61010-1:2010, 6.3.1)' },
    { tex: String.raw`16\ \text{V rms} \cdot 22.6\ \text{V peak} \cdot 35\ \text{V DC}`, meaning: 'hazardous live, wet locations (same clause)' },
    { tex: String.raw`V_\text{peak} = \sqrt{2}\, V_\text{rms}`, meaning: '230 V rms mains → about 325 V peak' },
  ],
  example: `A 12 V gate drive looks harmless, but if the gate belongs to a high-side switch on a 400 V bus, the probe's reference sits on a node that swings 400 V from earth: a differential or isolated probe rated for 400 V and its measurement category is the right tool, whatever the gate's own 12 V.`,
  fix: `- Never float the scope.
- Put a passive probe's ground only on a node at earth potential. For anything else use **differential or isolated probing**; power the unit from an isolation transformer where appropriate.
- Check the probe's **voltage and measurement-category rating**, and its **derating with frequency**, against what you will measure.
- Connect and move probes with the circuit de-energised; keep one hand away from the bench.
- Follow local codes and licensed practice; ask before working on mains equipment if you are not trained for it.`,
  sources: [
    { label: 'IEC 61010-1:2010, Safety requirements for electrical equipment for measurement, control and laboratory use, 6.3.1', note: 'levels of hazardous live: 33 V rms / 46.7 V peak / 70 V DC normal, 16 V / 22.6 V / 35 V wet' },
    { label: 'Passive probe ground tied to protective earth through the scope', note: 'common practice' },
    { label: '50 Ω scope inputs rated about 5 V rms', note: 'common practice; check your scope' },
  ],
};

export const ENGINE_TOPIC: HelpTopic = {
  slug: 'engine',
  title: 'How the diagnosis engine weighs causes',
  lead: 'Each cause predicts what the screen should show; the engine says whether one fits, whether the trace is simply true, or that nothing it knows explains it.',
  onScreen: `On Diagnose, in the case editor and on every case page, the engine weighs the twelve causes and first gives a **verdict**: a measurement error (a cause fits), the trace is true (the recorded setup already predicts what you saw — debug the circuit), or unexplained (nothing it knows fits; also when the trace looks true but the recorded settings say the scope could not show it that way, such as a 10x probe recorded on a 1x channel, which means a recorded value is wrong). Then it lists its hypotheses, most likely first, each with its **predicted** values next to what was **observed**, whether it fits, an explanation, a fix and **one bench action that confirms it**. A hypothesis may combine two causes, such as a 10x probe read at 1x that also rings on a long lead. Values you did not record are filled with typical ones and listed as assumptions — correct them and the ranking updates.`,
  physics: `Every cause is a small physical model (see its Help page). From the recorded setup it predicts what the scope shows: amplitude, rise time, overshoot, ringing frequency, tilt, alias frequency, hum. Where the observation allows, a model also infers the one value that is often not recorded — a switch position, a source impedance, a lead length — within physically plausible bounds.

Each hypothesis is compared with the observation by **log-ratio residuals**: a factor of two counts the same whether too big or too small. A hypothesis **fits** when its residual is under the fit gate, chosen from how precisely the models and screen readings can be trusted. Recorded values are evidence: a fit that needs a value contradicting one you recorded (a 90 cm lead when 1 cm was written down) is penalised.`,
  formulas: [
    { tex: String.raw`r = \ln\frac{\text{predicted}}{\text{observed}}`, meaning: 'residual of one quantity' },
    { tex: String.raw`\text{residual} = \sqrt{\textstyle\sum r^2}`, meaning: 'of a hypothesis, over what was observed' },
    { tex: String.raw`\text{fits} \iff \text{residual} < \text{gate}`, meaning: 'only fitting hypotheses add tags or pass the review check' },
  ],
  fix: `Record what you know — probe ratio, channel setting, input impedance, source impedance, lead length, coupling, sample rate — and at least one observed value. The more is recorded, the fewer assumptions the engine needs, and the sharper the verdict.`,
  sources: [
    { label: 'The models of each cause', note: 'see their Help pages' },
    { label: 'Fit gate, spreads and bounds', note: 'our own estimates, shown in the code next to each value' },
  ],
};
