import { asSeries, type Series } from './series';

// Up to this many spacings are copied and selected in memory; beyond, the median is found by
// narrowing histograms over further passes, so memory stays bounded however long the record.
const IN_MEMORY_SPACINGS = 1 << 18;
const SELECT_BINS = 4096;

/**
 * The median spacing of the sample instants, in seconds: the sample interval of a uniformly
 * sampled capture, and a robust one of a capture with gaps or jitter in its time stamps.
 * Linear time (quickselect on a scratch copy of the spacings, or on a long record histograms
 * that narrow down on the middle one) rather than a sort of a million values. For an even
 * count, the mean of the two middle spacings.
 *
 * @param timesS strictly increasing sample instants, s
 * @param inMemorySpacings most spacings copied to select in memory (tests make it small to reach the histogram passes)
 * @returns the median interval, s, or null for fewer than 2 samples
 */
export function medianSampleIntervalS(times: Float64Array | Series, inMemorySpacings = IN_MEMORY_SPACINGS): number | null {
  const timesS = asSeries(times);
  const count = timesS.length - 1;
  if (count < 1) return null;
  const first = timesS.get(1) - timesS.get(0);
  let uniform = true;
  let minS = Number.POSITIVE_INFINITY;
  let maxS = Number.NEGATIVE_INFINITY;
  let previous = timesS.get(0);
  // captured doubles are copied to locals for each block: a mutated closure variable is boxed on every store
  timesS.scan(1, count + 1, (values) => {
    let before = previous;
    let lo = minS;
    let hi = maxS;
    for (let j = 0; j < values.length; j++) {
      const d = values[j] - before;
      before = values[j];
      if (d !== first) uniform = false;
      if (d < lo) lo = d;
      if (d > hi) hi = d;
    }
    previous = before;
    minS = lo;
    maxS = hi;
  });
  if (uniform) return first;
  if (count <= inMemorySpacings) {
    const spacings = new Float64Array(count);
    previous = timesS.get(0);
    timesS.scan(1, count + 1, (values, firstIndex) => {
      let before = previous;
      for (let j = 0; j < values.length; j++) {
        spacings[firstIndex - 1 + j] = values[j] - before;
        before = values[j];
      }
      previous = before;
    });
    const upper = selectInPlace(spacings, count >> 1);
    if (count % 2 === 1) return upper;
    let lower = Number.NEGATIVE_INFINITY;
    for (let j = 0; j < count >> 1; j++) if (spacings[j] > lower) lower = spacings[j];
    return (lower + upper) / 2;
  }
  const even = count % 2 === 0;
  const [lower, upper] = selectStreaming(timesS, count >> 1, even, minS, maxS, inMemorySpacings);
  return even ? (lower + upper) / 2 : upper;
}

/**
 * The (k−1)-th (when `withLower`, else NaN) and k-th smallest spacings (0-based; k ≥ 1) without holding them all: each pass
 * bins the spacings within [lowS, highS] and keeps the bin holding the k-th, until one bin is
 * small enough to copy and select in memory. Both ranks come from the same passes (an even
 * count's median needs the two): when they fall in different bins, one more pass takes the
 * largest spacing of the lower bin and the smallest of the upper.
 */
