import type { Cause, DiagnosisInput, DiagnosisResult, Hypothesis, Predicted, Risk } from '../schemas/diagnosis';
import { hazardousLive } from '../safety/hazard';
import type { Candidate, ResolvedSetup } from './types';
import { observedOf, resolveSetup } from './defaults';
import { applicability, compare } from './scoring';
import { shownRiseTimeS } from './bandwidth';
import { MODELS } from './models';

/** Hypotheses at or above this likelihood contribute tags. */
export const TAG_THRESHOLD = 0.2;

/** On equal scores, prefer what every setup has over a mismatch someone would have to make. */
const TIE_ORDER: Cause[] = ['ground-lead', 'bandwidth', 'loading', 'compensation', 'termination-mismatch', 'attenuation-mismatch'];

/**
 * Runs every cause model on a case and ranks them against what was observed.
 *
 * Each model predicts what the scope shows (quantities it does not model take the reference
 * picture: the expected amplitude, the recorded chain's rise time, no overshoot, no ringing).
 * Likelihood ∝ prior × exp(−Σ(rᵢ/σᵢ)²/2) with rᵢ = ln(predicted/observed); the prior is the
 * cause's applicability (from the size of the error it predicts) or, for a fitted candidate,
 * how often its hidden parameter is the culprit. Likelihoods are normalised over the six
 * returned hypotheses, most likely first. With nothing observed, the ranking is by the size
 * of the predicted error.
 */
export function diagnose(input: DiagnosisInput): DiagnosisResult {
  const { setup, assumptions } = resolveSetup(input);
  const observed = observedOf(input);
  const reference = referencePicture(setup);

  const best = new Map<Cause, { candidate: Candidate; predicted: Predicted; residual?: number; logScore: number }>();
  for (const candidate of MODELS.flatMap((model) => model({ setup, observed }))) {
    const predicted = merge(reference, candidate.predicted);
    const { chiSquare, residual } = compare(predicted, observed);
    const prior = candidate.basis === 'fitted' ? (candidate.hiddenPrior ?? 0.1) : applicability(candidate.deviation);
    const logScore = Math.log(prior) - chiSquare / 2;
    const current = best.get(candidate.cause);
    if (!current || logScore > current.logScore) best.set(candidate.cause, { candidate, predicted, residual, logScore });
  }

  const entries = [...best.values()];
  const top = Math.max(...entries.map((e) => e.logScore));
  const weights = entries.map((e) => Math.exp(e.logScore - top));
  const total = weights.reduce((a, b) => a + b, 0);
  const ranked = entries
    .map((e, i) => ({ ...e, likelihood: weights[i] / total }))
    .sort(
      (a, b) =>
        b.likelihood - a.likelihood ||
        b.candidate.deviation - a.candidate.deviation ||
        TIE_ORDER.indexOf(a.candidate.cause) - TIE_ORDER.indexOf(b.candidate.cause),
    );

  const hypotheses: Hypothesis[] = ranked.map(({ candidate, predicted, residual, likelihood }) => ({
    cause: candidate.cause,
    causes: [candidate.cause],
    fits: true,
    confirm: candidate.confirm,
    likelihood,
    predicted,
    explanation: candidate.explanation,
    fix: candidate.fix,
    ...(candidate.estimates ? { estimates: candidate.estimates } : {}),
    residual: residual ?? 0,
  }));

  const tags = new Set<string>();
  for (const { candidate, likelihood } of ranked) {
    if (likelihood < TAG_THRESHOLD) continue;
    tags.add(candidate.cause);
    candidate.detailTags.forEach((t) => tags.add(t));
  }

  const risks: Risk[] = [...ranked.flatMap((e) => e.candidate.risks ?? []), ...safetyRisks(setup)];
  return { verdict: 'measurement-error', hypotheses, tags: [...tags], assumptions, risks };
}

/** What an error-free measurement of the recorded signal would show. */
function referencePicture(setup: ResolvedSetup): Predicted {
  return {
    amplitudeV: setup.expectedAmplitudeV,
    riseTimeS: setup.hasEdges ? shownRiseTimeS(setup) : undefined,
    overshootPct: setup.hasEdges ? 0 : undefined,
  };
}

/** The candidate's own values over the reference, with unset fields left out. */
function merge(reference: Predicted, own: Predicted): Predicted {
  const merged: Predicted = {};
  for (const key of ['amplitudeV', 'riseTimeS', 'overshootPct', 'ringingFrequencyHz'] as const) {
    const value = own[key] ?? reference[key];
    if (value !== undefined && Number.isFinite(value)) merged[key] = value;
  }
  return merged;
}

/**
 * The expected amplitude is read as a peak value (a DC level for DC signals): for a
 * peak-to-peak figure that overstates the peak, which errs toward showing the caution.
 */
function safetyRisks(setup: ResolvedSetup): Risk[] {
  if (setup.expectedAmplitudeV === undefined) return [];
  const kind = setup.signalKind === 'dc' ? 'dc' : 'peak';
  const { hazardous, reasons } = hazardousLive({ highestVoltageV: setup.expectedAmplitudeV, kind });
  if (!hazardous) return [];
  return [
    {
      id: 'hazardous-live',
      level: 'hazard',
      message: `${reasons.join(' ')} Follow the safety caution before probing.`,
    },
  ];
}
