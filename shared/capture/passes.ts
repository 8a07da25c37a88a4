/*
 * Whole-record passes shared by the capture measurements, each a module-level function called
 * per block with its running state in a Float64Array (see `scan` in series.ts for why).
 */

import type { Series } from './series';

export interface SeriesSummary {
  minV: number;
  maxV: number;
  sumV: number;
}

const summaries = new WeakMap<Series, SeriesSummary>();

/**
 * The least, greatest and sum of a series' samples, read once per series: the state levels,
 * the rails and the mean all start from them. (A series is a view that never changes.)
 */
export function summaryOf(series: Series): SeriesSummary {
  let summary = summaries.get(series);
  if (!summary) {
    const range = Float64Array.of(Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 0);
    series.scan(0, series.length, (values) => rangeAndSum(values, range));
    summary = { minV: range[0], maxV: range[1], sumV: range[2] };
    summaries.set(series, summary);
  }
  return summary;
}

/** range: [least, greatest, sum] of the samples so far */
function rangeAndSum(values: Float64Array, range: Float64Array): void {
  let lo = range[0];
  let hi = range[1];
  let sum = range[2];
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
    sum += v;
  }
  range[0] = lo;
  range[1] = hi;
  range[2] = sum;
}

/** sum[0] += Σ (v − centreV)² */
export function addSquaredDeviations(values: Float64Array, centreV: number, sum: Float64Array): void {
  let total = sum[0];
  for (let i = 0; i < values.length; i++) total += (values[i] - centreV) ** 2;
  sum[0] = total;
}

/** count[0] += the samples strictly between lowV and highV */
export function countBetween(values: Float64Array, lowV: number, highV: number, count: Float64Array): void {
  let inside = count[0];
  for (let i = 0; i < values.length; i++) if (values[i] > lowV && values[i] < highV) inside++;
  count[0] = inside;
}
