import type { GeneratorLoad } from '../schemas/diagnosis';
import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng, factor } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  "Read the generator's output-load setting, then put a 50 Ω feed-through terminator at the scope input: a reading that now matches the set amplitude points here.";

/** The load a generator's "50 Ω" setting assumes, Ω. common practice: 50 Ω outputs set for a matched load. */
export const MATCHED_LOAD_OHM = 50;

/**
 * Voltage-divider gain of a source whose EMF is set for an assumed load, into a real load:
 * V_shown/V_set = k·R_L/(R_L + R_out), with k = (R_assumed + R_out)/R_assumed the factor the
 * generator raises its EMF by (2 for a 50 Ω output set for 50 Ω) and k = 1 for a high-Z
 * setting. Set for 50 Ω into a high impedance it shows 2×; set for high-Z into 50 Ω, ½.
 * source: voltage-divider rule for a Thevenin source V_emf, R_out into R_L.
 *
 * @param setting the load the amplitude setting assumes
 * @param outputResistanceOhm generator output resistance, Ω (50 for most)
 * @param loadResistanceOhm what the output really drives, Ω
 */
export function generatorShownRatio(setting: GeneratorLoad, outputResistanceOhm: number, loadResistanceOhm: number): number {
  const emfFactor = setting === '50-ohm' ? (MATCHED_LOAD_OHM + outputResistanceOhm) / MATCHED_LOAD_OHM : 1;
  return (emfFactor * loadResistanceOhm) / (loadResistanceOhm + outputResistanceOhm);
}

/**
 * Inverse: the load that gives a shown/set ratio r, R_L = r·R_out/(k − r). Undefined when no
 * positive load gives r (r ≤ 0 or r ≥ k).
 */
export function impliedLoadResistanceOhm(setting: GeneratorLoad, outputResistanceOhm: number, ratio: number): number | undefined {
  const emfFactor = setting === '50-ohm' ? (MATCHED_LOAD_OHM + outputResistanceOhm) / MATCHED_LOAD_OHM : 1;
  if (!(ratio > 0) || ratio >= emfFactor) return undefined;
  return (ratio * outputResistanceOhm) / (emfFactor - ratio);
}

/** What the generator drives: the recorded load, else the probe and scope input, Ω. */
export function generatorLoadOhm(setup: ResolvedSetup): number {
  return setup.loadResistanceOhm ?? setup.tipResistanceOhm + setup.scopeInputResistanceOhm;
}

const SETTING_WORDS: Record<GeneratorLoad, string> = { '50-ohm': 'a 50 Ω load', 'high-z': 'a high-impedance load' };
/** Within ±15 % of a setting's ratio counts as that setting (our tolerance). */
const RATIO_TOLERANCE = Math.log(1.15);
/** A ratio within this of 1 is no error worth a hypothesis (our threshold). */
const NO_ERROR = Math.log(1.1);
/** Plausible loads (our bounds, Ω). */
const PLAUSIBLE_LOAD_OHM = { low: 1, high: 1e9 } as const;
// our estimates: how often an unrecorded load setting, or an unrecorded load, is the culprit
const HIDDEN_PRIOR = { setting: 0.3, load: 0.25 } as const;

const FIX =
  "Set the generator's load setting to what it really drives (high-Z for a 1 MΩ scope input or a circuit input; 50 Ω only into a 50 Ω termination), or terminate the line in 50 Ω at the far end.";

