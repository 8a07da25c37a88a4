import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  compensationFrequencyResponse,
  dividerLevels,
  type DividerParams,
} from '../../shared/diagnosis/compensation';
import { groundLeadResonance, type GroundLeadParams } from '../../shared/diagnosis/ground-lead';
import { loadingFrequencyResponse, type LoadingParams } from '../../shared/diagnosis/loading';

// source: ngspice (the circuit simulator) in batch mode, solving the same circuits numerically

const hasNgspice = (() => {
  const probe = spawnSync('ngspice', ['--version'], { encoding: 'utf8' });
  return !probe.error && probe.status === 0;
})();
const inCi = Boolean(process.env.CI);
if (!hasNgspice) {
  console.warn(
    inCi
      ? 'ngspice is not on PATH but CI is set: the SPICE cross-check fails on purpose.'
      : 'ngspice is not on PATH: SPICE cross-checks skipped (install ngspice; with CI set this fails).',
  );
}

const workDir = hasNgspice ? mkdtempSync(join(tmpdir(), 'falsetrace-spice-')) : '';
afterAll(() => {
  if (workDir) rmSync(workDir, { recursive: true, force: true });
});

let runCount = 0;
/** Runs a netlist with an analysis line and returns the rows wrdata wrote (x, y). */
function simulate(circuit: string, analysis: string, vector: string): [number, number][] {
  runCount += 1;
  const netlist = join(workDir, `run-${runCount}.cir`);
  const output = join(workDir, `run-${runCount}.txt`);
  writeFileSync(
    netlist,
    `* falsetrace cross-check\n${circuit.trim()}\n.control\n${analysis}\nwrdata ${output} ${vector}\nquit\n.endc\n.end\n`,
  );
  const run = spawnSync('ngspice', ['-b', netlist], { encoding: 'utf8', timeout: 120_000 });
  if (run.status !== 0) throw new Error(`ngspice failed (${run.status}): ${run.stderr || run.stdout}`);
  return readFileSync(output, 'utf8')
    .trim()
    .split('\n')
    .map((line) => line.trim().split(/\s+/).map(Number) as [number, number]);
}

/** Linear interpolation in (time, value) rows. */
function at(rows: [number, number][], t: number): number {
  const i = rows.findIndex(([x]) => x >= t);
  if (i <= 0) return rows[Math.max(0, i)][1];
  const [x0, y0] = rows[i - 1];
  const [x1, y1] = rows[i];
  return y0 + ((y1 - y0) * (t - x0)) / (x1 - x0);
}

const spice = (x: number) => x.toExponential(9);

function dividerCircuit(p: DividerParams): string {
  // step at 10 µs with a 1 ns edge, far shorter than τ ≈ 120 µs
  return `V1 in 0 PULSE(0 1 10u 1n 1n 1 2) AC 1
R1 in out ${spice(p.tipResistanceOhm)}
C1 in out ${spice(p.tipCapacitanceF)}
R2 out 0 ${spice(p.inputResistanceOhm)}
C2 out 0 ${spice(p.inputCapacitanceF)}`;
}

