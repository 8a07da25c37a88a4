import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/**
 * The demo captures: CSV files made once by `npm run demo:captures` (ngspice transients of each
 * case's circuit, or a closed-form waveform sampled as the scope did) and committed, so seeding
 * needs no ngspice and never computes a waveform from the diagnosis engine.
 */
export const CAPTURE_DIR = fileURLToPath(new URL('./captures/', import.meta.url));
export const SPICE_DIR = fileURLToPath(new URL('./spice/', import.meta.url));

export const captureFile = (key: string) => `${CAPTURE_DIR}${key}.csv`;

export interface DemoTrace {
  timesS: Float64Array;
  /** What the scope recorded, on the screen's scale. */
  volts: Float64Array;
}

export const CAPTURE_HEADER = 'Time (s),Voltage (V)';

/** Reads one of our own capture files (header, then `time,volts` rows in SI units). */
export function readDemoCapture(key: string): { bytes: Buffer; trace: DemoTrace } {
  const bytes = readFileSync(captureFile(key));
  const rows = bytes.toString('utf8').trim().split('\n').slice(1);
  const timesS = new Float64Array(rows.length);
  const volts = new Float64Array(rows.length);
  rows.forEach((row, i) => {
    const [t, v] = row.split(',');
    timesS[i] = Number(t);
    volts[i] = Number(v);
  });
  return { bytes, trace: { timesS, volts } };
}

/** `Time (s),Voltage (V)` rows: six significant digits, as a bench export has. */
export function captureCsv(trace: DemoTrace): string {
  const rows = [CAPTURE_HEADER];
  for (let i = 0; i < trace.timesS.length; i++) rows.push(`${trace.timesS[i].toExponential(5)},${trace.volts[i].toPrecision(6)}`);
  return `${rows.join('\n')}\n`;
}
