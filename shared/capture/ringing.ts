import type { Series } from './series';
import { crossingTimeS, type Transition } from './transitions';

/** Ringing seen after one transition. */
export interface Ringing {
  /** Frequency of the oscillation about the final state level, Hz. */
  frequencyHz: number;
  /** Zero crossings of the residual it was measured from. */
  crossings: number;
}

// Ringing must stand this many noise standard deviations (after smoothing) clear of the level.
const BAND_SIGMAS = 6;
// A later half-period more than this factor off the mean so far ends the run of crossings:
// the oscillation has died into the noise and what crosses now is not ringing.
const HALF_PERIOD_TOLERANCE = 1.6;

/**
 * Ringing frequency after a transition from the zero crossings of the residual
 * r(t) = v(t) − final state level over the post-transition region: successive crossings of
 * a damped oscillation are half a period apart, so f = m / (2·(t_m − t_0)) for crossings
 * t_0 … t_m, placed by linear interpolation between samples.
 *
 * The residual is first smoothed by a centred moving average about half as long as the
 * transition. Being linear and time-invariant, the average changes a damped oscillation's
 * amplitude and phase but not the spacing of its zeros, while it divides white noise by the
 * square root of its length. A crossing counts only once the smoothed residual has left the
 * band ±max(6 σ_smoothed, `minBandV`) on the other side, so noise about the settled level is
 * not ringing; the run ends at the first half-period far off the mean of the earlier ones.
 *
 * Why crossings and not the spectrum of the residual (fft.js): compared on second-order steps
 * (f_n = 1 MHz, ζ = 0.05 to 0.5, 1 ns sampling, with and without noise of 1 % of the
 * amplitude) and on a ringing square wave, the crossings came within 0.03 % of f_n·√(1 − ζ²)
 * without noise and 0.4 % with it. A zero-padded FFT with a parabolic peak fit was off by 0.1 %
 * to 15 %, growing with ζ, since damping pulls the peak of a few decaying cycles off ω_d; with a
 * Hann window it did as well without noise (0.07 %) but was off by up to 8 % with noise, and
 * at ζ = 0.5 it locked onto a noise peak.
 *
 * @param timesS sample instants, s
 * @param volts samples, V
 * @param transition the transition the ringing follows
 * @param stopIndex last sample of the post-transition region
 * @param finalV the state level the transition enters, V
 * @param noiseV standard deviation of the noise on the samples, V
 * @param minBandV least hysteresis half-width, V (above ADC steps)
 * @returns the ringing, or null when fewer than two crossings (half a cycle) stand out
 */
export function ringingAfter(
  timesS: Series,
  volts: Series,
  transition: Transition,
  stopIndex: number,
  finalV: number,
  noiseV: number,
  minBandV: number,
): Ringing | null {
  const edgeSamples = transition.endIndex - transition.startIndex;
  const reach = Math.max(0, Math.floor(edgeSamples / 4));
  const width = 2 * reach + 1;
  const bandV = Math.max((BAND_SIGMAS * noiseV) / Math.sqrt(width), minBandV);
  const first = transition.endIndex;
  const last = stopIndex - reach;
  if (last <= first || first - reach < 0) return null;
  // Running sum of the centred window of `width` samples about i.
  let windowSum = 0;
  for (let k = first - reach; k <= first + reach; k++) windowSum += volts.get(k);
  let side = 0;
  let lastZeroS = Number.NaN;
  let firstS = Number.NaN;
  let lastS = Number.NaN;
  let intervals = 0;
  let previous = windowSum / width - finalV;
  for (let i = first; i <= last; i++) {
    if (i > first) windowSum += volts.get(i + reach) - volts.get(i - reach - 1);
    const residual = windowSum / width - finalV;
    if (i > first && previous < 0 !== residual < 0) {
      lastZeroS = crossingTimeS(timesS.get(i - 1), previous, timesS.get(i), residual, 0);
      // every later half-period would end at this zero or a later one, too long for the run: it is over
      if (intervals > 0 && lastZeroS - lastS > ((lastS - firstS) / intervals) * HALF_PERIOD_TOLERANCE) break;
    }
    previous = residual;
    const now = residual > bandV ? 1 : residual < -bandV ? -1 : 0;
    if (now === 0 || now === side) continue;
    if (side !== 0 && !Number.isNaN(lastZeroS)) {
      if (Number.isNaN(firstS)) firstS = lastZeroS;
      else {
        const halfPeriodS = lastZeroS - lastS;
        const meanS = intervals > 0 ? (lastS - firstS) / intervals : halfPeriodS;
        if (halfPeriodS > meanS * HALF_PERIOD_TOLERANCE || halfPeriodS * HALF_PERIOD_TOLERANCE < meanS) break;
        intervals++;
      }
      lastS = lastZeroS;
    }
    side = now;
  }
  if (intervals < 1) return null;
  return { frequencyHz: intervals / (2 * (lastS - firstS)), crossings: intervals + 1 };
}
