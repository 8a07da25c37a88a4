import { describe, expect, it } from 'vitest';
import {
  FIFTY_OHM_INPUT_LIMIT,
  inputPowerW,
  terminatedAttenuation,
} from '../../shared/diagnosis/termination-mismatch';
import { diagnose } from '../../shared/diagnosis/ranker';

describe('termination mismatch model', () => {
  it('should divide by 180,001 for a 9 MΩ tip into 50 Ω', () => {
    // worked example: resistive divider (R_tip + R_in)/R_in = (9,000,000 + 50)/50
    expect(terminatedAttenuation(9e6, 50)).toBe(180001);
  });

  it('should divide by 10 for the same tip into its 1 MΩ design input', () => {
    // common practice: a 10x probe is 9 MΩ into 1 MΩ
    expect(terminatedAttenuation(9e6, 1e6)).toBe(10);
  });

  it('should rate a 50 Ω input at 0.5 W for 5 V rms', () => {
    // source: Joule's law P = V²/R; common practice: 5 V rms rating on 50 Ω inputs
    expect(inputPowerW(FIFTY_OHM_INPUT_LIMIT.rmsV, 50)).toBeCloseTo(FIFTY_OHM_INPUT_LIMIT.powerW, 12);
  });
});

describe('termination mismatch in diagnose', () => {
  it('should put a 10x passive probe on a 50 Ω input on top, about 1/18,000 shown', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 5 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('termination-mismatch');
    // 5 V × 10 × 50/(50 + 9 MΩ + 50)
    expect(top.predicted.amplitudeV).toBeCloseTo((5 * 10 * 50) / (50 + 9e6 + 50), 12);
    expect(top.estimates?.actualAttenuation).toBe(180001);
    expect(top.explanation).toContain('180,001');
    expect(result.tags).toEqual(expect.arrayContaining(['termination-mismatch', '50-ohm-input']));
  });

  it('should warn when the 50 Ω input would take more than 5 V', () => {
    const result = diagnose({
      probe: { attenuation: 1 },
      scope: { attenuationSetting: 1, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 12, kind: 'dc' },
    });
    // 12 V from 50 Ω into 50 Ω leaves 6 V across the input: above 5 V rms
    expect(result.risks?.map((r) => r.id)).toContain('low-impedance-input-overload');
  });

  it('should not warn when the tip resistor keeps the input voltage tiny', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { inputResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 12, kind: 'dc' },
    });
    expect(result.risks?.map((r) => r.id) ?? []).not.toContain('low-impedance-input-overload');
  });

  it('should suspect a 50 Ω input the record missed when the amplitude fits it', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 5, kind: 'dc' },
      observed: { amplitudeV: 2.8e-4 },
    });
    expect(result.hypotheses[0].cause).toBe('termination-mismatch');
  });
});
