import type { ReferenceLevels } from './levels';

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
 * Instant a straight line through two samples crosses `levelV` (linear interpolation between
 * the samples either side of a reference level, as IEEE Std 181-2011 allows where the waveform
 * is sampled), s.
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
 * is taken.
 *
 * @param timesS sample instants, s (strictly increasing)
 * @param volts samples, V
 * @param levels reference levels from `referenceLevels` (lowV < midV < highV)
 */
export function findTransitions(timesS: Float64Array, volts: Float64Array, levels: ReferenceLevels): Transition[] {
  const { lowV, highV } = levels;
  const transitions: Transition[] = [];
  let state = 0;
  let lastLow = -1;
  let lastHigh = -1;
  const n = volts.length;
  for (let i = 0; i < n; i++) {
    const v = volts[i];
    if (v <= lowV) {
      if (state === 1) transitions.push(fall(timesS, volts, lastHigh, i, levels));
      state = -1;
      lastLow = i;
    } else if (v >= highV) {
      if (state === -1) transitions.push(rise(timesS, volts, lastLow, i, levels));
      state = 1;
      lastHigh = i;
    }
  }
  return transitions;
}

function rise(timesS: Float64Array, volts: Float64Array, from: number, to: number, levels: ReferenceLevels): Transition {
  const t10S = crossingTimeS(timesS[from], volts[from], timesS[from + 1], volts[from + 1], levels.lowV);
  const t90S = crossingTimeS(timesS[to - 1], volts[to - 1], timesS[to], volts[to], levels.highV);
  let k = from;
  while (volts[k + 1] < levels.midV) k++;
  const t50S = crossingTimeS(timesS[k], volts[k], timesS[k + 1], volts[k + 1], levels.midV);
  return { kind: 'rise', t10S, t50S, t90S, durationS: t90S - t10S, startIndex: from, endIndex: to };
}

function fall(timesS: Float64Array, volts: Float64Array, from: number, to: number, levels: ReferenceLevels): Transition {
  const t90S = crossingTimeS(timesS[from], volts[from], timesS[from + 1], volts[from + 1], levels.highV);
  const t10S = crossingTimeS(timesS[to - 1], volts[to - 1], timesS[to], volts[to], levels.lowV);
  let k = from;
  while (volts[k + 1] > levels.midV) k++;
  const t50S = crossingTimeS(timesS[k], volts[k], timesS[k + 1], volts[k + 1], levels.midV);
  return { kind: 'fall', t10S, t50S, t90S, durationS: t10S - t90S, startIndex: from, endIndex: to };
}
