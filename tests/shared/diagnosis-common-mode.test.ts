import { describe, expect, it } from 'vitest';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import { assessCommonMode, cmrrForLeakDb, commonModeLeakV, commonModeShare } from '../../shared/diagnosis/common-mode';
import { diagnose } from '../../shared/diagnosis/ranker';

const run = (input: DiagnosisInput) => assessCommonMode({ setup: resolveSetup(input).setup, observed: observedOf(input) });

describe('common mode', () => {
  it('should pass 10^(−CMRR/20) of the common-mode voltage', () => {
    // source: CMRR definition, 20·log10(A_d/A_cm): 60 dB → 1/1000, 40 dB → 1/100, 0 dB → all
    expect(commonModeShare(60)).toBeCloseTo(1e-3, 15);
    expect(commonModeShare(40)).toBeCloseTo(1e-2, 15);
    expect(commonModeShare(0)).toBe(1);
    expect(commonModeLeakV(400, 60)).toBeCloseTo(0.4, 12);
    expect(cmrrForLeakDb(400, 0.4)).toBeCloseTo(60, 9);
  });

  it('should predict the leak of a differential probe on a swinging reference', () => {
    // worked example (Help page): 400 V swing, 50 dB → 400·10^(−2.5) = 1.265 V beside a 10 V signal
    const [c] = run({ probe: { kind: 'differential', cmrrDb: 50 }, circuit: { referenceV: 400 }, signal: { expectedAmplitudeV: 10, frequencyHz: 100e3 } });
    expect(c.estimates?.commonModeLeakV).toBeCloseTo(1.2649, 3);
    expect(c.predicted.amplitudeV).toBeCloseTo(11.2649, 3);
    expect(c.detailTags).toContain('common-mode-leak');
  });

  it('should fit the rejection that explains extra amplitude', () => {
    const candidates = run({ probe: { kind: 'differential' }, circuit: { referenceV: 300 }, signal: { expectedAmplitudeV: 5 }, observed: { amplitudeV: 5.3 } });
    const fitted = candidates.find((c) => c.basis === 'fitted')!;
    // 0.3 V of 300 V → 60 dB
    expect(fitted.estimates?.impliedCmrrDb).toBeCloseTo(60, 6);
    expect(fitted.predicted.amplitudeV).toBeCloseTo(5.3, 9);
  });

  it('should raise a hazard, not a measurement, for a passive probe grounded away from earth', () => {
    const [c] = run({ probe: { kind: 'passive' }, circuit: { referenceV: 325 }, signal: { expectedAmplitudeV: 5 } });
    expect(c.predicted).toEqual({});
    expect(c.deviation).toBe(0);
    expect(c.risks?.[0]).toMatchObject({ id: 'ground-clip-off-earth', level: 'hazard' });
    expect(c.risks?.[0].message).toMatch(/never float the scope/);
    expect(c.detailTags).toContain('ground-clip-short');
  });

  it('should caution when mains-connected equipment has no recorded reference', () => {
    const [c] = run({ circuit: { mainsConnected: true } });
    expect(c.risks?.[0].level).toBe('caution');
  });

  it('should predict nothing with the reference at earth', () => {
    const [c] = run({ probe: { kind: 'differential', cmrrDb: 60 }, circuit: { referenceV: 0 } });
    expect(c.predicted).toEqual({});
    expect(c.risks ?? []).toEqual([]);
  });

  describe('a single-ended probe grounded away from earth, in the verdict', () => {
    // DESIGN, common mode: a passive probe's ground clip on a node away from earth shorts it to
    // earth through the scope — a hazard, never a measurement (protective earth bonding, common practice)
    const clipped = (probe: DiagnosisInput['probe'], observed?: DiagnosisInput['observed']): DiagnosisInput => ({
      probe,
      scope: { attenuationSetting: probe?.attenuation ?? 10 },
      circuit: { referenceV: 325, mainsConnected: true },
      signal: { expectedAmplitudeV: 10, frequencyHz: 50e3, kind: 'square' },
      ...(observed ? { observed } : {}),
    });

    it('should never call the trace true, however right it reads', () => {
      const result = diagnose(clipped({ attenuation: 10 }, { amplitudeV: 10 }));
      expect(result.verdict).toBe('measurement-error');
      expect(result.hypotheses[0].cause).toBe('common-mode');
      expect(result.tags).toEqual(expect.arrayContaining(['common-mode', 'ground-clip-short']));
      const faithful = result.hypotheses.find((h) => h.cause === 'faithful')!;
      expect(faithful.fits).toBe(false);
      expect(faithful.ruledOutBy).toContain('common-mode');
      expect(faithful.explanation).toMatch(/a recorded value must be wrong/);
      expect(result.risks.map((r) => r.id)).toContain('ground-clip-off-earth');
      // nothing observed: the record alone says so
      expect(diagnose(clipped({ attenuation: 10 })).verdict).toBe('measurement-error');
    });

    it('should predict no reading through the short, and explain other errors only together with it', () => {
      // common practice: a 1x probe on a 10x channel shows ten times the signal
      const result = diagnose({ ...clipped({ attenuation: 1 }, { amplitudeV: 100 }), scope: { attenuationSetting: 10 } });
      expect(result.verdict).toBe('measurement-error');
      // what a shorted circuit shows is no reading of it: the short alone predicts none, the true one included
      expect(result.hypotheses[0].cause).toBe('common-mode');
      expect(result.hypotheses[0].predicted.amplitudeV).toBeUndefined();
      const paired = result.hypotheses.find((h) => h.causes.includes('attenuation-mismatch') && h.causes.includes('common-mode'))!;
      expect(paired.fits).toBe(true);
      expect(paired.predicted.amplitudeV).toBeCloseTo(100, 6);
      expect(result.hypotheses.find((h) => h.causes.length === 1 && h.cause === 'attenuation-mismatch')!.fits).toBe(false);
      expect(result.tags).toEqual(expect.arrayContaining(['attenuation-mismatch', 'common-mode']));
    });

    it('should leave a differential probe on the same node alone', () => {
      const result = diagnose(clipped({ attenuation: 100, kind: 'differential', cmrrDb: 80 }, { amplitudeV: 10 }));
      expect(result.verdict).toBe('faithful');
      expect(result.tags).toEqual([]);
    });
  });
});