function selectStreaming(timesS: Series, k: number, withLower: boolean, lowS: number, highS: number, inMemorySpacings: number): [number, number] {
  const n = timesS.length;
  const t0 = timesS.get(0);
  for (;;) {
    // a range narrowed to the bin of both ranks holds them both: all equal here
    if (!(highS > lowS)) return [lowS, lowS];
    const lo = lowS;
    const hi = highS;
    const widthS = (hi - lo) / SELECT_BINS;
    // loops written out in each pass: a callback per spacing costs more than the pass itself
    const counts = new Float64Array(SELECT_BINS);
    let below = 0;
    let previous = t0;
    timesS.scan(1, n, (values) => {
      let before = previous;
      for (let j = 0; j < values.length; j++) {
        const d = values[j] - before;
        before = values[j];
        if (d < lo) below++;
        else if (d <= hi) counts[Math.min(SELECT_BINS - 1, Math.floor((d - lo) / widthS))]++;
      }
      previous = before;
    });
    // the bins of ranks k and k − 1, and k's rank within its bin
    let bin = 0;
    let rank = k - below;
    let lowerBin = -1;
    while (bin < SELECT_BINS - 1 && rank >= counts[bin]) {
      if (counts[bin] > 0) lowerBin = bin;
      rank -= counts[bin++];
    }
    if (rank >= 1 || !withLower) lowerBin = bin;
    // (the first pass has nothing below it, and a narrowed range holds k − 1 with k)
    if (lowerBin !== bin) {
      // k is the first of its bin: k − 1 is the largest spacing of the bin before
      return [extremeInBin(timesS, lo, hi, widthS, lowerBin, 1), extremeInBin(timesS, lo, hi, widthS, bin, -1)];
    }
    const inBin = counts[bin];
    const keep = inBin <= inMemorySpacings ? new Float64Array(inBin) : null;
    let kept = 0;
    let nextLow = Number.POSITIVE_INFINITY;
    let nextHigh = Number.NEGATIVE_INFINITY;
    previous = t0;
    timesS.scan(1, n, (values) => {
      let before = previous;
      for (let j = 0; j < values.length; j++) {
        const d = values[j] - before;
        before = values[j];
        if (d >= lo && d <= hi && Math.min(SELECT_BINS - 1, Math.floor((d - lo) / widthS)) === bin) {
          if (keep !== null) {
            if (kept < keep.length) keep[kept++] = d;
          } else {
            if (d < nextLow) nextLow = d;
            if (d > nextHigh) nextHigh = d;
          }
        }
      }
      previous = before;
    });
    if (keep !== null) {
      // k − 1 shares the bin, so rank ≥ 1: it is the largest of those selected before k
      const values = keep.subarray(0, kept);
      const at = Math.min(rank, kept - 1);
      const upper = selectInPlace(values, at);
      if (!withLower) return [Number.NaN, upper];
      let lower = Number.NEGATIVE_INFINITY;
      for (let j = 0; j < at; j++) if (values[j] > lower) lower = values[j];
      return [lower, upper];
    }
    // k stays the rank among all spacings: the next pass counts those below the new range again
    lowS = nextLow;
    highS = nextHigh;
  }
}

/** The largest (`pick` 1) or smallest (−1) spacing in one bin of [lo, hi]. */
function extremeInBin(timesS: Series, lo: number, hi: number, widthS: number, bin: number, pick: 1 | -1): number {
  let best = pick === 1 ? Number.NEGATIVE_INFINITY : Number.POSITIVE_INFINITY;
  let previous = timesS.get(0);
  timesS.scan(1, timesS.length, (values) => {
    let before = previous;
    let extreme = best;
    for (let j = 0; j < values.length; j++) {
      const d = values[j] - before;
      before = values[j];
      if (d >= lo && d <= hi && Math.min(SELECT_BINS - 1, Math.floor((d - lo) / widthS)) === bin && (pick === 1 ? d > extreme : d < extreme)) extreme = d;
    }
    best = extreme;
    previous = before;
  });
  return best;
}



/**
 * Hoare's selection with a median-of-three pivot: on return `values[k]` is the k-th smallest
 * and everything before it is no larger. Expected linear time.
 */
export function selectInPlace(values: Float64Array, k: number): number {
  let left = 0;
  let right = values.length - 1;
  while (right > left) {
    const middle = (left + right) >> 1;
    const a = values[left];
    const b = values[middle];
    const c = values[right];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = left;
    let j = right;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const swap = values[i];
        values[i] = values[j];
        values[j] = swap;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return values[k];
}
