import { describe, expect, it } from 'vitest';
import { diagnosisInputFromSetup } from '../../shared/diagnosis/from-case-setup';

describe('diagnosisInputFromSetup', () => {
  it('should pass every recorded engine field through and keep what only a person reads', () => {
    const input = diagnosisInputFromSetup({
      probe: { model: 'diff 50x', nominalAttenuation: 50, switchable: false, kind: 'differential', cmrrDb: 60, groundKind: 'none' },
      scope: { model: 'bench scope', attenuationSetting: 50, coupling: 'ac', acCornerHz: 10, sampleRateHz: 1e9, voltsPerDiv: 0.5, offsetV: -1, divisions: 10, riseTimeS: 1e-9, bandwidthLimitOn: false, bandwidthLimitHz: 20e6 },
      circuit: { nodeDescription: 'high side', loadResistanceOhm: 50, referenceV: 48, highestVoltageV: 60, mainsConnected: true, mainsFrequencyHz: 60 },
      signal: { expectedAmplitudeV: 1, baseV: -0.5, generatorLoad: '50-ohm' },
      observed: { description: 'flat tops', frequencyHz: 2e3, clipped: true, tiltPct: 12, humFrequencyHz: 60 },
    });
    expect(input.probe).toEqual({ attenuation: 50, kind: 'differential', cmrrDb: 60, groundKind: 'none' });
    expect(input.scope).toEqual({ attenuationSetting: 50, coupling: 'ac', acCornerHz: 10, sampleRateHz: 1e9, voltsPerDiv: 0.5, offsetV: -1, divisions: 10, riseTimeS: 1e-9, bandwidthLimitHz: undefined });
    expect(input.circuit).toEqual({ loadResistanceOhm: 50, referenceV: 48, highestVoltageV: 60, mainsConnected: true, mainsFrequencyHz: 60 });
    expect(input.signal).toEqual({ expectedAmplitudeV: 1, baseV: -0.5, generatorLoad: '50-ohm' });
    expect(input.observed).toEqual({ frequencyHz: 2e3, clipped: true, tiltPct: 12, humFrequencyHz: 60 });
  });

  it('should use the switch position over the nominal ratio, and a bandwidth limit only when it is on', () => {
    const input = diagnosisInputFromSetup({ probe: { nominalAttenuation: 10, attenuation: 1, switchable: true }, scope: { bandwidthLimitOn: true, bandwidthLimitHz: 20e6 } });
    expect(input.probe?.attenuation).toBe(1);
    expect(input.scope?.bandwidthLimitHz).toBe(20e6);
  });
});
