import { summaryOf } from './passes';
import { asSeries, type Series } from './series';

/** The two state levels of a two-level waveform and what the histogram says about them. */
export interface StateLevels {
  /** Low state level (base), V. */
  baseV: number;
  /** High state level (top), V. */
  topV: number;
  /** False when the histogram shows one state only (a flat line, noise): then baseV = topV = the mean. */
  twoStates: boolean;
  /** Spread of the samples about the state levels (from the width of the histogram peaks), V. */
  noiseV: number;
  minV: number;
  maxV: number;
}

/** Reference levels at 10 %, 50 % and 90 % of the amplitude above the base. */
export interface ReferenceLevels {
  lowV: number;
  midV: number;
  highV: number;
}

// A mode this many times the average count of its half is a peak; below it the half is a
// ramp or a plateau-free slope (a triangle), and its extreme value is the better state level.
const PEAK_FACTOR = 3;
// An extreme bin holding this share of its half's average count is a plateau's edge (a
// triangle's turning point), where a noise hump's tail holds next to nothing.
const EXTREME_FACTOR = 0.5;
const FINE_BINS = 64;
// Two modes closer than this share of the full range are one state seen through noise.
const MIN_AMPLITUDE_SHARE = 0.2;
const FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);

/**
 * Bins for the histogram: about 2·√n, even, from 32 to 4096. Enough resolution that the mode
 * lands within 0.05 % of the range on a million samples, few enough that a thousand-sample
 * capture still has populated bins.
 */
function binCountFor(sampleCount: number): number {
  const bins = Math.round(Math.sqrt(sampleCount)) * 2;
  return Math.min(4096, Math.max(32, bins));
}

/**
 * State levels by the histogram method (IEEE Std 181-2011, 5.2.1): the samples are binned
 * between their minimum and maximum, the histogram is split into a lower and an upper half at
 * the middle of that range, and the mode of each half is a state level (base and top).
 *
 * Refinements beyond the bare mode, so that a level does not snap to a bin centre: the level
 * is the mean of the samples in the bins about the mode that hold at least half its count (the
 * peak's full width at half maximum), first on the coarse histogram and then on a fine one of
 * the samples near it. A half without a clear peak but with a populated extreme bin (a
 * triangle wave) takes its extreme sample, as the min/max method would; a half with neither
 * (one flank of a single noise hump), or two levels closer than 20 % of the range, means one
 * state only. Three passes over the samples; no sort.
 *
 * @param volts the samples, V
 */
export function stateLevels(samples: Float64Array | Series): StateLevels {
  const volts = asSeries(samples);
  const n = volts.length;
  const { minV, maxV, sumV } = summaryOf(volts);
  const meanV = n > 0 ? sumV / n : Number.NaN;
  const rangeV = maxV - minV;
  const flat: StateLevels = { baseV: meanV, topV: meanV, twoStates: false, noiseV: 0, minV, maxV };
  if (n < 2) return flat;
  if (!(rangeV > 0)) return { ...flat, baseV: minV, topV: minV };
  if (rangeV <= Math.abs(meanV) * 1e-12) return flat;

  const bins = binCountFor(n);
  const binWidthV = rangeV / bins;
  const counts = new Uint32Array(bins);
  const sums = new Float64Array(bins);
  volts.scan(0, n, (values) => binSamples(values, minV, binWidthV, counts, sums));
  const half = bins / 2;
  const lowerCoarse = halfLevel(counts, sums, 0, half, binWidthV, 0, minV);
  const upperCoarse = halfLevel(counts, sums, half, bins, binWidthV, bins - 1, maxV);
  if (lowerCoarse === null || upperCoarse === null) return flat;
  if (upperCoarse.levelV - lowerCoarse.levelV < MIN_AMPLITUDE_SHARE * rangeV) return flat;
  const [lower, upper] = refine(volts, lowerCoarse, upperCoarse, binWidthV);
  const noiseV = Math.max(lower.widthV, upper.widthV) / FWHM_PER_SIGMA;
  return { baseV: lower.levelV, topV: upper.levelV, twoStates: true, noiseV, minV, maxV };
}

interface HalfLevel {
  levelV: number;
  widthV: number;
}

/**
 * The state level of one half of the histogram, or null when the half has neither a peak nor
 * populated extreme bins (one side of a single noise hump, which is no state at all).
 */
function halfLevel(
  counts: Uint32Array,
  sums: Float64Array,
  from: number,
  to: number,
  binWidthV: number,
  extremeBin: number,
  extremeV: number,
): HalfLevel | null {
  let mode = from;
  let total = 0;
  for (let bin = from; bin < to; bin++) {
    total += counts[bin];
    if (counts[bin] > counts[mode]) mode = bin;
  }
  const averageCount = total / (to - from);
  if (counts[mode] >= PEAK_FACTOR * averageCount) return peakAround(counts, sums, from, to, mode, binWidthV);
  // widthV 0 marks a level taken from an extreme, which `refine` leaves alone
  if (counts[extremeBin] >= EXTREME_FACTOR * averageCount) return { levelV: extremeV, widthV: 0 };
  return null;
}

