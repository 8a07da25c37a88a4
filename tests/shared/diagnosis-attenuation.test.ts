import { describe, expect, it } from 'vitest';
import { impliedProbeAttenuation, shownAmplitudeV } from '../../shared/diagnosis/attenuation-mismatch';
import { diagnose } from '../../shared/diagnosis/ranker';

describe('attenuation mismatch model', () => {
  it('should show a tenth of the signal for a 10x probe read at 1x', () => {
    // common practice: the channel multiplies by its setting, the probe divides by its ratio
    expect(shownAmplitudeV(5, 1, 10)).toBeCloseTo(0.5, 12);
  });

  it('should show ten times the signal for a 1x probe read at 10x', () => {
    // common practice: the same rule read the other way
    expect(shownAmplitudeV(0.5, 10, 1)).toBeCloseTo(5, 12);
  });

  it('should leave the amplitude alone when setting and probe agree', () => {
    expect(shownAmplitudeV(3.3, 100, 100)).toBe(3.3);
  });

  it('should infer the probe ratio from expected and observed amplitudes', () => {
    // inverse of shown = true × setting ÷ actual
    expect(impliedProbeAttenuation(3.3, 0.33, 1)).toBeCloseTo(10, 10);
    expect(impliedProbeAttenuation(1, 10, 10)).toBeCloseTo(1, 10);
  });
});

describe('attenuation mismatch in diagnose', () => {
  it('should put a recorded 10x-at-1x mismatch on top with the tenth predicted', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 1 },
      signal: { expectedAmplitudeV: 3.3 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('attenuation-mismatch');
    expect(top.predicted.amplitudeV).toBeCloseTo(0.33, 12);
    expect(top.explanation).toContain('330 mV instead of 3.30 V');
    expect(top.fix).toMatch(/channel attenuation to 10x/);
    expect(result.tags).toEqual(expect.arrayContaining(['attenuation-mismatch', '10x-at-1x']));
  });

  it('should suspect a hidden switch position when the trace is off by a round factor', () => {
    const result = diagnose({
      probe: { attenuation: 1 },
      scope: { attenuationSetting: 1 },
      signal: { expectedAmplitudeV: 5, kind: 'dc' },
      observed: { amplitudeV: 0.52 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('attenuation-mismatch');
    expect(top.estimates?.impliedProbeAttenuation).toBeCloseTo(9.615, 3);
    expect(top.explanation).toMatch(/round factor/);
    expect(result.tags).toContain('10x-at-1x');
  });

  it('should not call a 30 % shortfall a round factor', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 1, kind: 'dc' },
      observed: { amplitudeV: 0.7 },
    });
    expect(result.hypotheses[0].cause).not.toBe('attenuation-mismatch');
  });
});
