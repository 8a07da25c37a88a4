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

// A recorded source impedance is an estimate (e^±0.5 by evidence.ts), but a load that moves the
// trace far beyond that spread is a fact of the record: a trace the load cannot give is no true one.
describe('what a recorded source impedance asserts', () => {
  // source: the loaded node is a single pole, τ = (R_s ∥ R_in)·C; its 10–90 % edge is ln 9·τ
  // (IEEE Std 181-2011, transition duration of a first-order step), and edges add in quadrature
  const tauS = ((100e3 * 10e6) / (100e3 + 10e6)) * 10e-12;
  const loadedEdgeS = Math.hypot(Math.log(9) * tauS, 10e-9);
  const setup = {
    probe: { attenuation: 10, tipCapacitanceF: 10e-12 },
    scope: { attenuationSetting: 10 },
    circuit: { sourceResistanceOhm: 100e3 },
    signal: { expectedAmplitudeV: 5, frequencyHz: 10e3, riseTimeS: 10e-9, kind: 'square' as const },
  };

  it('should blame the load, and nothing else, for the slow edge it predicts', () => {
    const result = diagnose({ ...setup, observed: { amplitudeV: 4.95, riseTimeS: loadedEdgeS } });
    expect(loadedEdgeS).toBeCloseTo(2.18e-6, 8);
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].causes).toEqual(['loading']);
    // a hidden bandwidth limit would give the same edge, but the record says the load acts anyway
    const bandwidth = result.hypotheses.find((h) => h.causes.length === 1 && h.cause === 'bandwidth')!;
    expect(bandwidth.fits).toBe(false);
    expect(bandwidth.ruledOutBy).toContain('loading');
    expect(result.tags).not.toContain('bandwidth');
  });

  it('should find nothing that fits an edge a hundred times faster than the recorded load allows', () => {
    const result = diagnose({ ...setup, observed: { amplitudeV: 4.95, riseTimeS: 20e-9 } });
    expect(result.verdict).toBe('unexplained');
    expect(result.hypotheses.some((h) => h.fits)).toBe(false);
    expect(result.hypotheses.find((h) => h.cause === 'faithful')!.ruledOutBy).toContain('loading');
  });

  it('should call a DC level read in full off a 5 MΩ node through 10 MΩ no true trace, and the divided one loading', () => {
    // source: voltage-divider rule, 10 MΩ/(5 MΩ + 10 MΩ) = 2/3
    const dc = { probe: { attenuation: 10 }, scope: { attenuationSetting: 10 }, circuit: { sourceResistanceOhm: 5e6 }, signal: { expectedAmplitudeV: 3, kind: 'dc' as const } };
    expect(diagnose({ ...dc, observed: { amplitudeV: 3 } }).verdict).toBe('unexplained');
    const divided = diagnose({ ...dc, observed: { amplitudeV: 2 } });
    expect(divided.verdict).toBe('measurement-error');
    expect(divided.hypotheses[0].causes).toEqual(['loading']);
  });

  it('should leave a load within the estimate’s spread to the reading: 9 % off a 1 MΩ node through 10 MΩ', () => {
    // source: voltage-divider rule, 10/11 = 0.909; a source of e^0.5 × 1 MΩ would keep 0.858
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 10 }, circuit: { sourceResistanceOhm: 1e6 }, signal: { expectedAmplitudeV: 3, kind: 'dc' }, observed: { amplitudeV: 3 } });
    expect(result.verdict).toBe('faithful');
  });
});

describe('a load too light to move the trace', () => {
  it('should leave the slow edge of a 20 MHz limit to the bandwidth, not tag loading beside it', () => {
    // source: single pole t_r = ln 9/(2π·20 MHz) = 17.5 ns; a 50 Ω source on 12 pF adds ln 9·0.6 ns = 1.3 ns,
    // under 1 % once edges add in quadrature, so the load explains nothing the chain does not
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, bandwidthHz: 200e6, bandwidthLimitHz: 20e6 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 5e6, riseTimeS: 1e-9, kind: 'square' },
      observed: { amplitudeV: 3.3, riseTimeS: 17.6e-9 },
    });
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].causes).toEqual(['bandwidth']);
    expect(result.tags).not.toContain('loading');
    expect(result.hypotheses.filter((h) => h.fits && h.causes.includes('loading'))).toEqual([]);
  });
});