/** Mean of the samples in the bins about `mode` holding at least half its count (the FWHM). */
function peakAround(
  counts: Uint32Array,
  sums: Float64Array,
  from: number,
  to: number,
  mode: number,
  binWidthV: number,
): HalfLevel {
  const peak = counts[mode];
  let first = mode;
  let last = mode;
  while (first > from && 2 * counts[first - 1] >= peak) first--;
  while (last < to - 1 && 2 * counts[last + 1] >= peak) last++;
  let count = 0;
  let sum = 0;
  for (let bin = first; bin <= last; bin++) {
    count += counts[bin];
    sum += sums[bin];
  }
  return { levelV: sum / count, widthV: (last - first + 1) * binWidthV };
}

/**
 * Second look at a coarse level: a histogram of only the samples within the coarse peak's
 * full width (at least two coarse bins) either side of it, `FINE_BINS` bins wide, and the FWHM
 * mean of its peak. This takes the level from within a coarse bin (0.05–3 % of the range) to
 * within a fine one, so that an exponential tail sharing the top bin with the settled samples
 * does not pull the top level down, and measures the width of a noise peak that the coarse
 * bins resolve only roughly.
 */
function refine(volts: Series, lower: HalfLevel, upper: HalfLevel, coarseBinWidthV: number): HalfLevel[] {
  const lowerHalfV = Math.max(2 * coarseBinWidthV, lower.widthV);
  const upperHalfV = Math.max(2 * coarseBinWidthV, upper.widthV);
  const lowerFineV = (2 * lowerHalfV) / FINE_BINS;
  const upperFineV = (2 * upperHalfV) / FINE_BINS;
  const lowerCounts = new Uint32Array(FINE_BINS);
  const lowerSums = new Float64Array(FINE_BINS);
  const upperCounts = new Uint32Array(FINE_BINS);
  const upperSums = new Float64Array(FINE_BINS);
  const lowerFromV = lower.levelV - lowerHalfV;
  const upperFromV = upper.levelV - upperHalfV;
  volts.scan(0, volts.length, (values) => {
    binWindow(values, lowerFromV, lowerFineV, lowerCounts, lowerSums);
    binWindow(values, upperFromV, upperFineV, upperCounts, upperSums);
  });
  const fine = (level: HalfLevel, counts: Uint32Array, sums: Float64Array, binWidthV: number): HalfLevel => {
    if (level.widthV === 0) return level;
    let mode = 0;
    for (let bin = 1; bin < FINE_BINS; bin++) if (counts[bin] > counts[mode]) mode = bin;
    return peakAround(counts, sums, 0, FINE_BINS, mode, binWidthV);
  };
  return [fine(lower, lowerCounts, lowerSums, lowerFineV), fine(upper, upperCounts, upperSums, upperFineV)];
}

// Passes over the record, each a module-level function called per block (see `scan` in series.ts).

/** Counts and sums the samples by bin of `binWidthV` from `fromV`, the top bin taking the maximum. */
function binSamples(values: Float64Array, fromV: number, binWidthV: number, counts: Uint32Array, sums: Float64Array): void {
  const bins = counts.length;
  // a multiply, not a divide, per sample (a divide costs several times as long)
  const perV = 1 / binWidthV;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    let bin = Math.floor((v - fromV) * perV);
    if (bin >= bins) bin = bins - 1;
    counts[bin]++;
    sums[bin] += v;
  }
}

/** Counts and sums the samples within the bins of `binWidthV` from `fromV`; the rest are left out. */
function binWindow(values: Float64Array, fromV: number, binWidthV: number, counts: Uint32Array, sums: Float64Array): void {
  const bins = counts.length;
  const perV = 1 / binWidthV;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    const bin = Math.floor((v - fromV) * perV);
    if (bin >= 0 && bin < bins) {
      counts[bin]++;
      sums[bin] += v;
    }
  }
}

/**
 * Reference levels (IEEE Std 181-2011, 5.3.2): y(x %) = base + (x / 100)·(top − base), at the
 * 10 %, 50 % and 90 % points the transition duration and the mid crossings are measured at.
 */
export function referenceLevels(baseV: number, topV: number): ReferenceLevels {
  const amplitudeV = topV - baseV;
  return { lowV: baseV + 0.1 * amplitudeV, midV: baseV + 0.5 * amplitudeV, highV: baseV + 0.9 * amplitudeV };
}
