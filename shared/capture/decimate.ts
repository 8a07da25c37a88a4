import type { CaptureSamples } from './types';

/** First index in [0, n) whose time is later than `timeS` (or at least it, with `orEqual`). */
function firstAfter(timesS: Float64Array, n: number, timeS: number, orEqual: boolean): number {
  let low = 0;
  let high = n;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (timesS[middle] < timeS || (!orEqual && timesS[middle] === timeS)) low = middle + 1;
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
  timesS: Float64Array,
  volts: Float64Array,
  columns: number,
  fromS?: number,
  toS?: number,
): CaptureSamples {
  const n = Math.min(timesS.length, volts.length);
  const columnCount = Math.floor(columns);
  const empty = { timesS: new Float64Array(0), volts: new Float64Array(0) };
  if (n === 0 || !(columnCount >= 1)) return empty;
  const startS = fromS ?? timesS[0];
  const endS = toS ?? timesS[n - 1];
  if (!(endS >= startS)) return empty;
  const first = firstAfter(timesS, n, startS, true);
  const last = firstAfter(timesS, n, endS, false) - 1;
  if (last < first) return empty;
  if (last - first + 1 <= 2 * columnCount) {
    return { timesS: timesS.slice(first, last + 1), volts: volts.slice(first, last + 1) };
  }
  const outTimesS = new Float64Array(2 * columnCount);
  const outVolts = new Float64Array(2 * columnCount);
  let length = 0;
  const keep = (index: number) => {
    outTimesS[length] = timesS[index];
    outVolts[length] = volts[index];
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
  let column = columnOf(timesS[first]);
  let minIndex = first;
  let maxIndex = first;
  for (let i = first + 1; i <= last; i++) {
    const here = columnOf(timesS[i]);
    if (here !== column) {
      flush(minIndex, maxIndex);
      column = here;
      minIndex = i;
      maxIndex = i;
    } else if (volts[i] < volts[minIndex]) minIndex = i;
    else if (volts[i] > volts[maxIndex]) maxIndex = i;
  }
  flush(minIndex, maxIndex);
  return { timesS: outTimesS.subarray(0, length), volts: outVolts.subarray(0, length) };
}
