import { describe, expect, it } from 'vitest';
import { diagnosisInputFromSetup } from '../../shared/diagnosis/from-case-setup';

describe('diagnosisInputFromSetup', () => {
  it('should pass the acquisition, reference and source fields of a case to the engine', () => {
    const input = diagnosisInputFromSetup({
      probe: { kind: 'differential', cmrrDb: 50, model: 'any' },
      scope: { coupling: 'ac', acCornerHz: 10, sampleRateHz: 1e6, voltsPerDiv: 0.5, offsetV: 1, divisions: 10, riseTimeS: 1e-9 },
      circuit: { loadResistanceOhm: 50, referenceV: 400, highestVoltageV: 400, mainsConnected: true, mainsFrequencyHz: 60, nodeDescription: 'switch node' },
      signal: { generatorLoad: '50-ohm', baseV: -1 },
      observed: { frequencyHz: 2e3, clipped: true, tiltPct: 12, humFrequencyHz: 120, description: 'hum' },
    });
    expect(input.probe).toMatchObject({ kind: 'differential', cmrrDb: 50 });
    expect(input.scope).toMatchObject({ coupling: 'ac', acCornerHz: 10, sampleRateHz: 1e6, voltsPerDiv: 0.5, offsetV: 1, divisions: 10 });
    expect(input.circuit).toEqual({ sourceResistanceOhm: undefined, loadResistanceOhm: 50, referenceV: 400, highestVoltageV: 400, mainsConnected: true, mainsFrequencyHz: 60 });
    expect(input.signal).toMatchObject({ generatorLoad: '50-ohm', baseV: -1 });
    expect(input.observed).toEqual({ frequencyHz: 2e3, clipped: true, tiltPct: 12, humFrequencyHz: 120 });
  });
});
