import { asSeries, type Series } from './series';

// Up to this many spacings are copied and selected in memory; beyond, the median is found by
// narrowing histograms over further passes, so memory stays bounded however long the record.
const IN_MEMORY_SPACINGS = 1 << 18;
const SELECT_BINS = 4096;
/**
 * Distinct spacings counted in the first pass. A scope's time column is a start plus i times the
 * interval, written to a few significant digits: its spacings, as doubles, take a few dozen values
 * a rounding apart (more the more powers of two the record spans). When they take no more than
 * this, the counts give the median exactly and no further pass is needed.
 */
const DISTINCT_SPACINGS = 256;
// open addressing, at most half full
const TALLY_SLOTS = 2 * DISTINCT_SPACINGS;
const BITS = new Float64Array(1);
const WORDS = new Int32Array(BITS.buffer);

/**
 * The median spacing of the sample instants, in seconds: the sample interval of a uniformly
 * sampled capture, and a robust one of a capture with gaps or jitter in its time stamps.
 * Linear time (quickselect on a scratch copy of the spacings, or on a long record histograms
 * that narrow down on the middle one) rather than a sort of a million values; one pass when the
 * spacings take few distinct values. For an even count, the mean of the two middle spacings.
 *
 * @param timesS strictly increasing sample instants, s
 * @param inMemorySpacings most spacings copied to select in memory (tests make it small to reach the histogram passes)
 * @param distinctSpacings most distinct spacings counted in the first pass (tests set 0 to reach the other paths)
 * @returns the median interval, s, or null for fewer than 2 samples
 */
