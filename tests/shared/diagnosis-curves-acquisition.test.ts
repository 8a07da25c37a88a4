import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
import { diagnose } from '../../shared/diagnosis/ranker';
import { diagnosisPlot, type DiagnosisPlot, type LinePlot } from '../../shared/diagnosis/curves';
import { captureOverlay } from '../../shared/diagnosis/capture-overlay';

const linePlot = (plot: DiagnosisPlot | null): LinePlot => {
  if (!plot || plot.kind !== 'line') throw new Error(`expected a line plot, got ${plot?.kind ?? 'null'}`);
  return plot;
};
const series = (plot: LinePlot, role: 'model' | 'reference' | 'observed', i = 0) => plot.series.filter((s) => s.role === role)[i].values;
const nearest = (xs: number[], x: number) => xs.reduce((best, v, i) => (Math.abs(v - x) < Math.abs(xs[best] - x) ? i : best), 0);

describe('acquisition plots', () => {
  it('should fold the signal to its alias', () => {
    const plot = linePlot(diagnosisPlot({ scope: { sampleRateHz: 1.002e6 }, signal: { frequencyHz: 1e6, kind: 'square' } }, 'aliasing'));
    const i = nearest(plot.x, 1e6);
    // source: sampling theorem, |f − k·f_s| near the grid point; the grid steps are small against f_s
    expect(series(plot, 'model')[i]).toBeCloseTo(Math.abs(plot.x[i] - 1.002e6), 3);
    expect(series(plot, 'reference')[i]).toBe(plot.x[i]);
    expect(plot.summary).toMatch(/2 kHz/);
  });

  it('should use a fitted sample rate', () => {
    const plot = linePlot(diagnosisPlot({ signal: { frequencyHz: 1e6 } }, 'aliasing', { predicted: {}, estimates: { impliedSampleRateHz: 998e3 } }));
    expect(plot.title).toMatch(/fitted/);
  });

  it('should keep the trace inside the screen window', () => {
    // window ±2 V at 0.5 V/div over 8 divisions; a 0…3.3 V square
    const plot = linePlot(diagnosisPlot({ scope: { voltsPerDiv: 0.5 }, signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e3, kind: 'square' } }, 'clipping'));
    expect(Math.max(...series(plot, 'model'))).toBe(2);
    expect(Math.max(...series(plot, 'reference'))).toBeCloseTo(3.3, 12);
    expect(plot.summary).toMatch(/cut flat/);
  });

  it('should droop the square by tanh(T/4τ) and centre it on zero', () => {
    // 1x probe, 0 Ω source, 10 Hz corner, 50 Hz square of 1 V: droop tanh(π·10/100) = 0.30422 of the step
    const plot = linePlot(
      diagnosisPlot({ probe: { attenuation: 1 }, circuit: { sourceResistanceOhm: 0 }, scope: { coupling: 'ac', acCornerHz: 10 }, signal: { frequencyHz: 50, kind: 'square', expectedAmplitudeV: 1 } }, 'ac-coupling'),
    );
    const model = series(plot, 'model');
    const topEnd = nearest(plot.x, 0.01) - 1;
    expect(model[0] - model[topEnd]).toBeCloseTo(Math.tanh(Math.PI / 10), 2);
    const mean = model.reduce((a, b) => a + b, 0) / model.length;
    expect(Math.abs(mean)).toBeLessThan(0.01);
  });

  it('should pass the recorded CMRR at the signal frequency', () => {
    const plot = linePlot(diagnosisPlot({ probe: { kind: 'differential', cmrrDb: 50 }, circuit: { referenceV: 400 }, signal: { frequencyHz: 100e3, expectedAmplitudeV: 10 } }, 'common-mode'));
    const i = nearest(plot.x, 100e3);
    expect(series(plot, 'model')[i]).toBeCloseTo(-50, 0);
    // leak equals the 10 V signal at 20·log10(10/400) = −32.04 dB
    expect(series(plot, 'reference')[0]).toBeCloseTo(-32.04, 2);
    expect(diagnosisPlot({ circuit: { referenceV: 325 } }, 'common-mode')).toBeNull();
  });

  it('should draw the generator divider for both settings', () => {
    const plot = linePlot(diagnosisPlot({ signal: { expectedAmplitudeV: 1, generatorLoad: '50-ohm' }, circuit: { loadResistanceOhm: 1e6 } }, 'generator-load'));
    const i = nearest(plot.x, 50);
    // source: voltage divider; into R_L = R_out the 50 Ω setting shows 1×, the high-Z setting ½
    expect(series(plot, 'model')[i]).toBeCloseTo((2 * plot.x[i]) / (plot.x[i] + 50), 9);
    expect(series(plot, 'reference')[i]).toBeCloseTo(plot.x[i] / (plot.x[i] + 50), 9);
    expect(plot.summary).toMatch(/2 times/);
  });

  it('should have ascending x and finite values for any plausible acquisition setup', () => {
    // common practice, no source: the ranges span ordinary bench setups
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e8, noNaN: true }),
        fc.double({ min: 1e3, max: 1e10, noNaN: true }),
        fc.double({ min: 1e-3, max: 10, noNaN: true }),
        fc.constantFrom('square', 'sine', 'dc', 'pulse') as fc.Arbitrary<'square' | 'sine' | 'dc' | 'pulse'>,
        fc.constantFrom('50-ohm', 'high-z') as fc.Arbitrary<'50-ohm' | 'high-z'>,
        fc.double({ min: -1000, max: 1000, noNaN: true }),
        (frequencyHz, sampleRateHz, voltsPerDiv, kind, generatorLoad, referenceV) => {
          const input: DiagnosisInput = {
            probe: { kind: referenceV > 0 ? 'differential' : 'passive' },
            scope: { sampleRateHz, voltsPerDiv, coupling: 'ac' },
            circuit: { referenceV, mainsConnected: true },
            signal: { expectedAmplitudeV: 3.3, frequencyHz, kind, generatorLoad },
            observed: { frequencyHz: frequencyHz / 3, clipped: true, amplitudeV: 2, tiltPct: 10, humFrequencyHz: 100 },
          };
          for (const h of diagnose(input).hypotheses) {
            const plot = diagnosisPlot(input, h.cause, h);
            if (!plot || plot.kind === 'bars') continue;
            // one expect per plot, not per point: thousands of expect calls made this test slow
            const descending = plot.x.findIndex((x, i) => i > 0 && !(x > plot.x[i - 1]));
            expect(descending, `${h.cause}: x not ascending at ${descending}`).toBe(-1);
            const broken = plot.series.find((s) => s.values.some((v) => !Number.isFinite(v)));
            expect(broken?.label, `${h.cause}: a series has a non-finite value`).toBeUndefined();
          }
        },
      ),
      { numRuns: 30 },
    );
  }, 120_000);
});

describe('capture overlay of the acquisition causes', () => {
  const anchor = { baseV: 0, topV: 2, edges: [{ kind: 'rise' as const, t10S: 1e-4, t50S: 1.1e-4, t90S: 1.2e-4 }] };
  const extent = { startS: 0, endS: 1e-3 };
  const hypothesis = (cause: 'clipping' | 'aliasing', amplitudeV?: number) => ({
    cause,
    causes: [cause],
    likelihood: 1,
    predicted: amplitudeV === undefined ? {} : { amplitudeV },
    explanation: '',
    fix: '',
    confirm: '',
    fits: true,
    residual: 0,
  });

  it('should draw a clipped trace as the level its top reaches', () => {
    const result = captureOverlay({ scope: { voltsPerDiv: 0.5 }, signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e3, kind: 'square' } }, hypothesis('clipping', 2), anchor, extent);
    expect(result.ok && result.overlay.volts).toEqual([2, 2]);
  });

  it('should not draw an alias as an edge', () => {
    const result = captureOverlay({ scope: { sampleRateHz: 1.002e6 }, signal: { frequencyHz: 1e6 } }, hypothesis('aliasing'), anchor, extent);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(/compared in numbers/);
  });
});
