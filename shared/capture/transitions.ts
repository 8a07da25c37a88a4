import type { ReferenceLevels } from './levels';
import { asSeries, type Series } from './series';

export type EdgeKind = 'rise' | 'fall';

/** One transition between the two states, with its reference-level instants. */
export interface Transition {
  kind: EdgeKind;
  /** Instant the waveform crosses the 10 % reference level, s (the start of a rise, the end of a fall). */
  t10S: number;
  /** Instant of the 50 % (mid) reference level crossing, s. */
  t50S: number;
  /** Instant the waveform crosses the 90 % reference level, s. */
  t90S: number;
  /** Transition duration between the 10 % and 90 % instants, s. */
  durationS: number;
  /** Last sample still in the state the transition leaves. */
  startIndex: number;
  /** First sample past the reference level of the state the transition enters. */
  endIndex: number;
}

/**
 * Instant a straight line through two samples crosses `levelV`, s: linear interpolation
 * between the samples either side of a reference level, since the instant a sampled waveform
 * crosses a level almost never falls on a sample.
 */
export function crossingTimeS(t0S: number, v0: number, t1S: number, v1: number, levelV: number): number {
  return t0S + ((levelV - v0) * (t1S - t0S)) / (v1 - v0);
}

/**
 * Finds every complete transition (IEEE Std 181-2011, 5.3.3: transition duration between the
 * 10 % and 90 % reference level instants), in one pass.
 *
 * A rise runs from the last sample at or below the low reference level to the first one at
 * or above the high level; a fall the other way round. Using the two outer levels as
 * hysteresis keeps noise about the mid level from counting as edges; a transition already
 * under way when the record starts, or unfinished when it ends, is not counted. Between the
 * two outer samples the mid level may be crossed more than once in noise: the first crossing
 * is taken. Each instant is interpolated between the samples either side of its level, or
 * read from a line fitted to the samples about it where the noise is larger than the step
 * between them.
 *
 * @param timesS sample instants, s (strictly increasing)
 * @param volts samples, V
 * @param levels reference levels from `referenceLevels` (lowV < midV < highV)
 * @param noiseV standard deviation of the noise on the samples, V (0: interpolate only)
 */
export function findTransitions(
  times: Float64Array | Series,
  samples: Float64Array | Series,
  levels: ReferenceLevels,
  noiseV = 0,
): Transition[] {
  const timesS = asSeries(times);
  const volts = asSeries(samples);
  // [state: −1 low, 1 high, 0 not yet either; last sample at or below lowV; last at or above highV]
  // Int32: a record of 2^31 samples or more (over 4 GiB of the shortest rows, twice the default
  // upload limit) is beyond this walk
  const walk = Int32Array.of(0, -1, -1);
  // the walk only notes where each edge starts and ends (1 for a rise, −1 for a fall, then the two
  // indices, all small integers); the transitions are measured afterwards. Built inside the walk,
  // they made its optimised code depend on their shape, and it was thrown away run after run.
  const found: number[] = [];
  volts.scan(0, volts.length, (values, firstIndex) => walkStates(values, firstIndex, levels, walk, found));
  const transitions: Transition[] = [];
  for (let k = 0; k < found.length; k += 3) {
    transitions.push(found[k] === 1 ? rise(timesS, volts, found[k + 1], found[k + 2], levels, noiseV) : fall(timesS, volts, found[k + 1], found[k + 2], levels, noiseV));
  }
  return transitions;
}

/** One block of `findTransitions`' walk between the states (a module-level pass, as `scan` asks). */
function walkStates(values: Float64Array, firstIndex: number, levels: ReferenceLevels, walk: Int32Array, found: number[]): void {
  const { lowV, highV } = levels;
  let state = walk[0];
  let lastLow = walk[1];
  let lastHigh = walk[2];
  for (let j = 0; j < values.length; j++) {
    const v = values[j];
    const i = firstIndex + j;
    if (v <= lowV) {
      if (state === 1) found.push(-1, lastHigh, i);
      state = -1;
      lastLow = i;
    } else if (v >= highV) {
      if (state === -1) found.push(1, lastLow, i);
      state = 1;
      lastHigh = i;
    }
  }
  walk[0] = state;
  walk[1] = lastLow;
  walk[2] = lastHigh;
}

