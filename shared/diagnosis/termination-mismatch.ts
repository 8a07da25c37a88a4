import type { Risk } from '../schemas/diagnosis';
import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng, factor, percent } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  "Look at the channel's input impedance menu; switch it to 1 MΩ and the amplitude should jump back to the expected level.";

/** Inputs below this are terminations, not high-impedance inputs (our threshold). */
export const LOW_IMPEDANCE_INPUT_OHM = 1000;

/** Usual rating of a 50 Ω scope input: 5 V rms, which is 0.5 W. common practice */
export const FIFTY_OHM_INPUT_LIMIT = { rmsV: 5, powerW: 0.5 } as const;

/**
 * Attenuation a passive probe really gives into a low-impedance input:
 * (R_tip + R_in)/R_in, e.g. (9 MΩ + 50 Ω)/50 Ω = 180,001.
 * source: resistive voltage divider.
 *
 * @param tipResistanceOhm the probe's series tip resistor, Ω
 * @param inputResistanceOhm the scope input it drives, Ω
 */
export function terminatedAttenuation(tipResistanceOhm: number, inputResistanceOhm: number): number {
  return (tipResistanceOhm + inputResistanceOhm) / inputResistanceOhm;
}

/**
 * Fraction of the open-circuit signal across the scope input: R_in/(R_s + R_tip + R_in).
 * source: resistive voltage divider.
 */
export function inputFraction(sourceResistanceOhm: number, tipResistanceOhm: number, inputResistanceOhm: number): number {
  return inputResistanceOhm / (sourceResistanceOhm + tipResistanceOhm + inputResistanceOhm);
}

/** Power dissipated in a resistive input, P = V²/R, in W. source: Joule's law. */
export function inputPowerW(rmsV: number, inputResistanceOhm: number): number {
  return (rmsV * rmsV) / inputResistanceOhm;
}

/**
 * Displayed amplitude relative to the true one when only the termination is wrong: the
 * probe's nominal ratio a would be right into its design input, but into R_in the chain
 * divides by (R_s + R_tip + R_in)/R_in instead: shown/true = a·R_in/(R_s + R_tip + R_in).
 */
export function terminationShownRatio(setup: ResolvedSetup, inputResistanceOhm = setup.scopeInputResistanceOhm): number {
  return (
    setup.probeAttenuation * inputFraction(setup.sourceResistanceOhm, setup.tipResistanceOhm, inputResistanceOhm)
  );
}

const HIDDEN_FIFTY_OHM_PRIOR = 0.15; // our estimate: the input menu is rarely recorded wrongly
const MATCH_TOLERANCE = 0.3; // ln units, ±35 %

/** Termination candidates: the recorded input, and a 50 Ω input the record missed. */
export function assessTermination({ setup, observed }: ModelContext): Candidate[] {
  const rin = setup.scopeInputResistanceOhm;
  const expected = setup.expectedAmplitudeV;
  if (rin < LOW_IMPEDANCE_INPUT_OHM) return [lowImpedance(setup, rin, 'recorded')];

  const candidates: Candidate[] = [
    {
      cause: 'termination-mismatch',
      basis: 'recorded',
      deviation: 0,
      predicted: { amplitudeV: expected },
      explanation: `The input is ${eng(rin, 'Ω')}, the high-impedance setting passive probes are built for, so there is no termination error.`,
      confirm: CONFIRM,
      fix: 'Nothing to change; if an amplitude is thousands of times too small, check that the input menu really reads 1 MΩ and not 50 Ω.',
      detailTags: [],
    },
  ];
  if (expected !== undefined && observed.amplitudeV !== undefined) {
    const fiftyRatio = terminationShownRatio(setup, 50);
    // Only worth suggesting when a 50 Ω input would change what the scope shows.
    const distinct = Math.abs(Math.log(fiftyRatio)) > MATCH_TOLERANCE;
    if (distinct && Math.abs(Math.log(observed.amplitudeV / expected / fiftyRatio)) < MATCH_TOLERANCE) {
      const hidden = lowImpedance(setup, 50, 'fitted');
      hidden.hiddenPrior = HIDDEN_FIFTY_OHM_PRIOR;
      hidden.explanation = `The observed amplitude fits a 50 Ω input, not the ${eng(rin, 'Ω')} recorded. ${hidden.explanation}`;
      candidates.push(hidden);
    }
  }
  return candidates;
}

function lowImpedance(setup: ResolvedSetup, rin: number, basis: Candidate['basis']): Candidate {
  const expected = setup.expectedAmplitudeV;
  const shown = terminationShownRatio(setup, rin);
  const rtip = setup.tipResistanceOhm;
  const actualRatio = terminatedAttenuation(rtip, rin);
  const numbers =
    expected === undefined ? '' : ` (${eng(expected * shown, 'V')} instead of ${eng(expected, 'V')})`;
  const explanation =
    rtip > 0
      ? `A ${factor(setup.probeAttenuation)}x passive probe is built to divide into 1 MΩ. Into ${eng(rin, 'Ω')} its ${eng(rtip, 'Ω')} tip resistor divides by (R_tip + R_in)/R_in = ${factor(actualRatio)} instead, so the scope shows about 1/${factor(1 / shown)} of the signal${numbers}.`
      : `The ${eng(rin, 'Ω')} input loads the ${eng(setup.sourceResistanceOhm, 'Ω')} source directly, so the scope shows ${percent(shown * 100)} of the open-circuit signal${numbers}.`;
  const fix =
    rtip > 0
      ? 'Set the channel input to 1 MΩ for a passive high-impedance probe; keep 50 Ω for coax from 50 Ω sources and for probes designed for a 50 Ω input.'
      : 'Use the 1 MΩ input (and a 10x probe) on high-impedance nodes; the 50 Ω input suits 50 Ω sources fed by coax.';
  const tags = [Math.abs(rin - 50) <= 10 ? '50-ohm-input' : 'low-impedance-input'];
  if (rtip > 0) tags.push('passive-probe-into-50-ohm');
  return {
    cause: 'termination-mismatch',
    basis,
    deviation: Math.abs(Math.log(shown)),
    predicted: { amplitudeV: expected === undefined ? undefined : expected * shown },
    explanation,
    confirm: CONFIRM,
    fix,
    estimates: { actualAttenuation: actualRatio, shownToTrueRatio: shown, inputResistanceOhm: rin },
    detailTags: tags,
    risks: basis === 'recorded' ? overloadRisks(setup, rin) : undefined,
  };
}

/**
 * Worst case for the input's power rating: the amplitude across the input treated as a DC
 * level (its rms can be no larger), against 5 V rms / 0.5 W.
 */
function overloadRisks(setup: ResolvedSetup, rin: number): Risk[] {
  if (setup.expectedAmplitudeV === undefined) return [];
  const volts = setup.expectedAmplitudeV * inputFraction(setup.sourceResistanceOhm, setup.tipResistanceOhm, rin);
  const watts = inputPowerW(volts, rin);
  if (volts <= FIFTY_OHM_INPUT_LIMIT.rmsV && watts <= FIFTY_OHM_INPUT_LIMIT.powerW) return [];
  return [
    {
      id: 'low-impedance-input-overload',
      level: 'caution',
      message: `Up to ${eng(volts, 'V')} (${eng(watts, 'W')}) could reach the ${eng(rin, 'Ω')} input, above the usual 5 V rms / 0.5 W rating: reduce the signal or add an attenuator before connecting.`,
    },
  ];
}
