import { asSeries, type Series } from './series';
import type { CaptureSamples } from './types';

/** First index in [0, n) whose time is later than `timeS` (or at least it, with `orEqual`). */
export function firstAfter(timesS: Series, n: number, timeS: number, orEqual: boolean): number {
  let low = 0;
  let high = n;
  while (low < high) {
    const middle = (low + high) >>> 1;
    const t = timesS.get(middle);
    if (t < timeS || (!orEqual && t === timeS)) low = middle + 1;
    else high = middle;
  }
  return low;
}

/**
 * Min/max decimation for plotting: splits [fromS, toS] into `columns` equal time slices (one
 * per pixel column) and keeps the lowest and the highest sample of each, in the order they
 * occur, so a line through the result draws the same envelope as a line through every sample:
 * no peak, glitch or ringing excursion is lost however many samples share a column. The
 * output holds at most 2·columns samples; a range that already fits is returned as it is.
 * One pass over the samples in the range, located by binary search.
 *
 * @param timesS sample instants, s (strictly increasing)
 * @param volts samples, V
 * @param columns number of pixel columns, at least 1
 * @param fromS start of the visible range, s (default: first sample)
 * @param toS end of the visible range, s (default: last sample)
 */
export function decimateMinMax(
  times: Float64Array | Series,
  samples: Float64Array | Series,
  columns: number,
  fromS?: number,
  toS?: number,
): CaptureSamples {
  const timesS = asSeries(times);
  const volts = asSeries(samples);
  const n = Math.min(timesS.length, volts.length);
  const columnCount = Math.floor(columns);
  const empty = { timesS: new Float64Array(0), volts: new Float64Array(0) };
  if (n === 0 || !(columnCount >= 1)) return empty;
  const startS = fromS ?? timesS.get(0);
  const endS = toS ?? timesS.get(n - 1);
  if (!(endS >= startS)) return empty;
  const first = firstAfter(timesS, n, startS, true);
  const last = firstAfter(timesS, n, endS, false) - 1;
  if (last < first) return empty;
  if (last - first + 1 <= 2 * columnCount) {
    return { timesS: copyOf(timesS, first, last + 1), volts: copyOf(volts, first, last + 1) };
  }
  const outTimesS = new Float64Array(2 * columnCount);
  const outVolts = new Float64Array(2 * columnCount);
  let length = 0;
  const keep = (index: number) => {
    outTimesS[length] = timesS.get(index);
    outVolts[length] = volts.get(index);
    length++;
  };
  const flush = (minIndex: number, maxIndex: number) => {
    if (minIndex === maxIndex) keep(minIndex);
    else if (minIndex < maxIndex) {
      keep(minIndex);
      keep(maxIndex);
    } else {
      keep(maxIndex);
      keep(minIndex);
    }
  };
  const spanS = endS - startS;
  const columnOf = (timeS: number) =>
    spanS > 0 ? Math.min(columnCount - 1, Math.floor(((timeS - startS) / spanS) * columnCount)) : 0;
  let column = columnOf(timesS.get(first));
  let minIndex = first;
  let maxIndex = first;
  let minV = volts.get(first);
  let maxV = minV;
  for (let i = first + 1; i <= last; i++) {
    const here = columnOf(timesS.get(i));
    const v = volts.get(i);
    if (here !== column) {
      flush(minIndex, maxIndex);
      column = here;
      minIndex = i;
      maxIndex = i;
      minV = v;
      maxV = v;
    } else if (v < minV) {
      minIndex = i;
      minV = v;
    } else if (v > maxV) {
      maxIndex = i;
      maxV = v;
    }
  }
  flush(minIndex, maxIndex);
  return { timesS: outTimesS.subarray(0, length), volts: outVolts.subarray(0, length) };
}

function copyOf(series: Series, from: number, to: number): Float64Array {
  const out = new Float64Array(to - from);
  series.scan(from, to, (values, firstIndex) => out.set(values, firstIndex - from));
  return out;
}
