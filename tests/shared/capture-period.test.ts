import { describe, expect, it } from 'vitest';
import { analyzeCapture } from '../../shared/capture/analyze';
import {
  addNoise,
  firstOrderStep,
  sampleUniformly,
  secondOrderStep,
  squareWaveform,
  stepWaveform,
} from '../../shared/capture/synthetic';

const ideal = (tS: number) => (tS <= 0 ? 0 : 1);

describe('period and frequency (mean spacing of same-direction 50 % crossings)', () => {
  it('should measure a square wave whose period is a whole number of samples', () => {
    const wave = squareWaveform(secondOrderStep(50e6, 0.3), { periodS: 1e-6, baseV: 0, topV: 5 });
    const analysis = analyzeCapture(sampleUniformly(wave, { sampleIntervalS: 1e-9, points: 10_500 }));
    expect(analysis.periodS).toBeCloseTo(1e-6, 15);
    expect(analysis.frequencyHz).toBeCloseTo(1e6, 3);
  });

  it('should measure a period that is not a whole number of samples, and any duty cycle', () => {
    // 1.2345 µs sampled every 1 ns: each mid crossing is interpolated between samples
    const periodS = 1.2345e-6;
    const wave = squareWaveform(firstOrderStep(20e-9), { periodS, baseV: -1, topV: 1, dutyCycle: 0.3 });
    const analysis = analyzeCapture(sampleUniformly(wave, { sampleIntervalS: 1e-9, points: 20_000 }));
    expect(Math.abs(analysis.periodS! / periodS - 1)).toBeLessThan(1e-5);
    const [rise, fall] = analysis.edges;
    // the high time is 30 % of the period, from mid crossing to mid crossing
    expect(Math.abs((fall.t50S - rise.t50S) / (0.3 * periodS) - 1)).toBeLessThan(1e-4);
  });

  it('should measure the period through noise (seeded)', () => {
    const wave = squareWaveform(firstOrderStep(10e-9), { periodS: 1e-6, baseV: 0, topV: 3.3 });
    const capture = sampleUniformly(wave, { sampleIntervalS: 1e-9, points: 50_000 });
    addNoise(capture.volts, 0.05, 99);
    // common practice, no source: mid crossings jitter by σ/slope ≈ 0.3 ns; over 49 periods
    // the mean spacing is good to far better than 1e-4
    expect(Math.abs(analyzeCapture(capture).periodS! / 1e-6 - 1)).toBeLessThan(1e-4);
  });

  it('should have no period for a single step', () => {
    const analysis = analyzeCapture(sampleUniformly(stepWaveform(ideal, 0, 1, 5e-7), { sampleIntervalS: 1e-9, points: 1000 }));
    expect(analysis.riseTimeS).not.toBeNull();
    expect(analysis.periodS).toBeNull();
    expect(analysis.frequencyHz).toBeNull();
  });

  it('should have no period for irregular pulses', () => {
    const pulseStartsS = [1e-6, 2e-6, 4.5e-6, 5e-6];
    const capture = sampleUniformly((tS) => (pulseStartsS.some((startS) => tS >= startS && tS < startS + 2e-7) ? 1 : 0), {
      sampleIntervalS: 1e-9,
      points: 7000,
    });
    const analysis = analyzeCapture(capture);
    expect(analysis.edgeCount).toBe(8);
    expect(analysis.periodS).toBeNull();
  });
});
