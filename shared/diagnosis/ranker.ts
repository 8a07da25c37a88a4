import type { DiagnosisInput, DiagnosisResult, Hypothesis, HypothesisCause, Predicted, Risk } from '../schemas/diagnosis';
import type { Candidate, Observed } from './types';
import { observedOf, resolveSetup } from './defaults';
import { applicability, compare, summarise, type CompareOptions, type Comparison } from './scoring';
import { contradictionTerms } from './evidence';
import { faithfulPicture, faithfulWording, FAITHFUL_CONFIRM } from './faithful';
import { composePredictions } from './combination';
import { decideVerdict, fitGate, SIGNIFICANT_DEVIATION, SIGNIFICANT_IMPROVEMENT } from './verdict';
import { assertsFromRecord, contradictedAssertions, pictureAsSeen, predictsFromRecord, recordedAssertion, type RecordedAssertion } from './record-consistency';
import { setupRisks } from './safety-risks';
import { MODELS } from './models';

/** Prior that a trace is true before anything is compared (our estimate: even odds, since traces are filed because they look suspect but most setups are sound). */
export const FAITHFUL_PRIOR = 0.5;
/**
 * A combined hypothesis pays for its extra cause twice: the product of its members' priors,
 * and one unit of log-likelihood for the extra freedom (Akaike's penalty of one per added
 * parameter; source: Akaike, IEEE Trans. Automatic Control 19 (1974), AIC = 2k − 2 ln L).
 */
export const COMBINATION_LOG_PENALTY = 1;
/** At most this many combined hypotheses are returned (the best by score). */
const MAX_COMBINATIONS = 3;

/** On equal scores, prefer what every setup has over a mismatch someone would have to make. */
const TIE_ORDER: HypothesisCause[] = ['faithful', 'ground-lead', 'bandwidth', 'loading', 'compensation', 'termination-mismatch', 'attenuation-mismatch'];

/** A hypothesis being scored: one candidate, two combined, or the faithful reading. */
interface Scored {
  causes: HypothesisCause[];
  /** RSS of the log-ratio residuals against the observation alone (the contract's `residual`). */
  observedResidual: number;
  members: Candidate[];
  predicted: Predicted;
  comparison: Comparison;
  logScore: number;
  deviation: number;
  /** Predicts something the faithful picture does not, beyond the models' accuracy. */
  distinct: boolean;
  fits: boolean;
  /** Recorded assertions this hypothesis would need to be wrong (`record-consistency.ts`). */
  contradicted?: RecordedAssertion[];
}

/**
 * Runs every cause model on a case and ranks the hypotheses against what was observed.
 *
 * Each model predicts what the scope shows; quantities it does not model take the faithful
 * picture (`faithful.ts`). Score = ln prior − χ²/2, χ² = Σ(rᵢ/σᵢ)² over log-ratio residuals
 * against the observation and against recorded values a fit contradicts (`evidence.ts`). The
 * prior is the cause's applicability (from the size of the error it predicts) or, for a fitted
 * candidate, how often its hidden parameter is the culprit. A hypothesis fits when its χ² is
 * under the gate (`verdict.ts`) and, for a cause, it predicts something the faithful picture
 * does not. A cause the recorded settings themselves imply (a 10x probe on a 1x channel) is
 * charged, on what was observed, to every hypothesis whose picture leaves it out, the true trace
 * included (`record-consistency.ts`): the record rules such a reading out. Returned: the
 * faithful reading, the best candidate of each cause, and combined
 * causes that explain materially more than either alone; likelihoods are normalised over all
 * of them. The verdict's leading hypothesis comes first; no other is given more belief than it.
 */
