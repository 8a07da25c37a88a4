import { describe, expect, it } from 'vitest';
import { resolveSetup } from '../../shared/diagnosis/defaults';
import { ACQUISITION_SIGMA, UNEXPLAINED_FEATURE, acquisitionReference, compareAcquisition, predictsClipping } from '../../shared/diagnosis/compare-acquisition';

describe('compareAcquisition', () => {
  it('should compare frequencies and hum lines as log ratios', () => {
    const { terms } = compareAcquisition({ frequencyHz: 2e3, humFrequencyHz: 50 }, { frequencyHz: 1e3, humFrequencyHz: 100 });
    expect(terms).toEqual([
      { residual: Math.log(2), sigma: ACQUISITION_SIGMA.frequency },
      { residual: Math.log(0.5), sigma: ACQUISITION_SIGMA.hum },
    ]);
  });

  it('should compare tilt on the level a top ends at', () => {
    // our choice: 1 − tilt/100, as scoring.ts does with 1 + overshoot/100
    const { terms } = compareAcquisition({ tiltPct: 0 }, { tiltPct: 20 });
    expect(terms[0].residual).toBeCloseTo(Math.log(1 / 0.8), 12);
  });

  it('should charge hum or clipping that the hypothesis does not predict', () => {
    expect(compareAcquisition({}, { humFrequencyHz: 50 }).terms).toEqual([{ residual: UNEXPLAINED_FEATURE, sigma: ACQUISITION_SIGMA.presence }]);
    expect(compareAcquisition({}, { clipped: true }).terms).toHaveLength(1);
    expect(compareAcquisition({}, { clipped: true }, true).terms).toHaveLength(0);
    expect(compareAcquisition({}, { clipped: false }, true).terms).toHaveLength(1);
    expect(compareAcquisition({}, {}).terms).toHaveLength(0);
  });

  it('should give the error-free picture the signal frequency and flat tops', () => {
    const { setup } = resolveSetup({ signal: { frequencyHz: 1e6, kind: 'square' } });
    expect(acquisitionReference(setup)).toEqual({ frequencyHz: 1e6, tiltPct: 0 });
    expect(acquisitionReference(resolveSetup({ signal: { kind: 'dc' } }).setup)).toEqual({});
  });

  it('should read the clipping estimate', () => {
    expect(predictsClipping([{ estimates: { screenWindow: 'clipped' } }, {}])).toBe(true);
    expect(predictsClipping([{ estimates: { screenWindow: 'fits' } }])).toBe(false);
  });
});
