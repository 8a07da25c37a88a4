import type { Predicted } from '../schemas/diagnosis';
import type { Candidate, Observed, ResolvedSetup } from './types';
import { SCREEN_ESTIMATE } from './clipping';

/**
 * Spread allowed between a prediction and an observation for the acquisition quantities
 * (our estimates, natural-log units unless said):
 * - frequency: a period read off a screen or a counter is good to a few percent;
 * - tilt: compared on the level the top ends at, 1 − tilt/100; a droop reads to about ±3 %
 *   of the step;
 * - hum: a mains line sits within about ±1 % of n·f_mains, read to a few percent;
 * - a hum, or a clipped trace, seen where the hypothesis predicts none (or the reverse) is
 *   charged as if off by a factor of 4, with the ringing's σ (as `scoring.ts` does for ringing).
 */
export const ACQUISITION_SIGMA = { frequency: 0.05, tilt: 0.03, hum: 0.03, presence: 0.3 } as const;

/** Charged when a hum or a clipped trace is seen but not predicted (or predicted but not seen). */
export const UNEXPLAINED_FEATURE = Math.log(4);

/** The tilt is compared on the level the top ends at, kept above 1 % of the step. */
const tiltLevel = (pct: number) => Math.max(0.01, 1 - pct / 100);

/**
 * What an error-free measurement of the recorded signal shows for the acquisition quantities:
 * the signal's own frequency, flat tops on a square, no hum. Merge it under each candidate's
 * own `predicted`, as the ranker's reference picture does for amplitude and edges.
 */
export function acquisitionReference(setup: ResolvedSetup): Predicted {
  const periodic = setup.frequencyHz !== undefined && setup.frequencyHz > 0 && setup.signalKind !== 'dc';
  return {
    ...(periodic ? { frequencyHz: setup.frequencyHz } : {}),
    ...(setup.signalKind === 'square' ? { tiltPct: 0 } : {}),
  };
}

/** Whether any of the candidates says the trace runs off the screen (the clipping model's estimate). */
export function predictsClipping(candidates: readonly Pick<Candidate, 'estimates'>[]): boolean {
  return candidates.some((c) => c.estimates?.[SCREEN_ESTIMATE] === 'clipped');
}

/**
 * Residual terms for the observed acquisition quantities (frequency, tilt, hum, clipped)
 * against a prediction, to be added to `scoring.ts compare`'s terms:
 * - frequency: ln(pred/obs), σ 0.05, when both are given;
 * - tilt: ln((1 − pred/100)/(1 − obs/100)), σ 0.03, when both are given;
 * - hum: ln(pred/obs), σ 0.03, when both are given; ln 4 (σ 0.3) when hum is seen but the
 *   prediction has none;
 * - clipped: ln 4 (σ 0.3) when `observed.clipped` is given and differs from `predictedClipped`.
 *
 * @param predicted the candidate's prediction merged over `acquisitionReference(setup)`
 * @param observed what was read off the screen
 * @param predictedClipped `predictsClipping([candidate])` (every candidate of a combination)
 */
export function compareAcquisition(
  predicted: Predicted,
  observed: Observed,
  predictedClipped = false,
): { terms: { residual: number; sigma: number }[] } {
  const terms: { residual: number; sigma: number }[] = [];
  const ratio = (p: number | undefined, o: number | undefined, sigma: number) => {
    if (p !== undefined && o !== undefined && p > 0 && o > 0) terms.push({ residual: Math.log(p / o), sigma });
  };
  ratio(predicted.frequencyHz, observed.frequencyHz, ACQUISITION_SIGMA.frequency);
  if (predicted.tiltPct !== undefined && observed.tiltPct !== undefined) {
    terms.push({ residual: Math.log(tiltLevel(predicted.tiltPct) / tiltLevel(observed.tiltPct)), sigma: ACQUISITION_SIGMA.tilt });
  }
  if (observed.humFrequencyHz !== undefined) {
    if (predicted.humFrequencyHz === undefined) terms.push({ residual: UNEXPLAINED_FEATURE, sigma: ACQUISITION_SIGMA.presence });
    else ratio(predicted.humFrequencyHz, observed.humFrequencyHz, ACQUISITION_SIGMA.hum);
  }
  if (observed.clipped !== undefined && observed.clipped !== predictedClipped) {
    terms.push({ residual: UNEXPLAINED_FEATURE, sigma: ACQUISITION_SIGMA.presence });
  }
  return { terms };
}