export function diagnose(input: DiagnosisInput): DiagnosisResult {
  const { setup, assumptions } = resolveSetup(input);
  const observed = observedOf(input);
  const reference = faithfulPicture(setup);
  const candidates = MODELS.flatMap((model) => model({ setup, observed }));

  const faithfulComparison = compare(reference, observed);
  const faithful: Scored = {
    causes: ['faithful'],
    members: [],
    predicted: reference,
    comparison: faithfulComparison,
    observedResidual: faithfulComparison.residual ?? 0,
    logScore: Math.log(FAITHFUL_PRIOR) - faithfulComparison.chiSquare / 2,
    deviation: 0,
    distinct: false,
    fits: passesGate(faithfulComparison),
  };

  const singles = candidates.map((c) => scoreSingle(c, reference, observed));
  const bestPerCause = new Map<HypothesisCause, Scored>();
  for (const s of singles) {
    const current = bestPerCause.get(s.causes[0]);
    if (!current || s.logScore > current.logScore) bestPerCause.set(s.causes[0], s);
  }
  const anyObserved = faithfulComparison.count > 0;
  // a recorded cause that moves the trace on the record alone, not on a typical value standing in for one
  const predictedByRecord = (s: Scored) => s.distinct && s.members.every((m) => m.basis === 'recorded' && (m.notAMeasurement || predictsFromRecord(m.cause, setup)));
  const combos = combinations(singles, reference, observed, anyObserved);
  const causeHypotheses = [...bestPerCause.values(), ...combos];

  // what the recorded setup itself says the scope shows where that is not a true trace: a
  // hypothesis without such a cause (the true trace too) would need a recorded value to be wrong
  const ideal = pictureAsSeen(reference, false, observed);
  const assertions = singles.flatMap((s) => {
    const [m] = s.members;
    if (m.basis !== 'recorded' || !s.distinct || !(m.notAMeasurement || assertsFromRecord(m.cause, setup))) return [];
    // what the setup allows is its flat level: a needle as tall as the true step is no true trace
    const options = { ...compareOptionsOf(s.members, Boolean(m.overshootUpperBound), reference), needleReadings: false, ...m.recordSpread };
    const a = recordedAssertion({ cause: m.cause, predicted: s.predicted, options, explanation: m.explanation, notAMeasurement: m.notAMeasurement }, ideal);
    return a ? [a] : [];
  });
  for (const h of [faithful, ...causeHypotheses]) chargeContradictions(h, assertions, observed, ideal);

  const verdict = decideVerdict({
    faithfulFits: faithful.fits,
    faithfulChiSquare: faithful.comparison.chiSquare,
    fittingCauseChiSquares: causeHypotheses.filter((h) => h.fits).map((h) => h.comparison.chiSquare),
    observed: anyObserved,
    setupPredictsError: singles.some(predictedByRecord),
  });

  const all = [faithful, ...causeHypotheses];
  const leader =
    verdict === 'faithful'
      ? faithful
      : best(verdict === 'measurement-error' ? causeHypotheses.filter((h) => h.fits) : all) ?? faithful;
  const capped = all.map((h) => ({ h, score: h === leader ? h.logScore : Math.min(h.logScore, leader.logScore) }));
  const top = leader.logScore;
  const weights = capped.map((c) => Math.exp(c.score - top));
  const total = weights.reduce((a, b) => a + b, 0);
  const ranked = capped
    .map((c, i) => ({ ...c, likelihood: weights[i] / total }))
    .sort(
      (a, b) =>
        Number(b.h === leader) - Number(a.h === leader) ||
        b.score - a.score ||
        b.h.deviation - a.h.deviation ||
        a.h.causes.length - b.h.causes.length ||
        tieRank(a.h.causes[0]) - tieRank(b.h.causes[0]),
    );

  const hypotheses: Hypothesis[] = ranked.map(({ h, likelihood }) => toHypothesis(h, likelihood, setup));
  // a cause tags the case only where it explains what a true trace does not: when the true trace
  // does not fit, or the cause fits significantly better; with nothing observed, where the record
  // itself predicts it (the verdict's own tests). A cause whose telling prediction was not observed
  // (the ringing of an assumed lead, with no overshoot read) fits as well as the true trace, and
  // says nothing about this case
  const explainsMore = (h: Scored) =>
    anyObserved ? !faithful.fits || faithful.comparison.chiSquare - h.comparison.chiSquare > SIGNIFICANT_IMPROVEMENT : predictedByRecord(h);
  const tags = new Set<string>();
  for (const { h } of ranked) {
    if (!h.fits || h.causes[0] === 'faithful' || !explainsMore(h)) continue;
    for (const cause of h.causes) tags.add(cause);
    for (const m of h.members) {
      m.detailTags.forEach((t) => tags.add(t));
    }
  }
  const risks = dedupe([...candidates.filter((c) => c.basis === 'recorded').flatMap((c) => c.risks ?? []), ...setupRisks(setup)]);
  return { verdict, hypotheses, tags: [...tags], assumptions, risks };
}

const tieRank = (cause: HypothesisCause) => {
  const i = TIE_ORDER.indexOf(cause);
  return i < 0 ? TIE_ORDER.length : i;
};

/** χ² under the fit gate for the number of quantities compared (`verdict.ts`). */
const passesGate = (c: Comparison) => c.chiSquare <= fitGate(c.count);

