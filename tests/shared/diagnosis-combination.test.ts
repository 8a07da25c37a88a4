import { describe, expect, it } from 'vitest';
import { composePredictions } from '../../shared/diagnosis/combination';
import { diagnosisInputFromSetup } from '../../shared/diagnosis/from-case-setup';
import { diagnose } from '../../shared/diagnosis/ranker';
import { clearTopCause } from '../../server/services/case-diagnosis';

describe('composing two causes through the chain', () => {
  const reference = { amplitudeV: 2, riseTimeS: 1e-9, overshootPct: 0, frequencyHz: 1e6 };

  it('should multiply amplitude ratios and add extra rise-time stages in quadrature', () => {
    const { predicted } = composePredictions(reference, { predicted: { ...reference, amplitudeV: 0.2 } }, { predicted: { ...reference, amplitudeV: 1, riseTimeS: Math.hypot(1e-9, 3e-9) } });
    // dividers in cascade multiply: (0.2/2)·(1/2) of 2 V
    expect(predicted.amplitudeV).toBeCloseTo(0.1, 12);
    // source: root-sum-square rise-time rule, √(t_ref² + (t_a² − t_ref²) + (t_b² − t_ref²))
    expect(predicted.riseTimeS).toBeCloseTo(Math.hypot(1e-9, 3e-9), 15);
  });

  it('should take ringing and its overshoot from the member that rings, and scale a spike by the other member', () => {
    const { predicted, overshootUpperBound } = composePredictions(
      reference,
      { predicted: { ...reference, amplitudeV: 0.2 } },
      { predicted: { ...reference, overshootPct: 40, ringingFrequencyHz: 100e6, spikeV: 2 }, overshootUpperBound: true },
    );
    expect(predicted.ringingFrequencyHz).toBe(100e6);
    expect(predicted.overshootPct).toBe(40);
    expect(overshootUpperBound).toBe(true);
    // a spike is a voltage on the screen: a ×0.1 channel error shows it ×0.1
    expect(predicted.spikeV).toBeCloseTo(0.2, 12);
  });
});

describe('the stored engine cause', () => {
  it('should name no cause for a faithful or unexplained verdict and the first cause of a combination', () => {
    const faithful = diagnose({ probe: { attenuation: 10, groundKind: 'spring' }, signal: { expectedAmplitudeV: 1, kind: 'dc' }, observed: { amplitudeV: 1 } });
    expect(faithful.verdict).toBe('faithful');
    expect(clearTopCause(faithful)).toBeNull();
    const unexplained = diagnose({ probe: { attenuation: 10, groundKind: 'spring' }, signal: { expectedAmplitudeV: 1, kind: 'dc' }, observed: { amplitudeV: 1.7 } });
    expect(unexplained.verdict).toBe('unexplained');
    expect(clearTopCause(unexplained)).toBeNull();
    const error = diagnose({ probe: { attenuation: 10, groundKind: 'spring' }, scope: { attenuationSetting: 1 }, signal: { expectedAmplitudeV: 1, kind: 'dc' }, observed: { amplitudeV: 0.1 } });
    expect(clearTopCause(error)).toBe('attenuation-mismatch');
  });

  it("should pass a case's safety facts to the engine so its risks reach the case page", () => {
    const input = diagnosisInputFromSetup({
      probe: { attenuation: 10, kind: 'passive', model: 'P-10' },
      scope: { attenuationSetting: 10, riseTimeS: 1e-9, bandwidthLimitOn: false, bandwidthLimitHz: 20e6 },
      circuit: { referenceV: 400, highestVoltageV: 400, mainsConnected: true, nodeDescription: 'high-side gate' },
      signal: { expectedAmplitudeV: 12, kind: 'square', frequencyHz: 100e3 },
    });
    expect(input.circuit).toEqual({ referenceV: 400, highestVoltageV: 400, mainsConnected: true });
    expect(input.scope?.bandwidthLimitHz).toBeUndefined();
    expect(input.scope?.riseTimeS).toBe(1e-9);
    const ids = diagnose(input).risks.map((r) => r.id);
    expect(ids).toEqual(expect.arrayContaining(['hazardous-live', 'ground-clip-off-earth', 'mains-connected']));
  });
});
