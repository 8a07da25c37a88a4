import { selectInPlace } from './sample-interval';
import type { Series } from './series';

// For Gaussian noise, median(|x|) = 0.6745·σ; a second difference of white noise has variance 6σ².
const MAD_PER_SIGMA = 0.6744897501960817;
const SECOND_DIFFERENCE_GAIN = Math.sqrt(6);
const MAX_DIFFERENCES = 1 << 18;

/**
 * Noise rms from the median absolute second difference of the samples,
 * σ ≈ median|v[i+1] − 2v[i] + v[i−1]| / (0.6745·√6) (a robust MAD estimate; source: the
 * normal distribution's quartile 0.6745σ, and the variance of a second difference of white
 * noise, 1 + 4 + 1 = 6 times σ²). The second difference cancels the signal's level and slope,
 * so flat tops, ramps and edges (a few samples out of many) leave the median alone; it reads
 * low only where the signal curves strongly from one sample to the next (a sine with fewer
 * than about 20 samples per period). Samples where `skip` is true (clipped runs) are left out.
 *
 * @returns σ, V; 0 for a noiseless (or finely quantised) trace
 */
export function noiseRmsV(volts: Series, skip?: (index: number) => boolean): number {
  const n = volts.length;
  if (n < 3) return 0;
  // a quarter of a million second differences pin the median well; spread them over the whole record
  const stride = Math.max(1, Math.ceil((n - 2) / MAX_DIFFERENCES));
  const diffs = new Float64Array(Math.ceil((n - 2) / stride));
  let count = 0;
  for (let i = 1; i < n - 1; i += stride) {
    if (skip && (skip(i - 1) || skip(i) || skip(i + 1))) continue;
    const d = volts.get(i + 1) - 2 * volts.get(i) + volts.get(i - 1);
    diffs[count++] = d < 0 ? -d : d;
  }
  if (count === 0) return 0;
  const median = selectInPlace(diffs.subarray(0, count), count >> 1);
  return median / (MAD_PER_SIGMA * SECOND_DIFFERENCE_GAIN);
}

/**
 * The largest excursion pure noise of rms σ is expected to reach over `count` samples,
 * σ·(√(2 ln count) + 2): the usual bound on the maximum of that many Gaussian samples, with
 * two σ of margin. An overshoot smaller than this is within the noise.
 */
export function noisePeakV(noiseV: number, count: number): number {
  if (!(noiseV > 0)) return 0;
  return noiseV * (Math.sqrt(2 * Math.log(Math.max(2, count))) + 2);
}
