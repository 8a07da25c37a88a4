import { describe, expect, it } from 'vitest';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import { assessGeneratorLoad, generatorShownRatio, impliedLoadResistanceOhm } from '../../shared/diagnosis/generator-load';

const run = (input: DiagnosisInput) => assessGeneratorLoad({ setup: resolveSetup(input).setup, observed: observedOf(input) });

describe('generator load setting', () => {
  it('should follow the voltage divider from an EMF set for the assumed load', () => {
    // source: voltage-divider rule, V = V_emf·R_L/(R_L + R_out); a 50 Ω-set output has V_emf = 2·V_set
    expect(generatorShownRatio('50-ohm', 50, 50)).toBe(1);
    expect(generatorShownRatio('50-ohm', 50, 1e6)).toBeCloseTo((2 * 1e6) / (1e6 + 50), 12);
    expect(generatorShownRatio('high-z', 50, 50)).toBe(0.5);
    expect(generatorShownRatio('high-z', 50, 1e6)).toBeCloseTo(1e6 / (1e6 + 50), 12);
    // 50-Ω-set into 150 Ω: 2·150/200 = 1.5
    expect(generatorShownRatio('50-ohm', 50, 150)).toBeCloseTo(1.5, 12);
  });

  it('should infer the load from the ratio', () => {
    // worked by hand: 1.5 = 2·R/(R + 50) → R = 150 Ω
    expect(impliedLoadResistanceOhm('50-ohm', 50, 1.5)).toBeCloseTo(150, 9);
    expect(impliedLoadResistanceOhm('high-z', 50, 1.2)).toBeUndefined();
  });

  it('should show double when set for 50 Ω into a 1 MΩ input', () => {
    // worked example (Help page): 1 V set, coax straight into 1 MΩ → 2·1 MΩ/(1 MΩ + 50 Ω) ≈ 2.0 V
    const [c] = run({ scope: { inputResistanceOhm: 1e6 }, probe: { attenuation: 1 }, circuit: { loadResistanceOhm: 1e6 }, signal: { expectedAmplitudeV: 1, generatorLoad: '50-ohm' } });
    expect(c.predicted.amplitudeV).toBeCloseTo(1.9999, 4);
    expect(c.detailTags).toContain('generator-load-setting');
  });

  it('should fit a 50 Ω setting to a trace that reads double', () => {
    const fitted = run({ probe: { attenuation: 1 }, signal: { expectedAmplitudeV: 1 }, observed: { amplitudeV: 2 } }).filter((c) => c.basis === 'fitted');
    expect(fitted).toHaveLength(1);
    expect(fitted[0].estimates?.impliedGeneratorLoad).toBe('50-ohm');
  });

  it('should fit the load behind a recorded setting and call a recorded load it contradicts', () => {
    const fitted = run({ circuit: { loadResistanceOhm: 1e6 }, signal: { expectedAmplitudeV: 1, generatorLoad: '50-ohm' }, observed: { amplitudeV: 1.5 } }).find((c) => c.basis === 'fitted')!;
    expect(fitted.estimates?.impliedLoadResistanceOhm).toBeCloseTo(150, 6);
    expect(fitted.contradictions?.[0]).toMatchObject({ field: 'circuit.loadResistanceOhm', recorded: 1e6 });
  });

  it('should predict nothing without a recorded setting', () => {
    const [c] = run({ signal: { expectedAmplitudeV: 1 } });
    expect(c.predicted).toEqual({});
  });
});
