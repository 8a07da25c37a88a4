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

// source: standard second-order system step response — peak overshoot e^(−πζ/√(1−ζ²)),
// successive extrema of the error e^(−kπζ/√(1−ζ²)) (k = 1 the overshoot, k = 2 the swing
// back below the final value), oscillation at the damped frequency f_n·√(1 − ζ²)
const overshootFraction = (zeta: number, k = 1) => Math.exp((-k * Math.PI * zeta) / Math.sqrt(1 - zeta * zeta));
const dampedHz = (naturalHz: number, zeta: number) => naturalHz * Math.sqrt(1 - zeta * zeta);
const relative = (value: number | null, expected: number) => Math.abs((value ?? Number.NaN) / expected - 1);

const NATURAL_HZ = 1e6;
const step = (zeta: number, baseV = 0, topV = 1) =>
  sampleUniformly(stepWaveform(secondOrderStep(NATURAL_HZ, zeta), baseV, topV, 1e-6), { sampleIntervalS: 1e-9, points: 20_000 });

describe('overshoot, undershoot and ringing of an underdamped second-order step', () => {
  it.each([0.05, 0.1, 0.2, 0.3, 0.5])('should match the textbook values for ζ = %f', (zeta) => {
    const analysis = analyzeCapture(step(zeta));
    // IEEE Std 181-2011 aberrations are in % of the amplitude
    expect(relative(analysis.overshootPct, 100 * overshootFraction(zeta))).toBeLessThan(2e-3);
    expect(relative(analysis.undershootPct, 100 * overshootFraction(zeta, 2))).toBeLessThan(0.02);
    expect(relative(analysis.ringingFrequencyHz, dampedHz(NATURAL_HZ, zeta))).toBeLessThan(1e-3);
  });

  it('should measure a falling step the same way (overshoot below the base)', () => {
    const zeta = 0.2;
    const analysis = analyzeCapture(step(zeta, 3.3, 0));
    expect(analysis.edges.map((edge) => edge.kind)).toEqual(['fall']);
    expect(relative(analysis.overshootPct, 100 * overshootFraction(zeta))).toBeLessThan(2e-3);
    expect(relative(analysis.ringingFrequencyHz, dampedHz(NATURAL_HZ, zeta))).toBeLessThan(1e-3);
  });

  it('should measure a ringing square wave through noise (seeded)', () => {
    // a 3.3 V clock whose edges ring like a lead inductance with the tip capacitance;
    // noise 20 mV (0.6 % of the amplitude)
    const zeta = 0.2;
    const wave = squareWaveform(secondOrderStep(20e6, zeta), { periodS: 1e-6, baseV: 0, topV: 3.3 });
    const capture = sampleUniformly(wave, { sampleIntervalS: 1e-10, points: 100_000 });
    addNoise(capture.volts, 0.02, 2011);
    const analysis = analyzeCapture(capture);
    expect(analysis.edgeCount).toBe(20);
    expect(relative(analysis.ringingFrequencyHz, dampedHz(20e6, zeta))).toBeLessThan(5e-3);
    // common practice, no source: the largest of many noisy samples sits a few σ above the
    // peak, so the measured overshoot reads high by up to about 4σ/amplitude ≈ 2.5 points
    expect(analysis.overshootPct!).toBeGreaterThan(100 * overshootFraction(zeta) - 0.5);
    expect(analysis.overshootPct!).toBeLessThan(100 * overshootFraction(zeta) + 3);
  });

  it('should report no ringing when the swing back stays inside 1 % of the amplitude (ζ = 0.7)', () => {
    const zeta = 0.7;
    expect(100 * overshootFraction(zeta, 2)).toBeLessThan(1);
    const analysis = analyzeCapture(step(zeta));
    expect(relative(analysis.overshootPct, 100 * overshootFraction(zeta))).toBeLessThan(0.01);
    expect(analysis.ringingFrequencyHz).toBeNull();
  });
});

describe('a single-pole (RC) step', () => {
  it('should have no overshoot and no ringing, with or without noise', () => {
    const rc = sampleUniformly(stepWaveform(firstOrderStep(1e-6), 0, 1, 2e-6), { sampleIntervalS: 1e-9, points: 30_000 });
    const clean = analyzeCapture(rc);
    expect(clean.overshootPct!).toBeLessThan(0.05);
    expect(clean.ringingFrequencyHz).toBeNull();
    addNoise(rc.volts, 0.01, 5);
    expect(analyzeCapture(rc).ringingFrequencyHz).toBeNull();
  });
});
