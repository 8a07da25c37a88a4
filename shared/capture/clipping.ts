import { countBetween, summaryOf } from './passes';
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

/**
 * Clipping: a flat run of identical samples on the maximum or minimum. On a trace with visible
 * noise no real level is that flat, so such a run is a rail. On a noiseless trace a square's
 * own flats look the same, so there it takes a run on only one extreme, or the extreme lying
 * at or beyond the screen's edge (4 divisions from the centre at the file's V/div and offset).
 */
export function isClipped(
  volts: Series,
  rails: Rails,
  top: boolean,
  bottom: boolean,
  noiseV: number,
  rangeV: number,
  screen: { voltsPerDiv?: number; offsetV?: number },
): boolean {
  if (!top && !bottom) return false;
  if (screen.voltsPerDiv !== undefined && screen.voltsPerDiv > 0) {
    const centerV = screen.offsetV ?? 0;
    const edgeV = 3.9 * screen.voltsPerDiv;
    if ((top && rails.maxV >= centerV + edgeV) || (bottom && rails.minV <= centerV - edgeV)) return true;
  }
  if (noiseV > 1e-6 * rangeV) return true;
  // noiseless: one flat extreme and a moving other one means a rail; two flats may be a square's levels
  if (top !== bottom) return true;
  return slopedShare(volts, rails.minV, rails.maxV) >= 0.2;
}

/** Share of samples between 10 % and 90 % of the range: large for a sine clipped at its rails. */
function slopedShare(volts: Series, minV: number, maxV: number): number {
  const lowV = minV + 0.1 * (maxV - minV);
  const highV = maxV - 0.1 * (maxV - minV);
  const count = new Float64Array(1);
  volts.scan(0, volts.length, (values) => countBetween(values, lowV, highV, count));
  return count[0] / volts.length;
}
