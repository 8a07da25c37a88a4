import { describe, expect, it } from 'vitest';
import { referenceLevels, stateLevels } from '../../shared/capture/levels';
import { addNoise, sampleUniformly, secondOrderStep, squareWaveform } from '../../shared/capture/synthetic';

const idealEdge = (tS: number) => (tS <= 0 ? 0 : 1);
const square = (response: (tS: number) => number, baseV: number, topV: number, points = 20_000) =>
  sampleUniformly(squareWaveform(response, { periodS: 1e-6, baseV, topV }), { sampleIntervalS: 1e-9, points });

describe('stateLevels (IEEE Std 181-2011, 5.2.1: histogram method)', () => {
  it('should find the two levels of an ideal square wave exactly', () => {
    // source: IEEE Std 181-2011, 5.2.1 — each state level is the mode of its half of the histogram
    const levels = stateLevels(square(idealEdge, 0, 3.3).volts);
    expect(levels.twoStates).toBe(true);
    expect(levels.baseV).toBe(0);
    expect(levels.topV).toBeCloseTo(3.3, 12);
  });

  it('should find levels below zero and offsets', () => {
    const levels = stateLevels(square(idealEdge, -1.2, 0.4).volts);
    expect(levels.baseV).toBeCloseTo(-1.2, 12);
    expect(levels.topV).toBeCloseTo(0.4, 12);
  });

  it('should take the settled level, not the mean, of a ringing square wave', () => {
    // source: IEEE Std 181-2011, 5.2.1 — the mode ignores the aberrations that bias a mean
    const { volts } = square(secondOrderStep(20e6, 0.15), 0, 1);
    const levels = stateLevels(volts);
    expect(levels.baseV).toBeCloseTo(0, 3);
    expect(levels.topV).toBeCloseTo(1, 3);
    const upper = volts.filter((v) => v > 0.5);
    const upperMean = upper.reduce((sum, v) => sum + v, 0) / upper.length;
    expect(Math.abs(upperMean - 1)).toBeGreaterThan(Math.abs(levels.topV - 1));
  });

  it('should find the levels through noise to a fraction of the noise', () => {
    // common practice, no source: with σ = 2 % of the amplitude and 10⁵ samples, the peak
    // centre is known far better than σ; 0.3 % of the amplitude is a loose bound
    const { volts } = square(idealEdge, 0, 5, 100_000);
    addNoise(volts, 0.1, 42);
    const levels = stateLevels(volts);
    expect(Math.abs(levels.baseV - 0)).toBeLessThan(0.015);
    expect(Math.abs(levels.topV - 5)).toBeLessThan(0.015);
    // the FWHM of a Gaussian is 2√(2 ln 2)·σ (common practice); histogram bins blur it a little
    expect(levels.noiseV).toBeGreaterThan(0.07);
    expect(levels.noiseV).toBeLessThan(0.14);
  });

  it('should see one state in a flat line, with or without noise', () => {
    const flat = sampleUniformly(() => 1.25, { sampleIntervalS: 1e-9, points: 1000 }).volts;
    expect(stateLevels(flat)).toMatchObject({ twoStates: false, baseV: 1.25, topV: 1.25 });
    for (const points of [200, 5000, 200_000]) {
      const noisy = addNoise(sampleUniformly(() => 1.25, { sampleIntervalS: 1e-9, points }).volts, 0.01, points);
      const levels = stateLevels(noisy);
      expect(levels.twoStates).toBe(false);
      expect(levels.baseV).toBeCloseTo(1.25, 2);
    }
  });

  it('should fall back to the extremes where a half has no peak (a triangle wave)', () => {
    const triangle = sampleUniformly((tS) => Math.abs(((tS * 1e6) % 2) - 1), { sampleIntervalS: 1e-9, points: 10_000 });
    const levels = stateLevels(triangle.volts);
    expect(levels.baseV).toBe(0);
    expect(levels.topV).toBe(1);
  });
});

describe('referenceLevels (IEEE Std 181-2011, 5.3.2)', () => {
  it('should place the 10, 50 and 90 % levels above the base by that share of the amplitude', () => {
    // source: IEEE Std 181-2011, 5.3.2 — y(x %) = base + (x/100)·(top − base)
    const levels = referenceLevels(-1, 4);
    expect(levels.lowV).toBeCloseTo(-0.5, 12);
    expect(levels.midV).toBeCloseTo(1.5, 12);
    expect(levels.highV).toBeCloseTo(3.5, 12);
  });
});
