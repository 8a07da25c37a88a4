import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** What a netlist's control block writes with `wrdata`: one uniform time column and one vector. */
export const SPICE_OUTPUT = 'capture.txt';

/**
 * Runs a netlist in batch mode in a scratch folder and reads the vector its control block wrote
 * (`linearize` first, so the rows are on the transient's own uniform step).
 */
export function runNetlist(netlistPath: string): { timesS: number[]; volts: number[] } {
  const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-spice-'));
  try {
    execFileSync('ngspice', ['-b', path.resolve(netlistPath)], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
    const lines = readFileSync(path.join(dir, SPICE_OUTPUT), 'utf8').trim().split('\n');
    const timesS: number[] = [];
    const volts: number[] = [];
    for (const line of lines.slice(1)) {
      const [t, v] = line.trim().split(/\s+/).map(Number);
      if (Number.isFinite(t) && Number.isFinite(v)) {
        timesS.push(t);
        volts.push(v);
      }
    }
    if (timesS.length < 10) throw new Error(`${netlistPath}: ngspice wrote only ${timesS.length} rows`);
    return { timesS, volts };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Linear interpolation of (timesS, volts) at `t`; the rows are sorted by time. */
export function interpolate(timesS: number[], volts: number[], t: number): number {
  let lo = 0;
  let hi = timesS.length - 1;
  if (t <= timesS[lo]) return volts[lo];
  if (t >= timesS[hi]) return volts[hi];
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (timesS[mid] <= t) lo = mid;
    else hi = mid;
  }
  const f = (t - timesS[lo]) / (timesS[hi] - timesS[lo]);
  return volts[lo] + f * (volts[hi] - volts[lo]);
}
