import type { ResolvedSetup } from './types';
import { dividerLevels, compensationFrequencyResponse, type DividerParams } from './compensation';

/** What a mis-compensated divider does to the recorded signal, relative to a compensated one. */
export interface CompensationPicture {
  /** Shown ÷ true amplitude (mean top minus mean base for a square wave). */
  amplitudeRatio: number;
  /** Corner peak above the mean top, % of the shown amplitude. */
  overshootPct?: number;
  /** Droop across a top, % of the shown amplitude. */
  tiltPct?: number;
}

/** Beyond this many time constants per half period the decay ends early: corners, not a tilt (our threshold). */
const TILT_HALF_PERIODS = 2;

/**
 * A square wave through a divider whose edges jump to (1 + k) of the settled level and decay
 * with τ: the screen shows x(t) + k·HP_τ{x}(t), HP a first-order high-pass. In steady state
 * the high-pass part starts each top at V₊ = 1/(1 + e^(−h)) of the step (h = T/2τ, T the
 * period) and ends it at V₊e^(−h). The top's level is read where it has settled most, at its
 * end (the histogram level of a top that settles early), so:
 * amplitude = 1 + k·(1 − tanh(h/2)); the droop from corner to end, k·tanh(h/2), over that
 * amplitude, is the corner overshoot and, when it spreads over the whole top (h ≤ 2), the tilt.
 * Much faster than τ (h → 0) the tops are flat at 1 + k, the capacitive ratio: an amplitude
 * error with no overshoot; much slower (h → ∞) the amplitude is right and corners show k.
 * source: steady-state response of a first-order high-pass to a square wave (each half period
 * decays from the level the last edge left), superposed on the resistive divider.
 */
export function squareWavePicture(k: number, halfPeriodTimeConstants: number): Required<CompensationPicture> {
  const h = halfPeriodTimeConstants;
  const droop = k * Math.tanh(h / 2);
  const amplitudeRatio = 1 + k - droop;
  const overshootPct = (100 * droop) / amplitudeRatio;
  const tiltPct = h <= TILT_HALF_PERIODS ? overshootPct : 0;
  return { amplitudeRatio, overshootPct, tiltPct };
}

/**
 * The picture for the recorded signal: a square wave as above; a single edge shows the corner
 * (jump/settle − 1) and settles to the right level; a sine shows |H(f)| of the divider over the
 * resistive ratio; DC is unchanged.
 */
export function compensationPicture(setup: ResolvedSetup, divider: DividerParams): CompensationPicture {
  const { jump, settle, timeConstantS } = dividerLevels(divider);
  const k = jump / settle - 1;
  const f = setup.frequencyHz;
  if (setup.signalKind === 'dc') return { amplitudeRatio: 1 };
  if (setup.hasEdges) {
    if (f === undefined) return { amplitudeRatio: 1, overshootPct: 100 * k, tiltPct: 0 };
    return squareWavePicture(k, 1 / (2 * f * timeConstantS));
  }
  if (f === undefined) return { amplitudeRatio: 1 };
  return { amplitudeRatio: compensationFrequencyResponse(divider, [f])[0] / settle };
}
