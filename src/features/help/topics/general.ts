import type { HelpTopic } from './types';

export const SAFETY_TOPIC: HelpTopic = {
  slug: 'safety',
  title: 'Safety: mains and hazardous voltages',
  lead: 'When a case involves mains-connected equipment or hazardous-live voltages, read this first.',
  onScreen: `Falsetrace shows a red caution on a case, in the editor and on the Diagnose screen when:

- the equipment under test is **connected to the mains**, or
- a voltage the probe may touch is above the **hazardous-live** levels: **30 V rms, 42.4 V peak or 60 V DC**.`,
  physics: `A passive probe's ground clip is **not floating**: it is tied to the scope's chassis and through the power cord to protective earth. Clip it to a node that is not at earth potential — anywhere on the primary side of a mains supply — and you short that node to earth through the probe. At best a fuse or residual-current device trips; at worst the ground lead vaporises.

**Floating the scope** (lifting its earth to get around this) is worse: the chassis, every BNC shell and every other probe's ground then sit at the node's potential, within reach of your hands.

Probes have voltage ratings that fall with frequency (derating), and ratings per measurement category (CAT II, CAT III…) for the energy available where you measure.`,
  formulas: [
    { text: '30 V rms · 42.4 V peak · 60 V DC', meaning: 'hazardous-live levels, dry location, normal condition' },
    { text: 'V_peak = √2 · V_rms', meaning: '230 V rms mains → about 325 V peak' },
  ],
  fix: `- Never float the scope.
- Use **differential or isolated probing** for anything not referenced to earth; power the unit from an isolation transformer where appropriate.
- Check the probe's **voltage and measurement-category rating**, and its **derating with frequency**, against what you will measure.
- Connect and move probes with the circuit de-energised; keep one hand away from the bench.
- Follow local codes and licensed practice; ask before working on mains equipment if you are not trained for it.`,
  sources: [
    { label: 'IEC 61010-1, safety requirements for electrical equipment for measurement, control and laboratory use', note: 'hazardous-live limits; check the edition your lab works to' },
    { label: 'Passive probe ground tied to protective earth through the scope', note: 'common practice' },
  ],
};

export const ENGINE_TOPIC: HelpTopic = {
  slug: 'engine',
  title: 'How the diagnosis engine ranks causes',
  lead: 'Each cause predicts what the screen should show; the one that predicts the observation best wins.',
  onScreen: `On Diagnose, in the case editor and on every case page, the engine lists the twelve causes, most likely first, each with its **predicted** values next to what was **observed**, an explanation and a fix. Values you did not record are filled with typical ones and listed as assumptions — correct them and the ranking updates.`,
  physics: `Every cause is a small physical model (see its Help page). From the recorded setup it predicts what the scope shows: amplitude, rise time, overshoot, ringing frequency. Where the observation allows, a model also fits the one parameter that is often not recorded — a switch position, a source impedance, a lead length — and offers that as a second candidate.

Each candidate is compared with the observation by **log-ratio residuals**: a factor of two counts the same whether too big or too small. The residuals are weighed by how precisely such quantities are usually read off a screen, combined with how often the cause (or the hidden parameter) is the culprit, and normalised so the likelihoods add up to one.`,
  formulas: [
    { text: 'r = ln(predicted / observed)', meaning: 'residual of one quantity' },
    { text: 'likelihood ∝ prior × exp(−Σ (r / σ)² / 2)', meaning: 'score of a hypothesis' },
    { text: 'Σ likelihood = 1', meaning: 'over the causes listed' },
  ],
  fix: `Record what you know — probe ratio, channel setting, input impedance, source impedance, lead length — and at least one observed value. The more is recorded, the fewer assumptions the engine needs, and the sharper the ranking.`,
  sources: [
    { label: 'The models of each cause', note: 'see their Help pages' },
    { label: 'Spreads σ and priors', note: 'our own estimates, shown in the code next to each value' },
  ],
};
