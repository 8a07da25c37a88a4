import { summaryOf } from './passes';
import type { Series } from './series';

/** Flat runs at the extremes of a trace: where the signal sat on a rail. */
export interface Rails {
  /** Samples exactly at the maximum, and the longest unbroken run of them. */
  atMax: number;
  longestAtMax: number;
  atMin: number;
  longestAtMin: number;
  maxV: number;
  minV: number;
  /** Samples just short of the maximum (within 2 % of the range) and just above the minimum. */
  nearMax: number;
  nearMin: number;
}

// A rail is a run of at least this many identical samples holding this share of the record.
export const MIN_RAIL_RUN = 4;
export const MIN_RAIL_SHARE = 0.005;

/** Counts the samples sitting exactly on the maximum and on the minimum, in one pass. */
export function findRails(volts: Series): Rails {
  const { minV, maxV } = summaryOf(volts);
  // [at max, run at max, longest at max, at min, run at min, longest at min, near max, near min]
  const counts = new Float64Array(8);
  const nearV = 0.02 * (maxV - minV);
  volts.scan(0, volts.length, (values) => countAtExtremes(values, minV, maxV, nearV, counts));
  const [atMax, , longestAtMax, atMin, , longestAtMin, nearMax, nearMin] = counts;
  return { atMax, longestAtMax, atMin, longestAtMin, maxV, minV, nearMax, nearMin };
}

/** Counts the samples on and near each extreme and the longest runs on them (see `findRails`); a module-level pass, as `scan` asks. */
function countAtExtremes(values: Float64Array, minV: number, maxV: number, nearV: number, counts: Float64Array): void {
  let [atMax, runMax, longestAtMax, atMin, runMin, longestAtMin, nearMax, nearMin] = counts;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v < maxV && v > maxV - nearV) nearMax++;
    if (v > minV && v < minV + nearV) nearMin++;
    if (v === maxV) {
      atMax++;
      if (++runMax > longestAtMax) longestAtMax = runMax;
    } else runMax = 0;
    if (v === minV) {
      atMin++;
      if (++runMin > longestAtMin) longestAtMin = runMin;
    } else runMin = 0;
  }
  counts.set([atMax, runMax, longestAtMax, atMin, runMin, longestAtMin, nearMax, nearMin]);
}

/**
 * A rail: a run of identical samples on the extreme, holding a share of the record, and at least
 * twice as many samples as the 2 % of the range just inside it. A signal that turns at its peak
 * (a finely sampled, quantised sine) dwells about as long just below its top code as on it; one
 * cut off by a rail arrives steeply and piles up on it.
 */
export function isRail(count: number, longest: number, near: number, total: number): boolean {
  return longest >= MIN_RAIL_RUN && count >= MIN_RAIL_SHARE * total && count >= 2 * near;
}
