import { describe, expect, it } from 'vitest';
import { CAUSES } from '../../shared/schemas/diagnosis';
import { TAG_THRESHOLD, diagnose } from '../../shared/diagnosis/ranker';

const MISMATCHES = ['attenuation-mismatch', 'termination-mismatch', 'compensation'];

const matched = {
  probe: { attenuation: 10, groundKind: 'spring' as const, bandwidthHz: 500e6 },
  scope: { attenuationSetting: 10, inputResistanceOhm: 1e6, bandwidthHz: 500e6 },
  circuit: { sourceResistanceOhm: 50 },
  signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e6, riseTimeS: 5e-9 },
};

describe('diagnose', () => {
  it('should return one hypothesis per cause with likelihoods summing to 1, most likely first', () => {
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, observed: { ringingFrequencyHz: 90e6 } });
    expect(result.hypotheses.map((h) => h.cause).sort()).toEqual([...CAUSES].sort());
    const sum = result.hypotheses.reduce((a, h) => a + h.likelihood, 0);
    expect(sum).toBeCloseTo(1, 12);
    for (let i = 1; i < result.hypotheses.length; i++) {
      expect(result.hypotheses[i - 1].likelihood).toBeGreaterThanOrEqual(result.hypotheses[i].likelihood);
    }
  });

  it('should still answer an empty case, listing what it assumed', () => {
    const result = diagnose({});
    expect(result.hypotheses).toHaveLength(CAUSES.length);
    expect(result.tags).toEqual([]);
    const assumed = Object.fromEntries(result.assumptions.map((a) => [a.field, a.value]));
    // common practice: the typical values DESIGN.md lists
    expect(assumed['probe.attenuation']).toBe(10);
    expect(assumed['probe.tipResistanceOhm']).toBe(9e6);
    expect(assumed['probe.tipCapacitanceF']).toBe(12e-12);
    expect(assumed['scope.inputResistanceOhm']).toBe(1e6);
    expect(assumed['scope.inputCapacitanceF']).toBe(15e-12);
    expect(assumed['probe.groundLeadM']).toBe(0.15);
    expect(assumed['probe.groundWireRadiusM']).toBe(0.25e-3);
    for (const a of result.assumptions) expect(a.why.length).toBeGreaterThan(10);
  });

  it('should assume a 1x probe loads with about 100 pF', () => {
    // common practice: 1x probe, cable and input together
    const result = diagnose({ probe: { attenuation: 1 } });
    expect(result.assumptions.find((a) => a.field === 'probe.tipCapacitanceF')?.value).toBeCloseTo(100e-12, 20);
  });

  it('should rank by the size of the predicted error when nothing is observed', () => {
    const result = diagnose({
      probe: { attenuation: 10, groundLeadM: 0.15 },
      scope: { attenuationSetting: 1, inputResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6 },
    });
    // 1/18,000 (termination) outranks ×10 (attenuation), which outranks a 50 % overshoot
    expect(result.hypotheses.slice(0, 3).map((h) => h.cause)).toEqual([
      'termination-mismatch',
      'attenuation-mismatch',
      'ground-lead',
    ]);
  });

  it('should not put a mismatch on top of a matched setup', () => {
    for (const observed of [undefined, { amplitudeV: 3.3 }, { amplitudeV: 3.3, overshootPct: 0 }]) {
      const result = diagnose({ ...matched, observed });
      expect(MISMATCHES).not.toContain(result.hypotheses[0].cause);
      for (const h of result.hypotheses.filter((x) => MISMATCHES.includes(x.cause))) {
        expect(h.likelihood).toBeLessThan(0.5);
      }
    }
  });

  it('should write explanations with numbers in engineering notation', () => {
    const result = diagnose({ probe: { attenuation: 10, groundLeadM: 0.15, tipCapacitanceF: 12e-12 }, signal: { frequencyHz: 1e6 } });
    const lead = result.hypotheses.find((h) => h.cause === 'ground-lead');
    expect(lead?.explanation).toContain('190 nH');
    expect(lead?.explanation).toContain('105 MHz');
    expect(lead?.explanation).not.toMatch(/\d{5,}|e[+-]\d/);
    expect(lead?.fix).toMatch(/ground spring/);
  });

  it('should tag only hypotheses at or above the threshold', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 1 },
      signal: { expectedAmplitudeV: 3.3, kind: 'dc' },
      observed: { amplitudeV: 0.33 },
    });
    const tagged = result.hypotheses.filter((h) => h.likelihood >= TAG_THRESHOLD).map((h) => h.cause);
    for (const cause of CAUSES) expect(result.tags.includes(cause)).toBe(tagged.includes(cause));
  });

  it('should report residuals as root-sum-square log ratios', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 1 },
      signal: { expectedAmplitudeV: 3.3, kind: 'dc' },
      observed: { amplitudeV: 0.33 },
    });
    const termination = result.hypotheses.find((h) => h.cause === 'termination-mismatch');
    expect(termination?.residual).toBeCloseTo(Math.log(10), 9);
    expect(result.hypotheses[0].residual).toBeCloseTo(0, 9);
  });

  it('should raise the hazard when the expected amplitude is above the live limits', () => {
    const result = diagnose({ signal: { expectedAmplitudeV: 325, frequencyHz: 50, kind: 'sine' } });
    expect(result.risks?.find((r) => r.id === 'hazardous-live')?.level).toBe('hazard');
    const safe = diagnose({ signal: { expectedAmplitudeV: 12, kind: 'dc' } });
    expect(safe.risks?.find((r) => r.id === 'hazardous-live')).toBeUndefined();
  });
});