// A noisy edge is many samples long; its crossings come from a line fitted to this share of
// them about each one rather than from the two samples either side.
const FIT_SHARE = 1 / 20;
const MIN_FIT_REACH = 2;
const MAX_FIT_ROUNDS = 8;

/**
 * Instant a straight line fitted (least squares) to the samples within `reach` of `index`
 * crosses `levelV`, moved onto its own answer and fitted again until it stays put. Used only
 * where the noise exceeds the edge's mean step from one sample to the next, so that the two samples
 * either side of a level say more about the noise than about the edge: it removes the bias
 * of taking the first sample that noise carries past the level, which on the slow end of an
 * RC edge is several per cent of the rise time. The window's 1/20 of the edge costs under
 * 0.1 % of the duration in curvature on an exponential edge.
 */
function fittedCrossingS(
  timesS: Series,
  volts: Series,
  index: number,
  reach: number,
  levelV: number,
  interpolatedS: number,
): number {
  if (reach < MIN_FIT_REACH) return interpolatedS;
  const n = volts.length;
  let center = index;
  let crossingS = interpolatedS;
  for (let round = 0; round < MAX_FIT_ROUNDS; round++) {
    const from = Math.max(0, center - reach);
    const to = Math.min(n - 1, center + reach);
    let meanT = 0;
    let meanV = 0;
    for (let k = from; k <= to; k++) {
      meanT += timesS.get(k);
      meanV += volts.get(k);
    }
    const count = to - from + 1;
    meanT /= count;
    meanV /= count;
    let sumTV = 0;
    let sumTT = 0;
    for (let k = from; k <= to; k++) {
      const dt = timesS.get(k) - meanT;
      sumTV += dt * (volts.get(k) - meanV);
      sumTT += dt * dt;
    }
    const slope = sumTV / sumTT;
    if (!(slope !== 0 && Number.isFinite(slope))) return interpolatedS;
    crossingS = meanT + (levelV - meanV) / slope;
    if (!Number.isFinite(crossingS)) return interpolatedS;
    // Beyond the window the line is an extrapolation: move the window that way and fit again.
    let next = center;
    while (next > from && timesS.get(next) > crossingS) next--;
    while (next < to && timesS.get(next + 1) <= crossingS) next++;
    if (next === center) return crossingS;
    center = next;
  }
  return crossingS;
}

/**
 * The instant the waveform crosses `levelV` between samples k and k + 1, s: interpolated, or
 * read from a fitted line.
 */
function crossingNear(
  timesS: Series,
  volts: Series,
  k: number,
  reach: number,
  levelV: number,
  fit: boolean,
): number {
  const interpolatedS = crossingTimeS(timesS.get(k), volts.get(k), timesS.get(k + 1), volts.get(k + 1), levelV);
  return fit ? fittedCrossingS(timesS, volts, k, reach, levelV, interpolatedS) : interpolatedS;
}

function rise(timesS: Series, volts: Series, from: number, to: number, levels: ReferenceLevels, noiseV: number): Transition {
  const reach = Math.floor((to - from) * FIT_SHARE);
  const fit = noiseV > Math.abs(volts.get(to) - volts.get(from)) / (to - from);
  const crossing = (k: number, levelV: number) => crossingNear(timesS, volts, k, reach, levelV, fit);
  let mid = from;
  while (volts.get(mid + 1) < levels.midV) mid++;
  const t10S = crossing(from, levels.lowV);
  const t50S = crossing(mid, levels.midV);
  const t90S = crossing(to - 1, levels.highV);
  return { kind: 'rise', t10S, t50S, t90S, durationS: t90S - t10S, startIndex: from, endIndex: to };
}

function fall(timesS: Series, volts: Series, from: number, to: number, levels: ReferenceLevels, noiseV: number): Transition {
  const reach = Math.floor((to - from) * FIT_SHARE);
  const fit = noiseV > Math.abs(volts.get(to) - volts.get(from)) / (to - from);
  const crossing = (k: number, levelV: number) => crossingNear(timesS, volts, k, reach, levelV, fit);
  let mid = from;
  while (volts.get(mid + 1) > levels.midV) mid++;
  const t90S = crossing(from, levels.highV);
  const t50S = crossing(mid, levels.midV);
  const t10S = crossing(to - 1, levels.lowV);
  return { kind: 'fall', t10S, t50S, t90S, durationS: t10S - t90S, startIndex: from, endIndex: to };
}
