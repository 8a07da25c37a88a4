import { describe, expect, it } from 'vitest';
import { abs, add, complex, divide, multiply, type Complex } from 'mathjs';
import {
  dcLoadingRatio,
  impliedSourceResistanceOhm,
  loadedRiseTimeS,
  loadingCornerHz,
  loadingFrequencyResponse,
  loadingRatioAt,
} from '../../shared/diagnosis/loading';
import { diagnose } from '../../shared/diagnosis/ranker';

/** The AC divider computed independently with mathjs complex arithmetic. */
function mathjsDivider(rs: number, rin: number, c: number, f: number): number {
  const zc = complex(0, -1 / (2 * Math.PI * f * c));
  const zr = complex(rin, 0);
  const zp = divide(multiply(zr, zc), add(zr, zc)) as Complex;
  return abs(divide(zp, add(complex(rs, 0), zp)) as Complex) as unknown as number;
}

const oneX = { sourceResistanceOhm: 10e3, inputResistanceOhm: 1e6, inputCapacitanceF: 100e-12 };

describe('loading model', () => {
  it('should halve a 1 MΩ source on a 1 MΩ input at DC', () => {
    // source: voltage-divider rule R_in/(R_s + R_in)
    expect(dcLoadingRatio({ sourceResistanceOhm: 1e6, inputResistanceOhm: 1e6, inputCapacitanceF: 1e-12 })).toBe(0.5);
    expect(loadingRatioAt({ sourceResistanceOhm: 1e6, inputResistanceOhm: 1e6, inputCapacitanceF: 1e-12 }, 0)).toBe(0.5);
  });

  it.each([1e3, 100e3, 1e6, 20e6, 300e6])('should match mathjs complex arithmetic at %d Hz', (f) => {
    // source: mathjs complex numbers, Z_p = R ∥ 1/(jωC), |Z_p/(R_s + Z_p)|
    expect(loadingRatioAt(oneX, f)).toBeCloseTo(mathjsDivider(10e3, 1e6, 100e-12, f), 12);
    const tenX = { sourceResistanceOhm: 1e6, inputResistanceOhm: 10e6, inputCapacitanceF: 12e-12 };
    expect(loadingRatioAt(tenX, f)).toBeCloseTo(mathjsDivider(1e6, 10e6, 12e-12, f), 12);
  });

  it('should put the corner at 1/(2π (R_s∥R_in) C), where the divider falls by 1/√2', () => {
    // source: Thevenin equivalent: V·R_in/(R_s+R_in) through (R_s∥R_in) into C, a single pole
    const corner = loadingCornerHz(oneX);
    const rpar = (10e3 * 1e6) / (10e3 + 1e6);
    expect(corner).toBeCloseTo(1 / (2 * Math.PI * rpar * 100e-12), 6);
    expect(loadingRatioAt(oneX, corner) / dcLoadingRatio(oneX)).toBeCloseTo(Math.SQRT1_2, 12);
  });

  it('should slow edges to ln 9 · (R_s∥R_in) · C, about 2.2 RC', () => {
    // source: single-pole 10–90 % rise time τ·ln 9
    const rpar = (10e3 * 1e6) / (10e3 + 1e6);
    expect(loadedRiseTimeS(oneX)).toBeCloseTo(Math.log(9) * rpar * 100e-12, 15);
    expect(loadedRiseTimeS(oneX) / (rpar * 100e-12)).toBeCloseTo(2.197, 3);
  });

  it('should recover the source resistance from the amplitude it leaves, at DC and AC', () => {
    const probe = { inputResistanceOhm: 1e6, inputCapacitanceF: 100e-12 };
    expect(impliedSourceResistanceOhm(probe, 0.5)).toBeCloseTo(1e6, 3);
    for (const f of [0, 50e3, 1e6]) {
      const ratio = loadingRatioAt(oneX, f);
      expect(impliedSourceResistanceOhm(probe, ratio, f)).toBeCloseTo(10e3, 3);
    }
    expect(impliedSourceResistanceOhm(probe, 1.2)).toBeUndefined();
  });

  it('should give the magnitude response for the plots', () => {
    const freqs = [0, 1e3, 1e6];
    expect(loadingFrequencyResponse(oneX, freqs)).toEqual(freqs.map((f) => loadingRatioAt(oneX, f)));
  });
});

describe('loading in diagnose', () => {
  it('should blame a 1x probe on a 10 kΩ node for a 1 MHz sine shown at 16 %', () => {
    const result = diagnose({
      probe: { attenuation: 1 },
      scope: { attenuationSetting: 1 },
      circuit: { sourceResistanceOhm: 10e3 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'sine' },
      observed: { amplitudeV: 0.16 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('loading');
    expect(top.predicted.amplitudeV).toBeCloseTo(mathjsDivider(10e3, 1e6, 100e-12, 1e6), 9);
    expect(top.explanation).toContain('161 kHz');
    expect(result.tags).toEqual(expect.arrayContaining(['loading', '1x-probe-loading']));
  });

  it('should infer the source impedance when the case does not record it', () => {
    const result = diagnose({
      probe: { attenuation: 10 },
      signal: { expectedAmplitudeV: 2, kind: 'dc' },
      observed: { amplitudeV: 1.6 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('loading');
    // 10 MΩ probe: R_s = R_in (1/ρ − 1) = 10 MΩ × 0.25
    expect(top.estimates?.impliedSourceResistanceOhm).toBeCloseTo(2.5e6, 0);
  });
});

describe('loading from a recorded source impedance in the ranking', () => {
  it('should rank loading above a guessed trimmer error when the recorded setup predicts the drop', () => {
    // source: voltage divider |Z_p / (Z_s + Z_p)|, Z_p = 10 MΩ ∥ 12 pF, Z_s = 10 kΩ, at 1 MHz (mathjs)
    const w = 2 * Math.PI * 1e6;
    const zp = divide(1, add(1 / 10e6, complex(0, w * 12e-12))) as Complex;
    const ratio = abs(divide(zp, add(zp, 10e3)) as Complex) as unknown as number;
    const result = diagnose({
      probe: { attenuation: 10, tipCapacitanceF: 12e-12 },
      scope: { attenuationSetting: 10 },
      circuit: { sourceResistanceOhm: 10e3 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'sine' },
      observed: { amplitudeV: ratio },
    });
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].causes).toEqual(['loading']);
  });
});
