import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decimateMinMax } from '../../shared/capture/decimate';
import { addNoise, sampleUniformly, secondOrderStep, squareWaveform } from '../../shared/capture/synthetic';

const capture = () => {
  const wave = squareWaveform(secondOrderStep(40e6, 0.15), { periodS: 1e-5, baseV: 0, topV: 3.3 });
  const samples = sampleUniformly(wave, { sampleIntervalS: 1e-9, points: 100_000 });
  addNoise(samples.volts, 0.01, 8);
  samples.volts[54_321] = 9; // a one-sample glitch the plot must not lose
  return samples;
};

const extremes = (values: Float64Array) => {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (const value of values) {
    if (value < min) min = value;
    if (value > max) max = value;
  }
  return { min, max };
};

describe('decimateMinMax', () => {
  const { timesS, volts } = capture();

  it('should keep at most two samples per column, in time order', () => {
    const out = decimateMinMax(timesS, volts, 800);
    expect(out.timesS.length).toBeLessThanOrEqual(1600);
    expect(out.timesS.length).toBe(out.volts.length);
    for (let k = 1; k < out.timesS.length; k++) expect(out.timesS[k]).toBeGreaterThan(out.timesS[k - 1]);
  });

  it('should keep the global minimum and maximum (the envelope), glitch included', () => {
    const out = decimateMinMax(timesS, volts, 300);
    expect(extremes(out.volts)).toEqual(extremes(volts));
    expect(Array.from(out.volts)).toContain(9);
  });

  it('should keep each column’s minimum and maximum, as a brute force split finds them', () => {
    // source: the definition of min/max decimation, recomputed column by column
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 1, maxLength: 500 }),
        fc.integer({ min: 1, max: 60 }),
        (values, columns) => {
          const times = Float64Array.from(values, (_, k) => k * 1e-9);
          const samples = Float64Array.from(values);
          const out = decimateMinMax(times, samples, columns);
          expect(out.timesS.length).toBeLessThanOrEqual(2 * columns);
          if (values.length <= 2 * columns) {
            expect(Array.from(out.volts)).toEqual(values);
            return;
          }
          const spanS = times[times.length - 1] - times[0];
          for (let column = 0; column < columns; column++) {
            const inColumn = (t: number) => Math.min(columns - 1, Math.floor((t / spanS) * columns)) === column;
            const original = values.filter((_, k) => inColumn(times[k]));
            const kept = Array.from(out.volts).filter((_, k) => inColumn(out.timesS[k]));
            if (original.length === 0) expect(kept).toEqual([]);
            else {
              expect(Math.min(...kept)).toBe(Math.min(...original));
              expect(Math.max(...kept)).toBe(Math.max(...original));
            }
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  it('should decimate only the visible range', () => {
    const fromS = 20e-6;
    const toS = 30e-6;
    const out = decimateMinMax(timesS, volts, 100, fromS, toS);
    expect(out.timesS[0]).toBeGreaterThanOrEqual(fromS);
    expect(out.timesS[out.timesS.length - 1]).toBeLessThanOrEqual(toS);
    const first = Math.round(fromS / 1e-9);
    const last = Math.round(toS / 1e-9);
    expect(extremes(out.volts)).toEqual(extremes(volts.subarray(first, last + 1)));
  });

  it('should return a range that already fits unchanged', () => {
    const out = decimateMinMax(timesS, volts, 1000, 0, 1.5e-6);
    expect(Array.from(out.volts)).toEqual(Array.from(volts.subarray(0, 1501)));
  });

  it('should return nothing for an empty range or no columns', () => {
    expect(decimateMinMax(timesS, volts, 0).timesS.length).toBe(0);
    expect(decimateMinMax(timesS, volts, 100, 5e-6, 4e-6).timesS.length).toBe(0);
    expect(decimateMinMax(new Float64Array(0), new Float64Array(0), 100).timesS.length).toBe(0);
  });
});
