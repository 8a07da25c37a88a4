import { describe, expect, it } from 'vitest';
import {
  HYPOTHESIS_CAUSES,
  CAUSE_LABELS,
  diagnosisInputSchema,
  diagnosisResultSchema,
} from '../../shared/schemas/diagnosis';
import { diagnose } from '../../shared/diagnosis/ranker';

const issues = (body: unknown) => {
  const result = diagnosisInputSchema.safeParse(body);
  return result.success ? [] : result.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
};

const contractExample = {
  probe: { attenuation: 10, tipCapacitanceF: 12e-12, groundLeadM: 0.15, bandwidthHz: 200e6 },
  scope: { attenuationSetting: 1, inputResistanceOhm: 1e6, inputCapacitanceF: 15e-12, bandwidthHz: 200e6 },
  circuit: { sourceResistanceOhm: 50 },
  signal: { expectedAmplitudeV: 3.3, frequencyHz: 10e6, riseTimeS: 2e-9 },
  observed: { amplitudeV: 0.33, riseTimeS: 3e-9, overshootPct: 20, ringingFrequencyHz: 120e6 },
};

describe('diagnosisInputSchema', () => {
  it('should accept the request body of the HTTP contract and an empty body', () => {
    expect(issues(contractExample)).toEqual([]);
    expect(issues({})).toEqual([]);
    expect(issues({ probe: {}, observed: {} })).toEqual([]);
  });

  it('should accept the extra case-form fields', () => {
    const body = {
      probe: { tipResistanceOhm: 9e6, groundKind: 'spring', groundWireRadiusM: 0.3e-3 },
      scope: { bandwidthLimitHz: 20e6 },
      signal: { kind: 'square' },
    };
    expect(issues(body)).toEqual([]);
  });

  it('should read null as not given', () => {
    expect(issues({ observed: { amplitudeV: null, riseTimeS: null }, probe: null })).toEqual([]);
  });

  it('should allow zero only where it is physical', () => {
    expect(issues({ probe: { groundLeadM: 0 }, circuit: { sourceResistanceOhm: 0 } })).toEqual([]);
    expect(issues({ probe: { tipCapacitanceF: 0 } })).toEqual([
      { path: 'probe.tipCapacitanceF', message: 'Tip capacitance must be greater than 0 F' },
    ]);
    expect(issues({ signal: { frequencyHz: 0 } })[0].message).toMatch(/leave it out for DC/);
  });

  it('should reject NaN, infinities and strings with a message naming the field', () => {
    expect(issues({ probe: { attenuation: Number.NaN } })).toEqual([
      { path: 'probe.attenuation', message: 'Probe attenuation must be a finite number' },
    ]);
    expect(issues({ scope: { bandwidthHz: Infinity } })).toEqual([
      { path: 'scope.bandwidthHz', message: 'Scope bandwidth must be a finite number in Hz' },
    ]);
    expect(issues({ signal: { expectedAmplitudeV: '3.3' } })[0].path).toBe('signal.expectedAmplitudeV');
  });

  it('should reject negative and absurd values with bounds in the message', () => {
    expect(issues({ probe: { attenuation: 0.5 } })[0].message).toBe(
      'Probe attenuation must be at least 1 (1 for 1x, 10 for 10x)',
    );
    expect(issues({ scope: { attenuationSetting: 2e7 } })[0].message).toBe(
      'Channel attenuation setting must be at most 10000000',
    );
    expect(issues({ probe: { tipCapacitanceF: 1e-3 } })[0].message).toBe('Tip capacitance must be at most 1 µF');
    expect(issues({ probe: { groundLeadM: 11 } })[0].message).toBe('Ground lead length must be at most 10 m');
    expect(issues({ probe: { groundLeadM: -0.1 } })[0].message).toBe('Ground lead length must be at least 0 m');
    expect(issues({ scope: { inputResistanceOhm: 2e12 } })[0].message).toBe(
      'Scope input resistance must be at most 1 TΩ',
    );
    expect(issues({ circuit: { sourceResistanceOhm: -50 } })[0].path).toBe('circuit.sourceResistanceOhm');
    expect(issues({ signal: { riseTimeS: 2 } })[0].message).toBe('Signal rise time must be at most 1 s');
    expect(issues({ observed: { amplitudeV: 0 } })[0].message).toBe('Observed amplitude must be greater than 0 V');
    expect(issues({ signal: { expectedAmplitudeV: 2e5 } })[0].message).toBe('Expected amplitude must be at most 100 kV');
    expect(issues({ observed: { overshootPct: -101 } })[0].message).toBe(
      'Observed overshoot must be at least -100 % (negative for undershoot)',
    );
    expect(issues({ observed: { overshootPct: 1001 } })[0].message).toBe('Observed overshoot must be at most 1000 %');
    expect(issues({ observed: { ringingFrequencyHz: 2e12 } })[0].path).toBe('observed.ringingFrequencyHz');
  });

  it('should reject unknown ground and signal kinds', () => {
    expect(issues({ probe: { groundKind: 'wire' } })[0].message).toBe('Ground must be clip-lead, spring or none');
    expect(issues({ signal: { kind: 'triangle' } })[0].path).toBe('signal.kind');
  });

  it('should report every bad field at once', () => {
    expect(issues({ probe: { attenuation: -1 }, observed: { riseTimeS: -1 } })).toHaveLength(2);
  });
});

describe('diagnosisResultSchema', () => {
  it('should describe what diagnose returns', () => {
    const result = diagnose(diagnosisInputSchema.parse(contractExample));
    expect(diagnosisResultSchema.safeParse(result).success).toBe(true);
    expect(JSON.parse(JSON.stringify(result))).toEqual(result); // no NaN/Infinity lost in JSON
  });

  it('should label every cause', () => {
    expect(Object.keys(CAUSE_LABELS).sort()).toEqual([...HYPOTHESIS_CAUSES].sort());
  });
});