describe('the load of probes that are not passive dividers', () => {
  // an active (FET) probe: about 1 MΩ ∥ 1 pF at the tip (common practice), its buffer driving the
  // scope's 50 Ω input; on a 10 kΩ node with 1 ns edges
  const activeSetup = {
    probe: { kind: 'active' as const, attenuation: 10, groundKind: 'spring' as const },
    scope: { attenuationSetting: 10, inputResistanceOhm: 50, bandwidthHz: 1e9 },
    circuit: { sourceResistanceOhm: 10e3 },
    signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e6, riseTimeS: 1e-9, kind: 'square' as const },
  };

  it('should take an active probe with nothing recorded of its input as about 1 MΩ ∥ 1 pF, not a passive probe', () => {
    // source: single pole τ = (R_s ∥ R_tip)·C, 10–90 % edge ln 9·τ (IEEE Std 181-2011, first-order
    // step), edges in quadrature; level R_tip/(R_s + R_tip) (voltage-divider rule). The scope's
    // 50 Ω input sits behind the buffer and takes no part.
    const tauS = ((10e3 * 1e6) / (10e3 + 1e6)) * 1e-12;
    const edgeS = Math.hypot(Math.log(9) * tauS, 1e-9);
    expect(edgeS).toBeCloseTo(21.8e-9, 10);
    const result = diagnose({ ...activeSetup, observed: { amplitudeV: 3.27, riseTimeS: edgeS } });
    const assumed = Object.fromEntries(result.assumptions.map((a) => [a.field, a.value]));
    expect(assumed['probe.tipCapacitanceF']).toBe(1e-12);
    expect(assumed['probe.tipResistanceOhm']).toBe(1e6);
    const loading = result.hypotheses.find((h) => h.causes.length === 1 && h.cause === 'loading')!;
    expect(loading.fits).toBe(true);
    expect(loading.predicted.riseTimeS! / edgeS).toBeCloseTo(1, 3);
    expect(loading.predicted.amplitudeV! / (3.3 * (1e6 / (1e6 + 10e3)))).toBeCloseTo(1, 3);
    expect(result.tags).toContain('loading');
  });

  it('should still take a passive 10x probe with nothing recorded as about 12 pF', () => {
    // common practice: a 10x passive probe presents 10–15 pF at the tip
    const result = diagnose({ ...activeSetup, probe: { attenuation: 10 }, scope: { attenuationSetting: 10 } });
    expect(result.assumptions.find((a) => a.field === 'probe.tipCapacitanceF')!.value).toBe(12e-12);
  });

  it('should not load a node through a current probe, which touches none', () => {
    // fact of the trade: a current probe closes around the conductor, with no contact to any node
    const result = diagnose({
      probe: { kind: 'current', attenuation: 1 },
      scope: { attenuationSetting: 1 },
      circuit: { sourceResistanceOhm: 1e6 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 100e3, kind: 'square' },
      observed: { amplitudeV: 1 },
    });
    expect(result.verdict).toBe('faithful');
    const loading = result.hypotheses.find((h) => h.causes.length === 1 && h.cause === 'loading')!;
    expect(loading.explanation).toMatch(/touches no node/);
    expect(result.tags).not.toContain('loading');
  });
});

describe('the advice for a load on an active probe', () => {
  it('should not call an active probe at 1:1 a 1x probe, nor advise an active probe as if none were on', () => {
    // an active probe at 1:1 (about 1 MΩ ∥ 1 pF, common practice) on a 100 kΩ node: 2.2·(R_s ∥ R_tip)·C ≈ 0.2 µs edges
    const result = diagnose({
      probe: { kind: 'active', attenuation: 1, groundKind: 'spring' },
      scope: { attenuationSetting: 1, inputResistanceOhm: 50, bandwidthHz: 1e9 },
      circuit: { sourceResistanceOhm: 100e3 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 100e3, riseTimeS: 1e-9, kind: 'square' },
      observed: { amplitudeV: 0.91, riseTimeS: 200e-9 },
    });
    const loading = result.hypotheses.find((h) => h.causes.length === 1 && h.cause === 'loading')!;
    expect(loading.fits).toBe(true);
    expect(result.tags).not.toContain('1x-probe-loading');
    expect(loading.fix).not.toMatch(/10x probe|use an active probe/);
    expect(loading.fix).toMatch(/active probe with less input capacitance/);
  });
});