const best = (list: Scored[]) => list.reduce<Scored | undefined>((a, h) => (a && a.logScore >= h.logScore ? a : h), undefined);

/** Prior of a recorded fact that voids the measurement: as applicable as a cause gets (our choice). */
const NOT_A_MEASUREMENT_PRIOR = 0.9;

function priorOf(c: Candidate): number {
  if (c.notAMeasurement) return NOT_A_MEASUREMENT_PRIOR;
  return c.basis === 'fitted' ? (c.hiddenPrior ?? 0.1) : applicability(c.deviation);
}

/** The candidate's own values over the reference, with unset fields left out. */
function merge(reference: Predicted, own: Predicted): Predicted {
  const merged: Predicted = {};
  const keys = new Set([...Object.keys(reference), ...Object.keys(own)] as (keyof Predicted)[]);
  for (const key of keys) {
    const value = own[key] ?? reference[key];
    if (value !== undefined && Number.isFinite(value)) merged[key] = value;
  }
  return merged;
}

/** Whether a prediction differs from the faithful picture beyond the models' accuracy. */
function distinctFrom(reference: Predicted, predicted: Predicted, deviation: number): boolean {
  const asSeen: Observed = { ...predicted };
  return (
    compare(reference, asSeen).chiSquare > SIGNIFICANT_IMPROVEMENT ||
    (predicted.spikeV ?? 0) > 0 ||
    Math.abs(deviation) > SIGNIFICANT_DEVIATION
  );
}

/** The hypothesis says the trace runs off the screen (the clipping model's estimate). */
const predictsClipping = (members: Candidate[]) => members.some((m) => m.estimates?.screenWindow === 'clipped');

/** How a hypothesis of these candidates is compared with what was seen. */
function compareOptionsOf(members: Candidate[], overshootUpperBound: boolean, reference: Predicted): CompareOptions {
  return {
    overshootUpperBound,
    trueAmplitudeV: reference.amplitudeV,
    amplitudeSigma: Math.max(0, ...members.map((m) => m.amplitudeSigma ?? 0)),
    predictsClipping: predictsClipping(members),
    needleReadings: true,
  };
}

/**
 * Charges a hypothesis for each recorded assertion it contradicts, as if the recorded cause's
 * effect had been measured against its picture, and judges its fit again.
 */
function chargeContradictions(h: Scored, assertions: readonly RecordedAssertion[], observed: Observed, ideal: Observed): void {
  // a hypothesis with an inferred value was fitted to the reading, which the recorded cause may
  // already explain: its picture then agrees with the assertion by construction, while the record
  // says that cause acts on top of it. It is judged as the true trace would be; only recorded
  // pictures may be two models of one effect (a 50 Ω input and a generator's load setting)
  const fitted = h.members.some((m) => m.basis === 'fitted');
  const seen = fitted ? ideal : pictureAsSeen(h.predicted, predictsClipping(h.members), observed);
  const contradicted = contradictedAssertions(h.causes, seen, assertions);
  if (contradicted.length === 0) return;
  const comparison = summarise([...h.comparison.terms, ...contradicted.flatMap((c) => c.terms)]);
  h.logScore -= (comparison.chiSquare - h.comparison.chiSquare) / 2;
  h.comparison = comparison;
  h.contradicted = contradicted.map((c) => c.assertion);
  // each assertion charged is a significant contradiction of the record on its own (χ² > 3.84 on one
  // degree of freedom): whatever the readings that agree would add to the gate, the hypothesis is ruled out
  h.fits = false;
}

function scoreSingle(candidate: Candidate, reference: Predicted, observed: Observed): Scored {
  // a screen that is no measurement predicts no reading at all, the true one included
  const predicted = candidate.notAMeasurement ? {} : merge(reference, candidate.predicted);
  return scoreOf([candidate], predicted, Boolean(candidate.overshootUpperBound), reference, observed, Math.log(priorOf(candidate)), candidate.deviation);
}

function scoreOf(
  members: Candidate[],
  predicted: Predicted,
  overshootUpperBound: boolean,
  reference: Predicted,
  observed: Observed,
  logPrior: number,
  deviation: number,
): Scored {
  const seen = compare(predicted, observed, compareOptionsOf(members, overshootUpperBound, reference));
  const comparison = summarise([...seen.terms, ...members.flatMap((m) => contradictionTerms(m.contradictions))]);
  // a cause that voids the measurement stands apart from a true trace without a number to show it
  const distinct = members.some((m) => m.notAMeasurement) || distinctFrom(reference, predicted, deviation);
  return {
    causes: [...new Set(members.flatMap((m) => [m.cause, ...(m.alsoCauses ?? [])]))],
    observedResidual: seen.residual ?? 0,
    members,
    predicted,
    comparison,
    logScore: logPrior - comparison.chiSquare / 2,
    deviation,
    distinct,
    fits: distinct && passesGate(comparison),
  };
}

