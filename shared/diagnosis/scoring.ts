import type { Predicted } from '../schemas/diagnosis';
import type { Observed } from './types';

/**
 * Spread allowed between a prediction and an observation, in natural-log units: how far
 * models built from typical values and readings off a screen usually disagree (our
 * estimates). Amplitudes read well; rise times and ringing depend on geometry and edges.
 */
export const SIGMA = { amplitude: 0.1, riseTime: 0.25, overshoot: 0.1, ringing: 0.3 } as const;

/** Charged when ringing is seen but the hypothesis predicts none: as if off by a factor of 4. */
export const UNEXPLAINED_RINGING = Math.log(4);

/**
 * Prior that a cause applies to the recorded setup, from the size of the error it predicts
 * (log units): about 0.02 when it predicts nothing, rising toward 0.9 for a factor of ten.
 */
export function applicability(deviation: number): number {
  return 0.02 + 0.88 * (1 - Math.exp(-Math.abs(deviation) / 0.5));
}

export interface Comparison {
  /** Σ (r/σ)² over the quantities compared. */
  chiSquare: number;
  /** √(Σ r²) of the log-ratio residuals, undefined when nothing was compared. */
  residual?: number;
}

/** Overshoot compares on the level it reaches, 1 + pct/100, kept above 1 % of the final level. */
const overshootLevel = (pct: number) => Math.max(0.01, 1 + pct / 100);

/**
 * Log-ratio residuals |ln(pred/obs)| for each observed quantity the prediction covers.
 */
export function compare(predicted: Predicted, observed: Observed): Comparison {
  const terms: { residual: number; sigma: number }[] = [];
  const ratio = (p: number | undefined, o: number | undefined, sigma: number) => {
    if (p !== undefined && o !== undefined && p > 0 && o > 0) terms.push({ residual: Math.log(p / o), sigma });
  };
  ratio(predicted.amplitudeV, observed.amplitudeV, SIGMA.amplitude);
  ratio(predicted.riseTimeS, observed.riseTimeS, SIGMA.riseTime);
  if (predicted.overshootPct !== undefined && observed.overshootPct !== undefined) {
    const residual = Math.log(overshootLevel(predicted.overshootPct) / overshootLevel(observed.overshootPct));
    terms.push({ residual, sigma: SIGMA.overshoot });
  }
  if (observed.ringingFrequencyHz !== undefined) {
    if (predicted.ringingFrequencyHz === undefined) terms.push({ residual: UNEXPLAINED_RINGING, sigma: SIGMA.ringing });
    else ratio(predicted.ringingFrequencyHz, observed.ringingFrequencyHz, SIGMA.ringing);
  }
  if (terms.length === 0) return { chiSquare: 0 };
  return {
    chiSquare: terms.reduce((sum, t) => sum + (t.residual / t.sigma) ** 2, 0),
    residual: Math.sqrt(terms.reduce((sum, t) => sum + t.residual ** 2, 0)),
  };
}
