import { closeSync, mkdirSync, openSync } from 'node:fs';
import path from 'node:path';
import type { Series } from '../../shared/capture/series';
import { SCAN_ROWS, writeAll, writeMeta, type OpenStore } from './sample-store';

/**
 * A compact copy of a store for plots: channels (in volts) as whole multiples of 10^−d in Int32
 * when that keeps every value exactly, else Float32; the time axis as
 * start + i·interval when every time lies within a millionth of an interval of it, else Float64
 * seconds. One pass over each column.
 */
export function writePlotStore(source: OpenStore, dir: string): void {
  mkdirSync(dir, { recursive: true });
  const { rows, channelCount } = source.meta;
  const startS = source.timesS.get(0);
  const intervalS = rows > 1 ? (source.timesS.get(rows - 1) - startS) / (rows - 1) : 0;
  let uniform = rows > 1 && intervalS > 0;
  if (uniform) {
    source.timesS.scan(0, rows, (values, first) => {
      if (uniform && !onUniformGrid(values, first, startS, intervalS)) uniform = false;
    });
  }
  if (!uniform) copyColumn(source.timesS, path.join(dir, 'time.f64'), 'f64');
  const channelDecimals: (number | null)[] = [];
  for (let c = 1; c <= channelCount; c++) {
    const decimals = exactDecimals(source.channel(c));
    channelDecimals.push(decimals);
    copyColumn(source.channel(c), path.join(dir, `ch${c}.${decimals === null ? 'f32' : 'i32'}`), decimals === null ? 'f32' : 'i32', decimals ?? 0);
  }
  writeMeta(dir, {
    rows,
    channelCount,
    precision: 'compact',
    channelDecimals,
    timeExp10: 0,
    channelExp10s: Array.from({ length: channelCount }, () => 0),
    ...(uniform ? { uniformTime: { startS, intervalS } } : {}),
  });
}

const MAX_DECIMALS = 9;
const I32_MAX = 2 ** 31 - 1;

/**
 * The fewest decimals d such that every value v is exactly round(v·10^d)/10^d with the integer
 * within Int32 (so the plot gets back the very doubles the parser read), or null. Two passes:
 * find d, then check every value at it.
 */
function exactDecimals(series: Series): number | null {
  let decimals = 0;
  series.scan(0, series.length, (values) => (decimals = decimalsNeeded(values, decimals)));
  if (decimals > MAX_DECIMALS) return null;
  let all = true;
  series.scan(0, series.length, (values) => {
    if (all && !allExact(values, decimals)) all = false;
  });
  return all ? decimals : null;
}

// The loops over samples are module-level functions called per block (see `scan` in shared/capture/series.ts).

/** True when every time is within a millionth of an interval of start + i·interval. */
function onUniformGrid(values: Float64Array, first: number, startS: number, intervalS: number): boolean {
  for (let k = 0; k < values.length; k++) if (Math.abs(values[k] - (startS + (first + k) * intervalS)) > 1e-6 * intervalS) return false;
  return true;
}

/** v is exactly round(v·10^d)/10^d, the integer within Int32. */
function exactAt(v: number, d: number): boolean {
  const scale = 10 ** d;
  const n = Math.round(v * scale);
  return Math.abs(n) <= I32_MAX && n / scale === v;
}

/** The fewest decimals, from `decimals` up, at which every value of the block is exact (past MAX_DECIMALS: none is). */
function decimalsNeeded(values: Float64Array, decimals: number): number {
  for (let k = 0; k < values.length && decimals <= MAX_DECIMALS; k++) {
    while (decimals <= MAX_DECIMALS && !exactAt(values[k], decimals)) decimals++;
  }
  return decimals;
}

function allExact(values: Float64Array, decimals: number): boolean {
  for (let k = 0; k < values.length; k++) if (!exactAt(values[k], decimals)) return false;
  return true;
}

function toScaledInts(values: Float64Array, scale: number, out: Int32Array): void {
  for (let k = 0; k < values.length; k++) out[k] = Math.round(values[k] * scale);
}

function copyColumn(series: Series, file: string, format: 'f64' | 'f32' | 'i32', decimals = 0): void {
  const fd = openSync(file, 'w');
  try {
    const out = format === 'f64' ? new Float64Array(SCAN_ROWS) : format === 'f32' ? new Float32Array(SCAN_ROWS) : new Int32Array(SCAN_ROWS);
    const scale = 10 ** decimals;
    series.scan(0, series.length, (values) => {
      if (out instanceof Int32Array) toScaledInts(values, scale, out);
      else out.set(values);
      writeAll(fd, new Uint8Array(out.buffer, 0, values.length * out.BYTES_PER_ELEMENT));
    });
  } finally {
    closeSync(fd);
  }
}
