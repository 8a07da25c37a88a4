import type { Predicted } from '../schemas/diagnosis';
import type { Observed } from './types';

/**
 * Spread allowed between a prediction and an observation, in natural-log units (one standard
 * deviation): how far a model fed with the recorded setup and a reading off a screen usually
 * disagree (our estimates, from common practice):
 * - amplitude 3 %: general-purpose scopes quote ±1.5–3 % DC gain accuracy and cursor readings
 *   add about 1 %; the amplitude models themselves are exact dividers.
 * - rise time 20 %: readings of fast edges and the 0.35/BW single-pole rule each carry ~10–15 %.
 * - overshoot 1.5 % of the level: overshoot and corner error are read on one trace against its
 *   own settled level, so the gain error cancels; a cursor resolves one or two percent.
 * - tilt 1 % of the step: both ends of one flat top are read on the same trace, so the gain
 *   error cancels and cursors resolve about a percent of a step that spans the screen.
 *   `overshootBelowBound` applies under a prediction that is only an upper bound (ground-lead
 *   ringing: the probe's lossy cable damps more than the source resistance alone).
 * - ringing 30 %: lead geometry and tip capacitance are rarely known better than that.
 * - frequency and hum 2 %: read from the timebase or a cursor, models exact.
 */
export const SIGMA = {
  amplitude: 0.03,
  riseTime: 0.2,
  overshoot: 0.015,
  overshootBelowBound: 0.15,
  tilt: 0.01,
  ringing: 0.3,
  frequency: 0.02,
  hum: 0.02,
} as const;

/**
 * Charged when a feature (ringing, hum) is seen but the hypothesis predicts none, as if the
 * prediction were off by a factor of 4, at the ringing spread.
 */
export const UNEXPLAINED_FEATURE = Math.log(4);

/**
 * Prior that a cause applies to the recorded setup, from the size of the error it predicts
 * (log units): about 0.02 when it predicts nothing, rising toward 0.9 for a factor of ten.
 */
export function applicability(deviation: number): number {
  return 0.02 + 0.88 * (1 - Math.exp(-Math.abs(deviation) / 0.5));
}

/** One compared quantity: log-ratio residual and the spread it is judged by. */
export interface Term {
  quantity: string;
  residual: number;
  sigma: number;
}

export interface Comparison {
  /** Σ (r/σ)² over the quantities compared. */
  chiSquare: number;
  /** √(Σ r²) of the log-ratio residuals, undefined when nothing was compared. */
  residual?: number;
  /** How many quantities were compared (degrees of freedom for the fit gate). */
  count: number;
  terms: Term[];
}

/** Overshoot and tilt compare on the level they reach, 1 + pct/100, kept above 1 % of the final level. */
const level = (pct: number) => Math.max(0.01, 1 + pct / 100);

export interface CompareOptions {
  /** The predicted overshoot is an upper bound (ground-lead ringing). */
  overshootUpperBound?: boolean;
  /** The model's own amplitude accuracy when it is looser than a reading's (log units). */
  amplitudeSigma?: number;
  /** The model's own rise-time accuracy when it is looser than a reading's (log units). */
  riseTimeSigma?: number;
  /** The hypothesis says the trace runs off the screen (the clipping model's estimate). */
  predictsClipping?: boolean;
  /** The true amplitude, V: what an amplitude predicted as nothing (a DC level behind AC coupling) is judged against. */
  trueAmplitudeV?: number;
  /**
   * Where the prediction is a train of needles (`spikeV`: a passive probe into 50 Ω), an amplitude
   * read off it may be the flat level between them, one needle's height or, for a periodic signal,
   * the needles' peak to peak (up at one edge, down at the next): the reading nearest the
   * observation is compared. Off where the question is what a setup allows, not how it was read.
   */
  needleReadings?: boolean;
}

/** How an amplitude was read off a prediction: its level, one needle, or the needles' peak to peak. */
export type AmplitudeReading = 'level' | 'needle' | 'needles-peak-to-peak';

/**
 * The reading of a prediction nearest an observed amplitude, as `needleReadings` says: without
 * needles (`spikeV`), the predicted amplitude itself.
 */
export function nearestAmplitudeReading(predicted: Predicted, observedV: number): { kind: AmplitudeReading; valueV: number } | undefined {
  const spikeV = predicted.spikeV;
  const readings: { kind: AmplitudeReading; valueV: number }[] = [];
  if (predicted.amplitudeV !== undefined) readings.push({ kind: 'level', valueV: predicted.amplitudeV });
  if (spikeV !== undefined && spikeV > 0) {
    readings.push({ kind: 'needle', valueV: spikeV });
    if (predicted.frequencyHz !== undefined) readings.push({ kind: 'needles-peak-to-peak', valueV: 2 * spikeV });
  }
  const distance = (v: number) => (v > 0 && observedV > 0 ? Math.abs(Math.log(v / observedV)) : Infinity);
  return readings.reduce<(typeof readings)[number] | undefined>((best, r) => (best === undefined || distance(r.valueV) < distance(best.valueV) ? r : best), undefined);
}

