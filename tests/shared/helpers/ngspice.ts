import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll } from 'vitest';

// source: ngspice (the circuit simulator) in batch mode, solving the same circuits numerically

export const hasNgspice = (() => {
  const probe = spawnSync('ngspice', ['--version'], { encoding: 'utf8' });
  return !probe.error && probe.status === 0;
})();
export const inCi = Boolean(process.env.CI);
if (!hasNgspice) {
  console.warn(
    inCi
      ? 'ngspice is not on PATH but CI is set: the SPICE cross-check fails on purpose.'
      : 'ngspice is not on PATH: SPICE cross-checks skipped (install ngspice; with CI set this fails).',
  );
}

/**
 * A runner for one test file: a temp folder removed after the file, and `simulate`, which runs a
 * netlist with one analysis line and returns the rows wrdata wrote (x, y).
 */
export function ngspiceRunner(prefix: string): (circuit: string, analysis: string, vector: string) => [number, number][] {
  const workDir = hasNgspice ? mkdtempSync(join(tmpdir(), `falsetrace-${prefix}-`)) : '';
  afterAll(() => {
    if (workDir) rmSync(workDir, { recursive: true, force: true });
  });
  let runCount = 0;
  return (circuit, analysis, vector) => {
    runCount += 1;
    const netlist = join(workDir, `run-${runCount}.cir`);
    const output = join(workDir, `run-${runCount}.txt`);
    writeFileSync(netlist, `* falsetrace cross-check\n${circuit.trim()}\n.control\n${analysis}\nwrdata ${output} ${vector}\nquit\n.endc\n.end\n`);
    const run = spawnSync('ngspice', ['-b', netlist], { encoding: 'utf8', timeout: 120_000 });
    if (run.status !== 0) throw new Error(`ngspice failed (${run.status}): ${run.stderr || run.stdout}`);
    return readFileSync(output, 'utf8')
      .trim()
      .split('\n')
      .map((line) => line.trim().split(/\s+/).map(Number) as [number, number]);
  };
}

/** Linear interpolation in (time, value) rows. */
export function at(rows: [number, number][], t: number): number {
  const i = rows.findIndex(([x]) => x >= t);
  if (i <= 0) return rows[Math.max(0, i)][1];
  const [x0, y0] = rows[i - 1];
  const [x1, y1] = rows[i];
  return y0 + ((y1 - y0) * (t - x0)) / (x1 - x0);
}
