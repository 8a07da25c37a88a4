import { describe, expect, it } from 'vitest';
import { analyzeCapture } from '../../shared/capture/analyze';
import { referenceLevels } from '../../shared/capture/levels';
import { findTransitions } from '../../shared/capture/transitions';
import {
  addNoise,
  firstOrderStep,
  sampleUniformly,
  squareWaveform,
  stepWaveform,
} from '../../shared/capture/synthetic';

const TAU_S = 1e-6;
const relative = (value: number | null, expected: number) => Math.abs((value ?? Number.NaN) / expected - 1);

describe('rise and fall time of a single-pole (RC) response', () => {
  // source: standard first-order step response, v = 1 − e^(−t/τ): it crosses x of the step at
  // t = −τ·ln(1 − x), so 10 % at τ·ln(10/9), 50 % at τ·ln 2, 90 % at τ·ln 10, and the
  // 10–90 % rise time is τ·ln 9 (any circuits handbook)
  const stepAtS = 2e-6;
  const rc = sampleUniformly(stepWaveform(firstOrderStep(TAU_S), 0, 1, stepAtS), { sampleIntervalS: 1e-9, points: 30_000 });

  it('should measure the 10–90 % rise time as τ·ln 9', () => {
    const analysis = analyzeCapture(rc);
    expect(relative(analysis.riseTimeS, TAU_S * Math.log(9))).toBeLessThan(1e-3);
    expect(analysis.fallTimeS).toBeNull();
    expect(analysis.edges).toHaveLength(1);
  });

  it('should place the 10, 50 and 90 % instants where the exponential crosses them', () => {
    const [edge] = analyzeCapture(rc).edges;
    expect(edge.kind).toBe('rise');
    expect(Math.abs(edge.t10S - (stepAtS + TAU_S * Math.log(10 / 9)))).toBeLessThan(2e-9);
    expect(Math.abs(edge.t50S - (stepAtS + TAU_S * Math.log(2)))).toBeLessThan(2e-9);
    expect(Math.abs(edge.t90S - (stepAtS + TAU_S * Math.log(10)))).toBeLessThan(2e-9);
    expect(edge.durationS).toBeCloseTo(edge.t90S - edge.t10S, 15);
  });

  it('should measure the fall time of a falling RC step as τ·ln 9', () => {
    const falling = sampleUniformly(stepWaveform(firstOrderStep(TAU_S), 5, 0, stepAtS), { sampleIntervalS: 1e-9, points: 30_000 });
    const analysis = analyzeCapture(falling);
    expect(relative(analysis.fallTimeS, TAU_S * Math.log(9))).toBeLessThan(1e-3);
    expect(analysis.riseTimeS).toBeNull();
    const [edge] = analysis.edges;
    // a fall crosses 90 % first (IEEE Std 181-2011, 5.3.3: duration between the two instants)
    expect(edge.t90S).toBeLessThan(edge.t50S);
    expect(edge.t50S).toBeLessThan(edge.t10S);
  });

  it('should measure every edge of an RC-shaped square wave', () => {
    // half-period 12.5 τ: each edge settles to e^(−12.5) ≈ 4e-6 before the next
    const wave = squareWaveform(firstOrderStep(TAU_S), { periodS: 25e-6, baseV: 0, topV: 3.3 });
    const capture = sampleUniformly(wave, { sampleIntervalS: 5e-9, points: 40_000 });
    const analysis = analyzeCapture(capture);
    // 200 µs of record: 8 periods, 16 edges, alternating
    expect(analysis.edges.map((edge) => edge.kind)).toEqual(Array.from({ length: 16 }, (_, k) => (k % 2 ? 'fall' : 'rise')));
    expect(relative(analysis.riseTimeS, TAU_S * Math.log(9))).toBeLessThan(1e-3);
    expect(relative(analysis.fallTimeS, TAU_S * Math.log(9))).toBeLessThan(1e-3);
  });

  it('should measure the rise time through noise (seeded)', () => {
    // common practice, no source: noise of 1 % of the amplitude moves each crossing by about
    // σ/slope ≈ 1 % of τ, and taking the outermost crossings shortens a noisy edge a little;
    // over 16 edges 3 % is a generous bound
    const wave = squareWaveform(firstOrderStep(TAU_S), { periodS: 25e-6, baseV: 0, topV: 2 });
    const capture = sampleUniformly(wave, { sampleIntervalS: 5e-9, points: 40_000 });
    addNoise(capture.volts, 0.02, 7);
    const analysis = analyzeCapture(capture);
    expect(analysis.edges).toHaveLength(16);
    expect(relative(analysis.riseTimeS, TAU_S * Math.log(9))).toBeLessThan(0.03);
    expect(relative(analysis.fallTimeS, TAU_S * Math.log(9))).toBeLessThan(0.03);
  });
});

describe('findTransitions', () => {
  it('should not count noise about the mid level as edges (10 %/90 % hysteresis)', () => {
    const wave = squareWaveform((tS) => (tS <= 0 ? 0 : 1), { periodS: 1e-6, baseV: 0, topV: 1 });
    const capture = sampleUniformly(wave, { sampleIntervalS: 1e-9, points: 10_000 });
    addNoise(capture.volts, 0.08, 3);
    const found = findTransitions(capture.timesS, capture.volts, referenceLevels(0, 1));
    expect(found).toHaveLength(20);
  });

  it('should ignore a transition already under way when the record starts', () => {
    const capture = sampleUniformly((tS) => Math.min(1, 0.5 + tS * 1e6), { sampleIntervalS: 1e-8, points: 200 });
    expect(findTransitions(capture.timesS, capture.volts, referenceLevels(0, 1))).toHaveLength(0);
  });

  it('should report an edge faster than the sampling as under one sample interval', () => {
    const capture = sampleUniformly((tS) => (tS < 5.5e-7 ? 0 : 1), { sampleIntervalS: 1e-9, points: 1000 });
    const analysis = analyzeCapture(capture);
    expect(analysis.riseTimeS).toBeGreaterThan(0);
    expect(analysis.riseTimeS).toBeLessThanOrEqual(1e-9);
  });
});