/**
 * Every pair of candidates from different causes that each predict an error, composed through
 * the chain. Kept, when something was observed, only if the pair fits and beats each member's
 * χ² by the significance margin (it explains materially more than either alone); with nothing
 * observed, when both members are what the recorded setup predicts. The best of each pair of
 * causes, at most `MAX_COMBINATIONS`.
 */
function combinations(singles: Scored[], reference: Predicted, observed: Observed, anyObserved: boolean): Scored[] {
  const pool = singles.filter((s) => s.distinct && (anyObserved || s.members[0].basis === 'recorded'));
  const bestPerPair = new Map<string, Scored>();
  for (let i = 0; i < pool.length; i++) {
    for (let j = i + 1; j < pool.length; j++) {
      const [first, second] = pool[i].logScore >= pool[j].logScore ? [pool[i], pool[j]] : [pool[j], pool[i]];
      const a = first.members[0];
      const b = second.members[0];
      if (a.cause === b.cause) continue;
      const { predicted, overshootUpperBound } = composePredictions(
        reference,
        { predicted: first.predicted, overshootUpperBound: a.overshootUpperBound },
        { predicted: second.predicted, overshootUpperBound: b.overshootUpperBound },
      );
      const logPrior = Math.log(priorOf(a)) + Math.log(priorOf(b)) - COMBINATION_LOG_PENALTY;
      const combo = scoreOf([a, b], predicted, overshootUpperBound, reference, observed, logPrior, Math.hypot(a.deviation, b.deviation));
      if (anyObserved) {
        // beside a cause that voids the measurement, any explanation of the numbers needs it too:
        // the member alone is ruled out by the record (charged later), so no margin is asked
        const voids = a.notAMeasurement || b.notAMeasurement;
        const margin = Math.min(first.comparison.chiSquare, second.comparison.chiSquare) - combo.comparison.chiSquare;
        if (!combo.fits || (!voids && margin <= SIGNIFICANT_IMPROVEMENT)) continue;
      }
      const key = [a.cause, b.cause].sort().join('+');
      const current = bestPerPair.get(key);
      if (!current || combo.logScore > current.logScore) bestPerPair.set(key, combo);
    }
  }
  return [...bestPerPair.values()].sort((x, y) => y.logScore - x.logScore).slice(0, MAX_COMBINATIONS);
}

function toHypothesis(h: Scored, likelihood: number, setup: Parameters<typeof faithfulWording>[0]): Hypothesis {
  const residual = h.observedResidual;
  if (h.causes[0] === 'faithful') {
    const words = faithfulWording(setup, h.contradicted);
    return { cause: 'faithful', causes: ['faithful'], likelihood, residual, fits: h.fits, predicted: h.predicted, confirm: FAITHFUL_CONFIRM, ...words, ...ruledOut(h) };
  }
  const [a, b] = h.members;
  // JSON has no Infinity or NaN: a value a model could not put in numbers is left out
  const merged = b ? { ...b.estimates, ...a.estimates } : { ...a.estimates };
  const estimates = Object.fromEntries(Object.entries(merged).filter(([, v]) => typeof v === 'string' || Number.isFinite(v)));
  const join = (x: string, y: string) => (x === y ? x : `${x} ${y}`);
  return {
    cause: a.cause,
    causes: h.causes,
    likelihood,
    residual,
    fits: h.fits,
    predicted: h.predicted,
    explanation: b ? `Two causes together. ${a.explanation} ${b.explanation}` : a.explanation,
    fix: b ? join(a.fix, b.fix) : a.fix,
    confirm: b ? join(a.confirm, b.confirm) : a.confirm,
    ...(Object.keys(estimates).length ? { estimates } : {}),
    ...ruledOut(h),
  };
}

const ruledOut = (h: Scored) => (h.contradicted?.length ? { ruledOutBy: h.contradicted.map((a) => a.cause) } : {});

function dedupe(risks: Risk[]): Risk[] {
  const seen = new Map<string, Risk>();
  for (const r of risks) if (!seen.has(r.id)) seen.set(r.id, r);
  return [...seen.values()];
}
