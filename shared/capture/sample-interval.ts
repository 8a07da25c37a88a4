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
 * @returns the median interval, s, or null for fewer than 2 samples
 */
export function medianSampleIntervalS(times: Float64Array | Series): number | null {
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
  if (count <= IN_MEMORY_SPACINGS) {
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
  const upper = selectStreaming(timesS, count >> 1, minS, maxS);
  if (count % 2 === 1) return upper;
  return (selectStreaming(timesS, (count >> 1) - 1, minS, maxS) + upper) / 2;
}

/**
 * The k-th smallest spacing (0-based) without holding them all: each pass bins the spacings
 * within [lowS, highS] and keeps the bin holding the k-th, until one bin is small enough to
 * copy and select in memory.
 */
function selectStreaming(timesS: Series, k: number, lowS: number, highS: number): number {
  const n = timesS.length;
  const t0 = timesS.get(0);
  for (;;) {
    if (!(highS > lowS)) return lowS;
    const lo = lowS;
    const hi = highS;
    const widthS = (hi - lo) / SELECT_BINS;
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
    let rank = k - below;
    let bin = 0;
    while (bin < SELECT_BINS - 1 && rank >= counts[bin]) rank -= counts[bin++];
    const inBin = counts[bin];
    const keep = inBin <= IN_MEMORY_SPACINGS ? new Float64Array(inBin) : null;
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
    if (keep !== null) return selectInPlace(keep.subarray(0, kept), Math.min(rank, kept - 1));
    // k stays the rank among all spacings: the next pass counts those below the new range again
    lowS = nextLow;
    highS = nextHigh;
  }
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