export function medianSampleIntervalS(times: Float64Array | Series, inMemorySpacings = IN_MEMORY_SPACINGS, distinctSpacings = DISTINCT_SPACINGS): number | null {
  const timesS = asSeries(times);
  const count = timesS.length - 1;
  if (count < 1) return null;
  const first = timesS.get(1) - timesS.get(0);
  // [previous time, least spacing, greatest spacing, 1 once a spacing differs from the first, distinct spacings counted, 1 once there were too many]
  const state = Float64Array.of(timesS.get(0), Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 0, 0, distinctSpacings > 0 ? 0 : 1);
  const distinct = new Float64Array(TALLY_SLOTS);
  const tally = new Float64Array(TALLY_SLOTS);
  timesS.scan(1, count + 1, (values) => spacingRange(values, first, state, Math.min(distinctSpacings, DISTINCT_SPACINGS), distinct, tally));
  if (state[3] === 0) return first;
  if (state[5] === 0) return medianOfTally(distinct, tally, count);
  const minS = state[1];
  const maxS = state[2];
  if (count <= inMemorySpacings) {
    const spacings = new Float64Array(count);
    state[0] = timesS.get(0);
    timesS.scan(1, count + 1, (values, at) => copySpacings(values, spacings, at - 1, state));
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

/*
 * Each pass's loop is a module-level function called per block, its state in a Float64Array
 * (see `scan` in series.ts for why).
 */

/**
 * state: [previous time, least spacing, greatest spacing, 1 once a spacing differs from `first`,
 * distinct spacings counted, 1 once there were more than `most`]. The counts are a hash table:
 * `distinct` holds the spacings (0 in an empty slot: a spacing is positive), `tally` their counts.
 */
function spacingRange(values: Float64Array, first: number, state: Float64Array, most: number, distinct: Float64Array, tally: Float64Array): void {
  let before = state[0];
  let lo = state[1];
  let hi = state[2];
  let differs = state[3];
  let size = state[4];
  let overflow = state[5];
  const mask = distinct.length - 1;
  // the slot of the spacing before is tried first: consecutive spacings are often equal
  let lastSlot = -1;
  let lastD = 0;
  for (let j = 0; j < values.length; j++) {
    const d = values[j] - before;
    before = values[j];
    if (d !== first) differs = 1;
    if (d < lo) lo = d;
    if (d > hi) hi = d;
    if (overflow !== 0) continue;
    // 0 marks an empty slot: a spacing that is not positive (times scaled into a tie) leaves the median to the other paths
    if (!(d > 0)) {
      overflow = 1;
      continue;
    }
    if (d === lastD) {
      tally[lastSlot]++;
      continue;
    }
    BITS[0] = d;
    let slot = Math.imul(WORDS[0] ^ WORDS[1], 0x9e3779b1) >>> 23 & mask;
    while (distinct[slot] !== 0 && distinct[slot] !== d) slot = (slot + 1) & mask;
    if (distinct[slot] === 0) {
      if (size === most) {
        overflow = 1;
        continue;
      }
      distinct[slot] = d;
      size++;
    }
    tally[slot]++;
    lastSlot = slot;
    lastD = d;
  }
  state[0] = before;
  state[1] = lo;
  state[2] = hi;
  state[3] = differs;
  state[4] = size;
  state[5] = overflow;
}

/** The median of `count` spacings, counted in `distinct` and `tally` by `spacingRange`. */
function medianOfTally(distinct: Float64Array, tally: Float64Array, count: number): number {
  const order = Array.from(distinct.keys()).filter((slot) => distinct[slot] !== 0).sort((a, b) => distinct[a] - distinct[b]);
  // the spacing of rank k (0-based) in sorted order
  const atRank = (k: number) => {
    let below = 0;
    for (const slot of order) {
      below += tally[slot];
      if (k < below) return distinct[slot];
    }
    return distinct[order[order.length - 1]];
  };
  const upper = atRank(count >> 1);
  return count % 2 === 1 ? upper : (atRank((count >> 1) - 1) + upper) / 2;
}

/** state: [previous time] */
function copySpacings(values: Float64Array, out: Float64Array, at: number, state: Float64Array): void {
  let before = state[0];
  for (let j = 0; j < values.length; j++) {
    out[at + j] = values[j] - before;
    before = values[j];
  }
  state[0] = before;
}

/** Bin of a spacing d ≥ lo in the histogram of [lo, lo + SELECT_BINS·widthS]. */
const binOf = (d: number, lo: number, widthS: number) => Math.min(SELECT_BINS - 1, Math.floor((d - lo) / widthS));

/** state: [previous time, spacings below lo]; counts the spacings within [lo, hi] by bin */
function countSpacings(values: Float64Array, lo: number, hi: number, widthS: number, counts: Float64Array, state: Float64Array): void {
  let before = state[0];
  let below = state[1];
  for (let j = 0; j < values.length; j++) {
    const d = values[j] - before;
    before = values[j];
    if (d < lo) below++;
    else if (d <= hi) counts[binOf(d, lo, widthS)]++;
  }
  state[0] = before;
  state[1] = below;
}

/** state: [previous time, spacings kept]: copies the spacings in one bin into `keep` while it has room */
function keepBin(values: Float64Array, lo: number, hi: number, widthS: number, bin: number, keep: Float64Array, state: Float64Array): void {
  let before = state[0];
  let kept = state[1] | 0;
  for (let j = 0; j < values.length; j++) {
    const d = values[j] - before;
    before = values[j];
    if (d >= lo && d <= hi && binOf(d, lo, widthS) === bin && kept < keep.length) keep[kept++] = d;
  }
  state[0] = before;
  state[1] = kept;
}

/** state: [previous time, least, greatest] of the spacings in one bin (a kernel apart from `keepBin`: each keeps one shape) */
function rangeOfBin(values: Float64Array, lo: number, hi: number, widthS: number, bin: number, state: Float64Array): void {
  let before = state[0];
  let least = state[1];
  let greatest = state[2];
  for (let j = 0; j < values.length; j++) {
    const d = values[j] - before;
    before = values[j];
    if (d >= lo && d <= hi && binOf(d, lo, widthS) === bin) {
      if (d < least) least = d;
      if (d > greatest) greatest = d;
    }
  }
  state[0] = before;
  state[1] = least;
  state[2] = greatest;
}

/**
 * The (k−1)-th (when `withLower`, else NaN) and k-th smallest spacings (0-based; k ≥ 1) without
 * holding them all: each pass bins the spacings within [lowS, highS] and keeps the bin holding
 * the k-th, until one bin is small enough to copy and select in memory. Both ranks come from the
 * same passes (an even count's median needs the two): when they fall in different bins, one
 * more pass each takes the range of the lower bin and of the upper.
 */
function selectStreaming(timesS: Series, k: number, withLower: boolean, lowS: number, highS: number, inMemorySpacings: number): [number, number] {
  const n = timesS.length;
  const t0 = timesS.get(0);
  const state = new Float64Array(4);
  for (;;) {
    // a range narrowed to the bin of both ranks holds them both: all equal here
    if (!(highS > lowS)) return [lowS, lowS];
    const lo = lowS;
    const hi = highS;
    const widthS = (hi - lo) / SELECT_BINS;
    const counts = new Float64Array(SELECT_BINS);
    state[0] = t0;
    state[1] = 0;
    timesS.scan(1, n, (values) => countSpacings(values, lo, hi, widthS, counts, state));
    const below = state[1];
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
      return [binRange(timesS, lo, hi, widthS, lowerBin)[1], binRange(timesS, lo, hi, widthS, bin)[0]];
    }
    if (counts[bin] <= inMemorySpacings) {
      const keep = new Float64Array(counts[bin]);
      state.set([t0, 0]);
      timesS.scan(1, n, (values) => keepBin(values, lo, hi, widthS, bin, keep, state));
      // k − 1 shares the bin, so rank ≥ 1: it is the largest of those selected before k
      const values = keep.subarray(0, state[1]);
      const at = Math.min(rank, values.length - 1);
      const upper = selectInPlace(values, at);
      if (!withLower) return [Number.NaN, upper];
      let lower = Number.NEGATIVE_INFINITY;
      for (let j = 0; j < at; j++) if (values[j] > lower) lower = values[j];
      return [lower, upper];
    }
    // k stays the rank among all spacings: the next pass counts those below the new range again
    [lowS, highS] = binRange(timesS, lo, hi, widthS, bin);
  }
}

/** The least and greatest spacing in one bin of [lo, hi]. */
function binRange(timesS: Series, lo: number, hi: number, widthS: number, bin: number): [number, number] {
  const n = timesS.length;
  const state = Float64Array.of(timesS.get(0), Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY);
  timesS.scan(1, n, (values) => rangeOfBin(values, lo, hi, widthS, bin, state));
  return [state[1], state[2]];
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