/** Generator-load candidates: the recorded setting into the recorded load, a setting or a load implied by the amplitude. */
export function assessGeneratorLoad({ setup, observed }: ModelContext): Candidate[] {
  const candidates = [recordedSetting(setup)];
  const set = setup.expectedAmplitudeV;
  const seen = observed.amplitudeV;
  if (set === undefined || seen === undefined) return candidates;
  const ratio = seen / set;
  const outOhm = setup.sourceResistanceOhm;
  if (setup.generatorLoad === undefined) {
    const loadOhm = generatorLoadOhm(setup);
    for (const setting of ['50-ohm', 'high-z'] as const) {
      const gain = generatorShownRatio(setting, outOhm, loadOhm);
      if (Math.abs(Math.log(gain)) < NO_ERROR || Math.abs(Math.log(gain / ratio)) > RATIO_TOLERANCE) continue;
      const c = candidate(setup, setting, loadOhm, 'fitted');
      c.hiddenPrior = HIDDEN_PRIOR.setting;
      c.explanation = `The trace is ${factor(ratio)} times the expected amplitude, which fits a generator set for ${SETTING_WORDS[setting]}. ${c.explanation}`;
      c.estimates = { ...c.estimates, impliedGeneratorLoad: setting };
      candidates.push(c);
    }
    return candidates;
  }
  const recordedGain = generatorShownRatio(setup.generatorLoad, outOhm, generatorLoadOhm(setup));
  if (Math.abs(Math.log(ratio / recordedGain)) < NO_ERROR / 2) return candidates;
  const loadOhm = impliedLoadResistanceOhm(setup.generatorLoad, outOhm, ratio);
  if (loadOhm === undefined || loadOhm < PLAUSIBLE_LOAD_OHM.low || loadOhm > PLAUSIBLE_LOAD_OHM.high) return candidates;
  const c = candidate(setup, setup.generatorLoad, loadOhm, 'fitted');
  c.hiddenPrior = HIDDEN_PRIOR.load;
  c.explanation = `The trace fits the generator driving about ${eng(loadOhm, 'Ω')}. ${c.explanation}`;
  c.estimates = { ...c.estimates, impliedLoadResistanceOhm: loadOhm };
  if (setup.loadResistanceOhm !== undefined) c.contradictions = [{ field: 'circuit.loadResistanceOhm', recorded: setup.loadResistanceOhm, implied: loadOhm }];
  candidates.push(c);
  return candidates;
}

function candidate(setup: ResolvedSetup, setting: GeneratorLoad, loadOhm: number, basis: Candidate['basis']): Candidate {
  const outOhm = setup.sourceResistanceOhm;
  const gain = generatorShownRatio(setting, outOhm, loadOhm);
  const set = setup.expectedAmplitudeV;
  const emfV = set === undefined ? undefined : set * (setting === '50-ohm' ? (MATCHED_LOAD_OHM + outOhm) / MATCHED_LOAD_OHM : 1);
  const matched = Math.abs(Math.log(gain)) < NO_ERROR;
  return {
    cause: 'generator-load',
    basis,
    deviation: Math.abs(Math.log(gain)),
    predicted: set === undefined ? {} : { amplitudeV: set * gain },
    explanation:
      `Set for ${SETTING_WORDS[setting]}, the generator ${setting === '50-ohm' ? `raises its internal voltage to ${factor((MATCHED_LOAD_OHM + outOhm) / MATCHED_LOAD_OHM)} times the setting` : 'puts the set amplitude behind its output resistance'}` +
      `${emfV === undefined ? '' : ` (${eng(emfV, 'V')})`}; its ${eng(outOhm, 'Ω')} output into ${eng(loadOhm, 'Ω')} keeps R_L/(R_L + R_out) of that, ` +
      `so the load sees ${factor(gain)} times the set amplitude${set === undefined ? '' : `: ${eng(set * gain, 'V')} for ${eng(set, 'V')}`}.`,
    confirm: CONFIRM,
    fix: matched ? 'Nothing to change: the setting matches the load.' : FIX,
    estimates: { shownToSetRatio: gain, loadResistanceOhm: loadOhm },
    detailTags: matched ? [] : ['generator-load-setting'],
  };
}

function recordedSetting(setup: ResolvedSetup): Candidate {
  if (setup.generatorLoad === undefined) {
    return {
      cause: 'generator-load',
      basis: 'recorded',
      deviation: 0,
      predicted: {},
      explanation: "No generator load setting is recorded, so the setup says nothing about the generator's amplitude.",
      confirm: CONFIRM,
      fix: "If a generator drives the circuit, note its output-load setting (50 Ω or high-Z).",
      detailTags: [],
    };
  }
  return candidate(setup, setup.generatorLoad, generatorLoadOhm(setup), 'recorded');
}