describe('SPICE cross-check', () => {
  it.runIf(!hasNgspice && inCi)('should find ngspice on PATH when CI is set', () => {
    expect.fail('CI is set but ngspice is not on PATH: install ngspice so the SPICE cross-checks run');
  });

  const base = { tipResistanceOhm: 9e6, inputResistanceOhm: 1e6, inputCapacitanceF: 120e-12 };
  const dividers: [string, DividerParams][] = [
    ['compensated', { ...base, tipCapacitanceF: 120e-12 / 9 }],
    ['over-compensated', { ...base, tipCapacitanceF: 20e-12 }],
    ['under-compensated', { ...base, tipCapacitanceF: 9e-12 }],
  ];

  it.skipIf(!hasNgspice).each(dividers)('should match the %s divider step: jump, settle and τ', (_, p) => {
    const { jump, settle, timeConstantS } = dividerLevels(p);
    const rows = simulate(dividerCircuit(p), `tran 100n ${spice(10e-6 + 12 * timeConstantS)} 0 100n`, 'v(out)');
    const edge = 10e-6 + 1e-9;
    // tolerance 0.2 %: 50 ns after the edge the decay (τ ≈ 120 µs) has barely begun
    expect(Math.abs(at(rows, edge + 50e-9) / jump - 1)).toBeLessThan(2e-3);
    // tolerance 0.1 %: after 11 τ the remaining decay is e^-11 ≈ 2e-5 of the step
    expect(Math.abs(at(rows, edge + 11 * timeConstantS) / settle - 1)).toBeLessThan(1e-3);
    if (Math.abs(jump - settle) > 1e-3) {
      // τ from the log-slope of (v − settle) between 0.2 τ and 2 τ; tolerance 1 %
      const t1 = edge + 0.2 * timeConstantS;
      const t2 = edge + 2 * timeConstantS;
      const tauS = (t2 - t1) / Math.log((at(rows, t1) - settle) / (at(rows, t2) - settle));
      expect(Math.abs(tauS / timeConstantS - 1)).toBeLessThan(0.01);
    }
  });

  it.skipIf(!hasNgspice)('should match the divider frequency response from DC to the high-frequency limit', () => {
    const p = dividers[1][1];
    const rows = simulate(dividerCircuit(p), 'ac dec 5 10 100Meg', 'mag(v(out))');
    const ours = compensationFrequencyResponse(p, rows.map(([f]) => f));
    // tolerance 1e-6 relative: both solve the same linear circuit
    rows.forEach(([, magnitude], i) => expect(Math.abs(ours[i] / magnitude - 1)).toBeLessThan(1e-6));
  });

  const leads: [string, GroundLeadParams][] = [
    ['15 cm clip lead, 12 pF, 25 Ω', { sourceResistanceOhm: 25, inductanceH: 190e-9, capacitanceF: 12e-12 }],
    ['1x probe, 100 pF, 10 Ω', { sourceResistanceOhm: 10, inductanceH: 190e-9, capacitanceF: 100e-12 }],
    ['light damping, 2 Ω', { sourceResistanceOhm: 2, inductanceH: 50e-9, capacitanceF: 10e-12 }],
  ];

  it.skipIf(!hasNgspice).each(leads)('should match ground-lead ringing and overshoot (%s)', (_, p) => {
    const r = groundLeadResonance(p);
    const periodS = 1 / (r.ringingFrequencyHz as number);
    const stopS = 1e-9 + 12 * periodS;
    const stepS = periodS / 2000;
    const rows = simulate(
      `V1 in 0 PULSE(0 1 1n 1p 1p 1 2)\nRs in a ${spice(p.sourceResistanceOhm)}\nL1 a out ${spice(p.inductanceH)}\nC1 out 0 ${spice(p.capacitanceF)}`,
      `tran ${spice(stepS)} ${spice(stopS)} 0 ${spice(stepS)}`,
      'v(out)',
    );
    const peak = Math.max(...rows.map(([, v]) => v));
    // tolerance 0.5 percentage points: sampling near the peak and the 1 ps source edge
    expect(Math.abs((peak - 1) * 100 - r.overshootPct)).toBeLessThan(0.5);
    const downward = rows.filter((row, i) => i > 0 && rows[i - 1][1] >= 1 && row[1] < 1).map(([t]) => t);
    const measuredHz = (downward.length - 1) / (downward[downward.length - 1] - downward[0]);
    // tolerance 0.5 %: crossing times from a sampled waveform
    expect(Math.abs(measuredHz / (r.ringingFrequencyHz as number) - 1)).toBeLessThan(5e-3);
  });

  const loads: [string, LoadingParams][] = [
    ['1x probe on 10 kΩ', { sourceResistanceOhm: 10e3, inputResistanceOhm: 1e6, inputCapacitanceF: 100e-12 }],
    ['10x probe on 1 MΩ', { sourceResistanceOhm: 1e6, inputResistanceOhm: 10e6, inputCapacitanceF: 12e-12 }],
  ];

  it.skipIf(!hasNgspice).each(loads)('should match the AC loading divider |V| (%s)', (_, p) => {
    const rows = simulate(
      `V1 src 0 DC 0 AC 1\nRs src out ${spice(p.sourceResistanceOhm)}\nRin out 0 ${spice(p.inputResistanceOhm)}\nCin out 0 ${spice(p.inputCapacitanceF)}`,
      'ac dec 4 100 1G',
      'mag(v(out))',
    );
    const ours = loadingFrequencyResponse(p, rows.map(([f]) => f));
    // tolerance 1e-6 relative
    rows.forEach(([, magnitude], i) => expect(Math.abs(ours[i] / magnitude - 1)).toBeLessThan(1e-6));
    const at1MHz = simulate(
      `V1 src 0 DC 0 AC 1\nRs src out ${spice(p.sourceResistanceOhm)}\nRin out 0 ${spice(p.inputResistanceOhm)}\nCin out 0 ${spice(p.inputCapacitanceF)}`,
      'ac lin 1 1Meg 1Meg',
      'mag(v(out))',
    );
    expect(Math.abs(loadingFrequencyResponse(p, [1e6])[0] / at1MHz[0][1] - 1)).toBeLessThan(1e-6);
  });
});
