/**
 * One column of samples, wherever it lives: a Float64Array in memory (tests, the client's paste
 * box) or a binary file on disk read a block at a time (the server, for captures of any size).
 * The analysis reads samples only through this, so its memory does not grow with the capture:
 * whole-record passes go through `scan` (a block at a time), the work about each edge through
 * `get` (the file reader keeps a few blocks around the places last read).
 */
export interface Series {
  readonly length: number;
  /** Sample i, 0 ≤ i < length. */
  get(i: number): number;
  /**
   * Calls `visit` with consecutive views covering samples [from, to), in order; `firstIndex` is
   * the index of `values[0]`. A view is only valid during its call.
   *
   * A pass over a long record should loop in a module-level function that `visit` calls, its
   * state in a Float64Array, not in `visit` itself: a pass runs once per capture, so its code is
   * cold, and a loop in a closure (or in the function driving the blocks) kept dropping from
   * optimised code back to the interpreter at each block, a heap number per sample (over 1 GB of
   * garbage for one 10M-sample analysis). A named function called per block is optimised once.
   */
  scan(from: number, to: number, visit: (values: Float64Array, firstIndex: number) => void): void;
}

/** A series over an array in memory; `scan` hands out the array itself in one piece. */
export class ArraySeries implements Series {
  constructor(readonly values: Float64Array) {}

  get length(): number {
    return this.values.length;
  }

  get(i: number): number {
    return this.values[i];
  }

  scan(from: number, to: number, visit: (values: Float64Array, firstIndex: number) => void): void {
    if (to > from) visit(this.values.subarray(from, to), from);
  }
}

/** Wraps an array as a series; a series is returned as it is. */
export function asSeries(values: Float64Array | Series): Series {
  return values instanceof Float64Array ? new ArraySeries(values) : values;
}

/** The first `length` samples of a series. */
export function headOf(series: Series, length: number): Series {
  if (length >= series.length) return series;
  if (series instanceof ArraySeries) return new ArraySeries(series.values.subarray(0, length));
  return {
    length,
    get: (i) => series.get(i),
    scan: (from, to, visit) => series.scan(from, Math.min(to, length), visit),
  };
}

/** A capture as two series of one length: time in s (strictly increasing) and voltage in V. */
export interface SampleSeries {
  timesS: Series;
  volts: Series;
}