/**
 * An amplitude predicted as nothing fits any reading up to this share of the true amplitude (our
 * choice: a blocked level still reads as a trace's offset and noise); a larger reading is charged
 * as a ratio to it.
 */
export const ZERO_READING_SHARE = 0.05;

/**
 * Log-ratio residuals ln(pred/obs) for each observed quantity the prediction covers; a
 * feature seen (ringing, hum) that the prediction lacks is charged `UNEXPLAINED_FEATURE`, and an
 * amplitude predicted as nothing is charged for a reading above `ZERO_READING_SHARE` of the true one.
 */
export function compare(predicted: Predicted, observed: Observed, options: CompareOptions = {}): Comparison {
  const terms: Term[] = [];
  const ratio = (quantity: string, p: number | undefined, o: number | undefined, sigma: number) => {
    if (p !== undefined && o !== undefined && p > 0 && o > 0) terms.push({ quantity, residual: Math.log(p / o), sigma });
  };
  const amplitudeSigma = Math.max(SIGMA.amplitude, options.amplitudeSigma ?? 0);
  const observedV = observed.amplitudeV;
  const readV = options.needleReadings && observedV !== undefined ? nearestAmplitudeReading(predicted, observedV)?.valueV : predicted.amplitudeV;
  ratio('amplitudeV', readV, observedV, amplitudeSigma);
  const zeroReadingV = ZERO_READING_SHARE * (options.trueAmplitudeV ?? Number.NaN);
  if (predicted.amplitudeV === 0 && observed.amplitudeV !== undefined && observed.amplitudeV > zeroReadingV) {
    terms.push({ quantity: 'amplitudeV', residual: Math.log(zeroReadingV / observed.amplitudeV), sigma: amplitudeSigma });
  }
  ratio('riseTimeS', predicted.riseTimeS, observed.riseTimeS, Math.max(SIGMA.riseTime, options.riseTimeSigma ?? 0));
  if (predicted.overshootPct !== undefined && observed.overshootPct !== undefined) {
    const residual = Math.log(level(predicted.overshootPct) / level(observed.overshootPct));
    const below = options.overshootUpperBound && residual > 0;
    terms.push({ quantity: 'overshootPct', residual, sigma: below ? SIGMA.overshootBelowBound : SIGMA.overshoot });
  }
  if (predicted.tiltPct !== undefined && observed.tiltPct !== undefined) {
    terms.push({ quantity: 'tiltPct', residual: Math.log(level(predicted.tiltPct) / level(observed.tiltPct)), sigma: SIGMA.tilt });
  }
  if (observed.ringingFrequencyHz !== undefined) {
    if (predicted.ringingFrequencyHz === undefined) terms.push({ quantity: 'ringingFrequencyHz', residual: UNEXPLAINED_FEATURE, sigma: SIGMA.ringing });
    else ratio('ringingFrequencyHz', predicted.ringingFrequencyHz, observed.ringingFrequencyHz, SIGMA.ringing);
  }
  ratio('frequencyHz', predicted.frequencyHz, observed.frequencyHz, SIGMA.frequency);
  if (observed.humFrequencyHz !== undefined) {
    if (predicted.humFrequencyHz === undefined) terms.push({ quantity: 'humFrequencyHz', residual: UNEXPLAINED_FEATURE, sigma: SIGMA.ringing });
    else ratio('humFrequencyHz', predicted.humFrequencyHz, observed.humFrequencyHz, SIGMA.hum);
  }
  if (observed.clipped !== undefined && observed.clipped !== Boolean(options.predictsClipping)) {
    // clipped seen but not predicted (or the reverse): charged like an unexplained feature
    terms.push({ quantity: 'clipped', residual: UNEXPLAINED_FEATURE, sigma: SIGMA.ringing });
  }
  return summarise(terms);
}

/** χ², residual and count of a list of terms. */
export function summarise(terms: Term[]): Comparison {
  if (terms.length === 0) return { chiSquare: 0, count: 0, terms };
  return {
    chiSquare: terms.reduce((sum, t) => sum + (t.residual / t.sigma) ** 2, 0),
    residual: Math.sqrt(terms.reduce((sum, t) => sum + t.residual ** 2, 0)),
    count: terms.length,
    terms,
  };
}
