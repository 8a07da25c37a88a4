import { describe, expect, it } from 'vitest';
import {
  MU0_H_PER_M,
  edgeRingingFactor,
  groundLeadResonance,
  groundLeadStepResponse,
  inductanceForDampedRingingH,
  inductanceForRingingH,
  leadLengthForInductanceM,
  secondOrderOvershootPct,
  straightWireInductanceH,
} from '../../shared/diagnosis/ground-lead';
import { diagnose } from '../../shared/diagnosis/ranker';

const times = (stopS: number, n: number) => Array.from({ length: n + 1 }, (_, i) => (i * stopS) / n);

describe('straight-wire inductance', () => {
  it('should give about 105 nH for 10 cm of 1 mm wire', () => {
    // source: Grover, Inductance Calculations (1946): L = 0.002·l·(ln(2l/ρ) − 3/4) µH, l and ρ in cm
    const groverMicroH = 0.002 * 10 * (Math.log((2 * 10) / 0.05) - 0.75);
    expect(groverMicroH).toBeCloseTo(0.1048, 4);
    expect(straightWireInductanceH(0.1, 0.5e-3)).toBeCloseTo(groverMicroH * 1e-6, 11);
  });

  it('should agree with the rule of thumb of about 1 nH per mm of lead', () => {
    // common practice: "1 nH/mm" for short thin leads, good to a few tens of percent
    const perMm = straightWireInductanceH(0.15, 0.25e-3) / 150;
    expect(perMm).toBeGreaterThan(0.8e-9);
    expect(perMm).toBeLessThan(1.6e-9);
  });

  it('should exceed the high-frequency form by the internal inductance μ0·l/8π', () => {
    // source: Rosa (1908): internal inductance of a round wire with uniform current is μ0·l/8π
    const l = 0.2;
    const r = 0.4e-3;
    const highFrequency = ((MU0_H_PER_M * l) / (2 * Math.PI)) * (Math.log((2 * l) / r) - 1);
    expect(straightWireInductanceH(l, r) - highFrequency).toBeCloseTo((MU0_H_PER_M * l) / (8 * Math.PI), 15);
  });

  it('should solve the formula back for the lead length', () => {
    for (const l of [0.005, 0.05, 0.15, 1]) {
      expect(leadLengthForInductanceM(straightWireInductanceH(l, 0.25e-3), 0.25e-3)).toBeCloseTo(l, 9);
    }
    expect(leadLengthForInductanceM(1, 0.25e-3)).toBeUndefined();
  });
});

