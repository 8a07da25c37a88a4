import { describe, expect, it } from 'vitest';
import * as math from 'mathjs';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
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

describe('termination as a complex divider', () => {
  // A 10x probe (9 MΩ tip, 12 pF at the tip) into a 50 Ω input. Compensated probe: C1 = n·C_tip/(n−1),
  // C2 = n·C_tip (series capacitors and R1·C1 = R2·C2). Checked with mathjs complex arithmetic.
  const n = 10;
  const ctip = 12e-12;
  const c1 = (n * ctip) / (n - 1);
  const c2 = n * ctip;
  const parallelRC = (r: number, c: number, f: number) => {
    const zc = math.complex(0, -1 / (2 * Math.PI * f * c));
    return math.divide(math.multiply(r, zc), math.add(r, zc)) as math.Complex;
  };
  const divider = (f: number) => {
    const z1 = parallelRC(9e6, c1, f);
    const z2 = parallelRC(50, c2, f);
    return math.abs(math.divide(z2, math.add(z1, z2)) as math.Complex) as unknown as number;
  };
  const sine = (frequencyHz: number): DiagnosisInput => ({
    probe: { attenuation: 10, tipCapacitanceF: ctip },
    scope: { attenuationSetting: 10, inputResistanceOhm: 50 },
    circuit: { sourceResistanceOhm: 0 },
    signal: { expectedAmplitudeV: 1, frequencyHz, kind: 'sine' },
  });
  const termination = (input: DiagnosisInput) => diagnose(input).hypotheses.find((h) => h.causes.length === 1 && h.cause === 'termination-mismatch')!;

  it('should show about 0.386 V for 1 V at 10 MHz on a 10x channel', () => {
    // source: voltage divider with complex impedances Z2/(Z1 + Z2), Zi = Ri ∥ 1/(jωCi) (mathjs)
    const expected = 10 * divider(10e6);
    expect(expected).toBeCloseTo(0.386, 3);
    expect(termination(sine(10e6)).predicted.amplitudeV).toBeCloseTo(expected, 9);
  });

  it('should follow |Z2/(Z1+Z2)| from 25 kHz to 100 MHz, far above the resistive 1/180,001', () => {
    for (const f of [25e3, 1e6, 100e6]) {
      expect(Math.abs((termination(sine(f)).predicted.amplitudeV as number) / (10 * divider(f)) - 1)).toBeLessThan(1e-9);
    }
    // at 25 kHz C1 already dominates: about 19 × the resistive ratio
    expect(divider(25e3) / (50 / (9e6 + 50))).toBeGreaterThan(15);
  });

  it('should show flat tops at the resistive ratio and a spike of C1/(C1+C2) per edge for a square wave', () => {
    const result = diagnose({ ...sine(100e3), signal: { expectedAmplitudeV: 2, frequencyHz: 100e3, kind: 'square' } });
    const h = result.hypotheses.find((x) => x.causes.length === 1 && x.cause === 'termination-mismatch')!;
    // source: final-value theorem, R_in/(R_tip + R_in), × the 10x channel
    expect(h.predicted.amplitudeV).toBeCloseTo(2 * 10 * (50 / (9e6 + 50)), 12);
    // source: initial-value theorem (charge sharing), C1/(C1 + C2) = 1/n, × the 10x channel
    expect(h.predicted.spikeV).toBeCloseTo(2 * 10 * (c1 / (c1 + c2)), 9);
    // τ = (R_tip ∥ 50 Ω)(C1 + C2)
    expect(h.estimates?.spikeTimeConstantS as number).toBeCloseTo(((9e6 * 50) / (9e6 + 50)) * (c1 + c2), 15);
    expect(result.verdict).toBe('measurement-error');
  });
});

describe('needles on a passive probe into 50 Ω, as read', () => {
  // a 10x probe with 10 pF at the tip, compensated: C1 = n·C_tip/(n − 1), C2 = n·C_tip (DESIGN, termination)
  const c1 = (10 * 10e-12) / 9;
  const c2 = 10 * 10e-12;
  const tauS = ((9e6 * 50) / (9e6 + 50)) * (c1 + c2);
  const square = (scopeHz: number, observedV: number): DiagnosisInput => ({
    probe: { attenuation: 10, tipCapacitanceF: 10e-12, tipResistanceOhm: 9e6 },
    scope: { attenuationSetting: 10, inputResistanceOhm: 50, bandwidthHz: scopeHz },
    signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' },
    observed: { amplitudeV: observedV },
  });

  /**
   * Peak of a jump decaying with τ, seen through an edge of 10–90 % time t_r: a ramp of t_r/0.8
   * convolved, by sums over a fine grid, with e^(−t/τ). source: convolution of the edge with the
   * divider's step response (charge sharing, then the R·C decay), done numerically here.
   */
  function needleShare(riseS: number): number {
    const rampS = riseS / 0.8;
    const dt = rampS / 1000;
    let peak = 0;
    for (let t = 0; t < rampS + 5 * tauS; t += 20 * dt) {
      let sum = 0;
      for (let s = 0; s < Math.min(t, rampS); s += dt) sum += Math.exp(-(t - s) / tauS) * (dt / rampS);
      peak = Math.max(peak, sum);
    }
    return peak;
  }

  it('should read an amplitude as tall as the step as the needles, not as a true trace', () => {
    // a 1 GHz chain (0.35 ns) barely cuts a 5.6 ns needle: on the screen's scale it stands about the full 1 V
    const result = diagnose(square(1e9, 0.97));
    expect(result.verdict).toBe('measurement-error');
    const top = result.hypotheses[0];
    expect(top.cause).toBe('termination-mismatch');
    // source: single-pole rise time 0.35/BW, then the numerical needle above
    expect(top.predicted.spikeV!).toBeCloseTo(needleShare(Math.log(9) / (2 * Math.PI * 1e9)), 2);
    expect(result.hypotheses.find((h) => h.cause === 'faithful')!.fits).toBe(false);
  });

  it('should shrink the needles through a slow chain, and read a peak to peak of two of them', () => {
    // 50 MHz: a 7 ns edge on a 5.6 ns needle leaves about half of it
    const share = needleShare(Math.log(9) / (2 * Math.PI * 50e6));
    expect(share).toBeGreaterThan(0.45);
    expect(share).toBeLessThan(0.55);
    const one = diagnose(square(50e6, share));
    expect(one.hypotheses[0].predicted.spikeV!).toBeCloseTo(share, 2);
    expect(one.verdict).toBe('measurement-error');
    // up at one edge, down at the next: a scope's peak to peak of the needle train
    expect(diagnose(square(50e6, 2 * share)).verdict).toBe('measurement-error');
    // a full 1 V read there is neither one needle nor two, and no true trace either
    expect(diagnose(square(50e6, 1.5 * share)).verdict).toBe('unexplained');
  });

  it('should not take a needle for the amplitude where the record says what the setup allows', () => {
    // the flat level is what rules a true trace out: the faithful reading is charged even when
    // its amplitude equals the needles' height
    const result = diagnose(square(1e9, 0.97));
    const faithful = result.hypotheses.find((h) => h.cause === 'faithful')!;
    expect(faithful.explanation).toMatch(/a recorded value must be wrong/);
  });
});
