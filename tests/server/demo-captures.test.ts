import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeCapture } from '../../shared/capture/analyze';
import { parseCaptureText } from '../../shared/capture/parse';
import { CAPTURE_DIR, captureCsv, readDemoCapture, SPICE_DIR } from '../../server/seed/demo/capture-files';
import { DEMO_CASES } from '../../server/seed/demo/seed-casebook';
import { makeCapture } from '../../scripts/demo-captures/generate';
import { DEMO_CAPTURES } from '../../scripts/demo-captures/manifest';

const hasNgspice = (() => {
  try {
    execFileSync('ngspice', ['-v'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
})();

const withAttachments = DEMO_CASES.filter((c) => c.attach?.length);
const trace = (key: string) => readDemoCapture(key).trace;

/** Mean of the samples whose time lies in [fromS, toS]. */
function meanBetween(key: string, fromS: number, toS: number): number {
  const { timesS, volts } = trace(key);
  let sum = 0;
  let n = 0;
  timesS.forEach((t, i) => {
    if (t >= fromS && t <= toS) {
      sum += volts[i];
      n++;
    }
  });
  return sum / n;
}

/** 10–90 % rise time of one stage with a single pole: 2.2 τ = 0.35 / BW. */
const poleRiseS = (bandwidthHz: number) => Math.log(9) / (2 * Math.PI * bandwidthHz);
/** Round wire above its return, as for a probe's ground lead: L = μ0·l/(2π)·(ln(2l/r) − 0.75). */
const straightWireH = (lengthM: number, radiusM: number) => 2e-7 * lengthM * (Math.log((2 * lengthM) / radiusM) - 0.75);

describe('demo capture files', () => {
  it('should have one capture file and one recipe for every demo case with attachments, and nothing else', () => {
    const files = readdirSync(CAPTURE_DIR).filter((f) => f.endsWith('.csv')).map((f) => f.replace(/\.csv$/, ''));
    const recipes = DEMO_CAPTURES.map((s) => s.key);
    const keys = withAttachments.map((c) => c.key);
    expect([...files].sort()).toEqual([...keys].sort());
    expect([...recipes].sort()).toEqual([...keys].sort());
    const netlists = readdirSync(SPICE_DIR).filter((f) => f.endsWith('.cir'));
    expect(netlists.sort()).toEqual(DEMO_CAPTURES.filter((s) => s.kind === 'spice').map((s) => `${s.key}.cir`).sort());
  });

  it('should parse every capture as the app reads an upload, with its 2,500 evenly spaced points', () => {
    for (const c of withAttachments) {
      const parsed = parseCaptureText(readFileSync(`${CAPTURE_DIR}${c.key}.csv`, 'utf8'));
      expect(parsed.ok, c.key).toBe(true);
      if (!parsed.ok) continue;
      expect(parsed.samples.timesS.length, c.key).toBe(2500);
      expect(() => analyzeCapture(parsed.samples), c.key).not.toThrow();
    }
  });

  it('should show the 20 MHz limit filter in the rise time as the stages add in quadrature', () => {
    // source: single-pole step response, t_r = ln 9 · τ ≈ 0.35/BW; stages add in quadrature (common practice, an approximation)
    const expected = Math.hypot(2e-9, poleRiseS(500e6), poleRiseS(500e6), poleRiseS(20e6), Math.log(9) * 25 * 11e-12);
    const measured = analyzeCapture(trace('bw-limit-on')).riseTimeS!;
    expect(Math.abs(measured / expected - 1)).toBeLessThan(0.06);
  });

  it('should show a 100 MHz scope dominating a 1 ns edge', () => {
    // source: as above; √(1² + 0.7² + 3.5²) ns
    const expected = Math.hypot(1e-9, poleRiseS(500e6), poleRiseS(100e6));
    expect(Math.abs(analyzeCapture(trace('bw-gan-100mhz')).riseTimeS! / expected - 1)).toBeLessThan(0.03);
  });

  it('should round the corners by C1/(C1+C2) against R2/(R1+R2) when the probe moves to a scope with 4 pF more input', () => {
    // source: compensated divider R1∥C1 over R2∥C2 (edge ratio C1/(C1+C2), DC ratio R2/(R1+R2))
    const [r1, r2, c1, c2] = [9e6, 1e6, 12.22e-12, 114e-12];
    const expectedPct = ((c1 / (c1 + c2)) / (r2 / (r1 + r2)) - 1) * 100;
    expect(expectedPct).toBeCloseTo(-3.17, 1);
    // rising edge at 100 µs, falling at 600 µs; τ = (R1∥R2)(C1+C2) ≈ 114 µs, so each half period settles
    const before = meanBetween('comp-scope-b-rounded', 90e-6, 99e-6);
    const justAfter = meanBetween('comp-scope-b-rounded', 101e-6, 104e-6);
    const settled = meanBetween('comp-scope-b-rounded', 560e-6, 598e-6);
    const settledLow = meanBetween('comp-scope-b-rounded', 1060e-6, 1098e-6);
    const cornerPct = ((justAfter - before) / (settled - settledLow) - 1) * 100;
    expect(cornerPct).toBeGreaterThan(expectedPct - 0.6);
    expect(cornerPct).toBeLessThan(expectedPct + 0.6);
  });

  it('should ring at 1/(2π√(LC)) of a 15 cm lead and the 11 pF tip', () => {
    // source: Rosa/Grover straight-wire inductance; series LC resonance
    const expected = 1 / (2 * Math.PI * Math.sqrt(straightWireH(0.15, 0.25e-3) * 11e-12));
    expect(Math.abs(analyzeCapture(trace('gl-buck-ring')).ringingFrequencyHz! / expected - 1)).toBeLessThan(0.03);
  });

  it('should droop by tanh(T/4τ) of the step behind the AC-coupling corner', () => {
    // source: first-order high-pass, steady-state square wave: droop = step · tanh(T/(4τ))
    const tauS = 1e6 * (15.915e-9 + 16e-12);
    const expectedPct = Math.tanh(10e-3 / (4 * tauS)) * 100;
    // rising edge at 2 ms into the capture, falling at 7 ms
    const step = meanBetween('ac-heater-pwm', 2.01e-3, 2.04e-3) - meanBetween('ac-heater-pwm', 1.96e-3, 1.99e-3);
    const droop = meanBetween('ac-heater-pwm', 2.01e-3, 2.04e-3) - meanBetween('ac-heater-pwm', 6.96e-3, 6.99e-3);
    expect(Math.abs((droop / step) * 100 - expectedPct)).toBeLessThan(0.6);
    // and the DC level is gone: the trace is centred on zero
    expect(Math.abs(meanBetween('ac-heater-pwm', 0, 30e-3))).toBeLessThan(0.05);
  });

  it('should show the PWM at |f − k·f_s| when sampled too slowly', () => {
    // source: sampling theorem, alias frequency |f − k·f_s| for the nearest k
    const alias = (f: number, fs: number) => Math.abs(f - Math.round(f / fs) * fs);
    expect(analyzeCapture(trace('alias-pwm-2khz')).frequencyHz).toBeCloseTo(alias(1.002e6, 1e6), -1);
    expect(analyzeCapture(trace('alias-boost-50k')).frequencyHz).toBeCloseTo(alias(2.45e6, 2.5e6), -2);
  });

  it('should show twice the set amplitude from a generator set for 50 Ω driving 100 kΩ', () => {
    // source: voltage divider, EMF 2 Vpp behind 50 Ω into 100 kΩ ∥ the probe's 10 MΩ
    const load = 1 / (1 / 100e3 + 1 / 10e6);
    const expected = (2 * load) / (load + 50);
    const { volts } = trace('gen-double');
    const pp = Math.max(...volts) - Math.min(...volts);
    // the noise adds a few mV to the extremes
    expect(Math.abs(pp / expected - 1)).toBeLessThan(0.02);
  });

  it('should bring each edge through a 50 Ω input as a needle no taller than V·C1/(C1+C2) on the screen', () => {
    // source: capacitive divider C1 over C2 with the 50 Ω input, decaying with 50 Ω·(C1+C2);
    // a 1.5 ns edge against a 6 ns decay reaches a little less than the ideal step's height
    const ideal = 3.3 * (12.22 / (12.22 + 110)) * 10;
    const { volts } = trace('term-clock-vanish');
    const peak = Math.max(...volts);
    expect(peak).toBeLessThan(ideal);
    expect(peak).toBeGreaterThan(0.7 * ideal);
    // the DC path divides by (9 MΩ + 50 Ω)/50 Ω: 20 ns after an edge almost nothing is left
    expect(Math.abs(meanBetween('term-clock-vanish', 22e-9, 24e-9))).toBeLessThan(0.15 * ideal);
  });

  it('should make the closed-form captures byte-identical on every run', () => {
    for (const spec of DEMO_CAPTURES.filter((s) => s.kind === 'sampled')) {
      expect(captureCsv(makeCapture(spec)), spec.key).toBe(readFileSync(`${CAPTURE_DIR}${spec.key}.csv`, 'utf8'));
    }
  });

  it.skipIf(!hasNgspice)('should get the committed captures again from the netlists (ngspice present)', () => {
    for (const key of ['att-3v3-rail', 'bw-gan-100mhz', 'comp-scope-b-rounded', 'gl-buck-ring']) {
      const spec = DEMO_CAPTURES.find((s) => s.key === key)!;
      const fresh = makeCapture(spec);
      const { volts } = trace(key);
      const span = Math.max(...volts) - Math.min(...volts);
      // another ngspice version may round the last digit differently
      let worst = 0;
      fresh.volts.forEach((v, i) => (worst = Math.max(worst, Math.abs(v - volts[i]))));
      expect(worst / span, key).toBeLessThan(1e-3);
    }
  }, 60_000);
});