describe('second-order ringing', () => {
  it('should reproduce the tabulated overshoot of a second-order step', () => {
    // source: M_p = exp(−πζ/√(1−ζ²)), e.g. Ogata, Modern Control Engineering, ch. 5
    expect(secondOrderOvershootPct(0.5)).toBeCloseTo(16.3, 1);
    expect(secondOrderOvershootPct(0.7)).toBeCloseTo(4.6, 1);
    expect(secondOrderOvershootPct(0)).toBeCloseTo(100, 12);
    expect(secondOrderOvershootPct(1)).toBe(0);
  });

  it('should resonate at 1/(2π√(LC)) with ζ = (R/2)√(C/L)', () => {
    const r = groundLeadResonance({ sourceResistanceOhm: 25, inductanceH: 190e-9, capacitanceF: 12e-12 });
    expect(r.naturalFrequencyHz).toBeCloseTo(1 / (2 * Math.PI * Math.sqrt(190e-9 * 12e-12)), 0);
    expect(r.dampingRatio).toBeCloseTo(12.5 * Math.sqrt(12e-12 / 190e-9), 12);
    expect(r.ringingFrequencyHz).toBeCloseTo(r.naturalFrequencyHz * Math.sqrt(1 - r.dampingRatio ** 2), 0);
  });

  it('should peak and ring in its step response as the formulas say', () => {
    const p = { sourceResistanceOhm: 25, inductanceH: 190e-9, capacitanceF: 12e-12 };
    const r = groundLeadResonance(p);
    const t = times(60e-9, 60000);
    const v = groundLeadStepResponse(p, t);
    expect(v[0]).toBe(0);
    expect((Math.max(...v) - 1) * 100).toBeCloseTo(r.overshootPct, 2);
    const downward = t.filter((_, i) => i > 0 && v[i - 1] >= 1 && v[i] < 1);
    const periodS = (downward[downward.length - 1] - downward[0]) / (downward.length - 1);
    expect(1 / periodS / (r.ringingFrequencyHz as number)).toBeCloseTo(1, 3);
  });

  it('should rise without overshoot when critically or over-damped', () => {
    for (const resistance of [2 * Math.sqrt(190e-9 / 12e-12), 1000]) {
      const v = groundLeadStepResponse({ sourceResistanceOhm: resistance, inductanceH: 190e-9, capacitanceF: 12e-12 }, times(200e-9, 2000));
      expect(Math.max(...v)).toBeLessThanOrEqual(1 + 1e-9);
      for (let i = 1; i < v.length; i++) expect(v[i]).toBeGreaterThanOrEqual(v[i - 1] - 1e-12);
    }
  });

  it('should recover the inductance from a ringing frequency', () => {
    expect(inductanceForRingingH(105e6, 12e-12)).toBeCloseTo(1 / ((2 * Math.PI * 105e6) ** 2 * 12e-12), 18);
    const damped = inductanceForDampedRingingH({ sourceResistanceOhm: 50, capacitanceF: 12e-12 }, 103e6);
    const back = groundLeadResonance({ sourceResistanceOhm: 50, inductanceH: damped, capacitanceF: 12e-12 });
    expect((back.ringingFrequencyHz as number) / 103e6).toBeCloseTo(1, 9);
  });

  it('should shrink the ringing a slow edge excites as a ramp-averaged step does', () => {
    // independent check: average the step response over a linear ramp of length T = t_r/0.8
    const p = { sourceResistanceOhm: 2, inductanceH: 190e-9, capacitanceF: 12e-12 };
    const r = groundLeadResonance(p);
    const riseS = 1.5e-9;
    const rampS = riseS / 0.8;
    const t = times(40e-9, 8000);
    const n = 400;
    const ramped = t.map((ti) => groundLeadStepResponse(p, Array.from({ length: n }, (_, k) => ti - (k * rampS) / n)).reduce((a, b) => a + b, 0) / n);
    const ideal = groundLeadStepResponse(p, t);
    const ratio = (Math.max(...ramped) - 1) / (Math.max(...ideal) - 1);
    expect(ratio / edgeRingingFactor(r.ringingFrequencyHz as number, riseS)).toBeCloseTo(1, 1);
    expect(edgeRingingFactor(100e6, undefined)).toBe(1);
  });
});

describe('ground lead in diagnose', () => {
  it('should explain ringing near the predicted 15 cm lead resonance', () => {
    const result = diagnose({
      probe: { attenuation: 10, groundLeadM: 0.15, tipCapacitanceF: 12e-12 },
      scope: { bandwidthHz: 500e6 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 10e6, riseTimeS: 1e-9 },
      observed: { amplitudeV: 3.3, overshootPct: 35, ringingFrequencyHz: 110e6 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('ground-lead');
    expect(top.predicted.ringingFrequencyHz).toBeGreaterThan(90e6);
    expect(top.predicted.ringingFrequencyHz).toBeLessThan(120e6);
    expect(result.tags).toEqual(expect.arrayContaining(['ground-lead', 'long-ground-lead']));
  });

  it('should infer the lead length from an observed ringing frequency', () => {
    const lengthM = 0.1;
    const inductanceH = straightWireInductanceH(lengthM, 0.25e-3);
    const ring = groundLeadResonance({ sourceResistanceOhm: 20, inductanceH, capacitanceF: 12e-12 }).ringingFrequencyHz as number;
    const result = diagnose({
      probe: { attenuation: 10, tipCapacitanceF: 12e-12 },
      circuit: { sourceResistanceOhm: 20 },
      signal: { frequencyHz: 1e6 },
      observed: { ringingFrequencyHz: ring },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('ground-lead');
    expect(top.estimates?.impliedInductanceH).toBeCloseTo(inductanceH, 15);
    expect(top.estimates?.impliedLeadLengthM).toBeCloseTo(lengthM, 6);
  });
});
