import type { HypothesisCause, Predicted } from '../schemas/diagnosis';
import { compare, type CompareOptions, type Term } from './scoring';
import type { Observed, ResolvedSetup } from './types';
import { SIGNIFICANT_IMPROVEMENT } from './verdict';
import { loadMovesTrace } from './loading';

/**
 * Causes whose prediction from the recorded setup is a fact of the recorded settings, and what
 * must be recorded for it to be one. Left out: models that lean on a typical value or a bound
 * rather than the record (compensation takes the probe as trimmed on a typical input, a ground
 * lead's overshoot is an upper bound, hum has no predicted level). Loading asserts on a
 * recorded source impedance, judged with that estimate's spread (`Candidate.recordSpread`).
 */
const ASSERTS_FROM_RECORD: Partial<Record<HypothesisCause, (setup: ResolvedSetup) => boolean>> = {
  'attenuation-mismatch': () => true,
  // a probe with a tip divider; without one (1x) a 50 Ω input only loads the source, which is loading's
  // estimate, and a generator set for 50 Ω already counts that divider in its set amplitude
  'termination-mismatch': (setup) => setup.tipResistanceOhm > 0,
  // what the generator drives: recorded, or the scope input when its impedance is recorded (else an assumed 1 MΩ)
  'generator-load': (setup) => setup.loadResistanceOhm !== undefined || !setup.assumed.has('scope.inputResistanceOhm'),
  // the screen window needs the offset too: a trace moved up or down is seldom recorded
  clipping: (setup) => setup.offsetV !== undefined,
  aliasing: () => true,
  // not through a typical 1x probe's bandwidth taken for an unrecorded one (a matched probe adds no stage)
  bandwidth: (setup) => !(setup.assumed.has('probe.bandwidthHz') && setup.probeBandwidthHz !== undefined),
  // the data-sheet corner is assumed unless recorded
  'ac-coupling': (setup) => setup.acCornerHz !== undefined,
  'common-mode': (setup) => setup.probeCmrrDb !== undefined,
  // through a passive probe, whose tip and the scope input are the load the model knows (an active or
  // differential probe loads with its own input); a generator's load setting says its set amplitude is
  // already the loaded one, its divider being generator-load's
  loading: (setup) =>
    setup.probeKind === 'passive' && !setup.assumed.has('circuit.sourceResistanceOhm') && setup.generatorLoad === undefined && loadMovesTrace(setup),
};

/** Whether this cause's recorded prediction, for this setup, is something the record itself says. */
export const assertsFromRecord = (cause: HypothesisCause, setup: ResolvedSetup) => ASSERTS_FROM_RECORD[cause]?.(setup) ?? false;

/**
 * With nothing observed, what the recorded setup says the scope will show: the assertions
 * above, and a recorded ground lead, whose ringing is predicted even though its overshoot is
 * only a bound. A lead or a source impedance taken as typical predicts nothing about this setup.
 */
const PREDICTS_FROM_RECORD: Partial<Record<HypothesisCause, (setup: ResolvedSetup) => boolean>> = {
  ...ASSERTS_FROM_RECORD,
  'ground-lead': (setup) => !setup.assumed.has('probe.groundLeadM') || !setup.assumed.has('probe.groundKind'),
};

/** Whether the recorded setup alone, with nothing observed, says this cause moves the trace. */
export const predictsFromRecord = (cause: HypothesisCause, setup: ResolvedSetup) => PREDICTS_FROM_RECORD[cause]?.(setup) ?? false;

/** Quantities a picture puts a number on, which an observation can check. */
const PICTURED = ['amplitudeV', 'riseTimeS', 'overshootPct', 'tiltPct', 'frequencyHz'] as const;

/** A predicted picture as it would read on the screen, limited to what was observed. */
export function pictureAsSeen(picture: Predicted, clipped: boolean, observed: Observed): Observed {
  const seen: Observed = {};
  for (const key of PICTURED) if (observed[key] !== undefined && picture[key] !== undefined) seen[key] = picture[key];
  if (observed.clipped !== undefined) seen.clipped = clipped;
  return seen;
}

/** What the recorded setup itself says the scope shows, through one cause. */
export interface RecordedAssertion {
  cause: HypothesisCause;
  predicted: Predicted;
  options: CompareOptions;
  explanation: string;
  /** The record says the screen is no measurement at all (`Candidate.notAMeasurement`): every hypothesis without the cause is wrong, whatever it pictures. */
  notAMeasurement?: boolean;
}

/**
 * What a hypothesis is charged for leaving out a cause that makes the screen no measurement:
 * a factor of ten at the ringing spread, (ln 10/0.3)² ≈ 59 in χ², beyond the fit gate for
 * any number of readings a case records (our choice).
 */
const NOT_A_MEASUREMENT_TERM = { residual: Math.log(10), sigma: 0.3 } as const;

/**
 * A cause predicted from the recorded setup alone (no value inferred) that moves an observed
 * quantity away from the faithful picture beyond the models' accuracy asserts that it does: a
 * 10x probe recorded on a 1x channel says the scope shows a tenth, whatever was seen. A cause
 * that makes the screen no measurement (`notAMeasurement`) always asserts.
 *
 * @param ideal the faithful picture as seen (`pictureAsSeen`)
 * @returns the assertion, or undefined when the recorded cause leaves what was observed alone
 */
export function recordedAssertion(assertion: RecordedAssertion, ideal: Observed): RecordedAssertion | undefined {
  // a screen that is no measurement rules out any reading, whatever it would show
  if (assertion.notAMeasurement) return assertion;
  return compare(assertion.predicted, ideal, assertion.options).chiSquare > SIGNIFICANT_IMPROVEMENT ? assertion : undefined;
}

/**
 * The recorded assertions a hypothesis would need to be wrong, with the residuals charged for
 * each: those of causes it does not name whose effect its own picture does not show (another
 * model of the same effect, such as a 50 Ω input and a generator set for a high impedance
 * halving the same signal, is not a contradiction).
 *
 * @param seen the hypothesis's picture as seen (`pictureAsSeen`)
 */
export function contradictedAssertions(causes: readonly HypothesisCause[], seen: Observed, assertions: readonly RecordedAssertion[]): { assertion: RecordedAssertion; terms: Term[] }[] {
  return assertions.flatMap((assertion) => {
    if (causes.includes(assertion.cause)) return [];
    if (assertion.notAMeasurement) return [{ assertion, terms: [{ quantity: `recorded ${assertion.cause}: no measurement`, ...NOT_A_MEASUREMENT_TERM }] }];
    const against = compare(assertion.predicted, seen, assertion.options);
    if (against.chiSquare <= SIGNIFICANT_IMPROVEMENT) return [];
    // one assertion is one test, charged its χ² whole: its quantities repeat ones already compared
    // with the observation, and a term each (most of them agreeing) would only widen the fit gate
    return [{ assertion, terms: [{ quantity: `recorded ${assertion.cause}`, residual: Math.sqrt(against.chiSquare), sigma: 1 }] }];
  });
}
