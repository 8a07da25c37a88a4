import { describe, expect, it } from 'vitest';
import { diagnose } from '../../shared/diagnosis/ranker';
import { CHI_SQUARE_95, decideVerdict, fitGate } from '../../shared/diagnosis/verdict';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';

// source: single-pole rise time t_r = ln 9/(2π·BW) ≈ 0.35/BW (RC step response 1 − e^(−t/τ))
const riseOf = (bandwidthHz: number) => Math.log(9) / (2 * Math.PI * bandwidthHz);
// source: Rosa/Grover straight round wire, L = (μ0·l/2π)(ln(2l/r) − 3/4)
const wireH = (lengthM: number, radiusM = 0.25e-3) => ((4e-7 * Math.PI * lengthM) / (2 * Math.PI)) * (Math.log((2 * lengthM) / radiusM) - 0.75);

describe('the fit gate', () => {
  it('should use the 95 % points of chi-square', () => {
    // source: NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.4, upper-tail critical values
    expect(CHI_SQUARE_95.slice(0, 4)).toEqual([3.841, 5.991, 7.815, 9.488]);
    expect(fitGate(1)).toBe(3.841);
    // Wilson–Hilferty beyond the table; χ²₀.₉₅(15) = 24.996 in the same handbook table
    expect(fitGate(15)).toBeCloseTo(24.996, 0);
  });

  it('should decide faithful, measurement-error and unexplained from the fits', () => {
    const base = { observed: true, setupPredictsError: false };
    expect(decideVerdict({ ...base, faithfulFits: true, faithfulChiSquare: 1, fittingCauseChiSquares: [0.5] })).toBe('faithful');
    expect(decideVerdict({ ...base, faithfulFits: true, faithfulChiSquare: 3.8, fittingCauseChiSquares: [] })).toBe('faithful');
    expect(decideVerdict({ ...base, faithfulFits: false, faithfulChiSquare: 50, fittingCauseChiSquares: [0.1] })).toBe('measurement-error');
    expect(decideVerdict({ ...base, faithfulFits: false, faithfulChiSquare: 50, fittingCauseChiSquares: [] })).toBe('unexplained');
  });
});

describe('verdicts', () => {
  it('should call a consistent setup faithful and put the faithful hypothesis first', () => {
    // 10x probe on a 10x channel, ground spring, 500 MHz scope, observed = expected amplitude
    // and the chain's own rise time (a probe matched to its scope adds no stage: DESIGN.md)
    const result = diagnose({
      probe: { attenuation: 10, groundKind: 'spring' },
      scope: { attenuationSetting: 10, bandwidthHz: 500e6, inputResistanceOhm: 1e6 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 10e6, kind: 'square' },
      observed: { amplitudeV: 3.3, riseTimeS: riseOf(500e6), overshootPct: 0 },
    });
    expect(result.verdict).toBe('faithful');
    expect(result.hypotheses[0].cause).toBe('faithful');
    expect(result.hypotheses[0].fits).toBe(true);
    expect(result.hypotheses[0].causes).toEqual(['faithful']);
    expect(result.tags).toEqual([]);
    for (const h of result.hypotheses.slice(1)) expect(h.likelihood).toBeLessThanOrEqual(result.hypotheses[0].likelihood);
  });

  it('should call a DC level 1.7 times too high with every setting right unexplained', () => {
    // no first-generation model raises a DC level: dividers only divide (voltage-divider rule)
    const result = diagnose({
      probe: { attenuation: 10, groundKind: 'spring' },
      scope: { attenuationSetting: 10, inputResistanceOhm: 1e6 },
      circuit: { sourceResistanceOhm: 10 },
      signal: { expectedAmplitudeV: 5, kind: 'dc' },
      observed: { amplitudeV: 8.5 },
    });
    expect(result.verdict).toBe('unexplained');
    expect(result.hypotheses.some((h) => h.fits)).toBe(false);
    expect(result.tags).toEqual([]);
    // residual of the faithful reading is ln 1.7
    expect(result.hypotheses.find((h) => h.cause === 'faithful')?.residual).toBeCloseTo(Math.log(1.7), 9);
  });

  it('should not fit ground-lead ringing at 40 MHz with a 1 cm spring recorded', () => {
    const result = diagnose({
      probe: { attenuation: 10, groundKind: 'spring', groundLeadM: 0.01, tipCapacitanceF: 12e-12 },
      scope: { attenuationSetting: 10, bandwidthHz: 500e6 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' },
      observed: { amplitudeV: 1, ringingFrequencyHz: 40e6 },
    });
    const lead = result.hypotheses.filter((h) => h.causes.includes('ground-lead'));
    for (const h of lead) expect(h.fits).toBe(false);
    expect(result.tags).not.toContain('long-ground-lead');
    expect(result.tags).not.toContain('ground-lead');
    expect(result.verdict).not.toBe('faithful');
  });

  it('should not turn a 21 Hz "ringing" into a megahenry lead that fits', () => {
    const result = diagnose({ probe: { attenuation: 10 }, signal: { expectedAmplitudeV: 1, frequencyHz: 1 }, observed: { ringingFrequencyHz: 21 } });
    const lead = result.hypotheses.find((h) => h.cause === 'ground-lead')!;
    expect(lead.fits).toBe(false);
    // L = 1/((2πf)²C) ≈ 4.8 MH for 21 Hz on 12 pF; no plausible lead (≤ 1 m) reaches it
    const fitted = lead.estimates?.fittedInductanceH;
    if (typeof fitted === 'number') expect(fitted).toBeLessThanOrEqual(wireH(1) * 1.0001);
    expect(result.tags).not.toContain('long-ground-lead');
  });
});

describe('combined causes', () => {
  it('should combine attenuation mismatch and ground-lead ringing for a 10x probe read at 1x on a 15 cm lead', () => {
    const c = 12e-12;
    const rs = 25;
    const l = wireH(0.15);
    // source: series RLC, f_d = f_n·√(1 − ζ²), ζ = (R/2)√(C/L)
    const zeta = (rs / 2) * Math.sqrt(c / l);
    const ringHz = Math.sqrt(1 - zeta ** 2) / (2 * Math.PI * Math.sqrt(l * c));
    const input: DiagnosisInput = {
      probe: { attenuation: 10, groundLeadM: 0.15, groundKind: 'clip-lead', tipCapacitanceF: c },
      scope: { attenuationSetting: 1, bandwidthHz: 500e6 },
      circuit: { sourceResistanceOhm: rs },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' },
      // shown = true × setting ÷ actual = 1 V × 1/10 (definition of probe attenuation)
      observed: { amplitudeV: 0.1, ringingFrequencyHz: ringHz * 1.03 },
    };
    const result = diagnose(input);
    const top = result.hypotheses[0];
    expect([...top.causes].sort()).toEqual(['attenuation-mismatch', 'ground-lead']);
    expect(top.cause).toBe(top.causes[0]);
    expect(top.fits).toBe(true);
    expect(result.verdict).toBe('measurement-error');
    expect(top.predicted.amplitudeV).toBeCloseTo(0.1, 9);
    expect(Math.abs((top.predicted.ringingFrequencyHz as number) / ringHz - 1)).toBeLessThan(1e-3);
    expect(result.tags).toEqual(expect.arrayContaining(['attenuation-mismatch', 'ground-lead']));
    const single = result.hypotheses.find((h) => h.causes.length === 1 && h.cause === 'attenuation-mismatch')!;
    expect(single.fits).toBe(false);
  });

  it('should not prefer a combination when one cause already explains everything seen', () => {
    const result = diagnose({
      probe: { attenuation: 10, groundKind: 'spring' },
      scope: { attenuationSetting: 1, bandwidthHz: 500e6 },
      signal: { expectedAmplitudeV: 3.3, kind: 'dc' },
      observed: { amplitudeV: 0.33 },
    });
    expect(result.hypotheses[0].causes).toEqual(['attenuation-mismatch']);
  });

  it('should explain amplitude, edges and loading at once by a probe switched to 1x', () => {
    // recorded: 10x probe on a 10x channel; the probe's switch really is at 1x, so the channel
    // shows 10× (true × 10 ÷ 1), with a 1x probe's ~100 pF load and few-MHz bandwidth (common practice)
    const sourceOhm = 1000;
    const loadS = Math.log(9) * ((sourceOhm * 1e6) / (sourceOhm + 1e6)) * 100e-12; // ln 9·(R_s∥R_in)·C
    const riseS = Math.sqrt(5e-9 ** 2 + riseOf(6e6) ** 2 + riseOf(200e6) ** 2 + loadS ** 2);
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, bandwidthHz: 200e6, inputCapacitanceF: 15e-12 },
      circuit: { sourceResistanceOhm: sourceOhm },
      signal: { expectedAmplitudeV: 1, frequencyHz: 100e3, kind: 'square', riseTimeS: 5e-9 },
      observed: { amplitudeV: 10, riseTimeS: riseS },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('attenuation-mismatch');
    expect(top.fits).toBe(true);
    expect(Math.abs((top.predicted.riseTimeS as number) / riseS - 1)).toBeLessThan(0.05);
    expect(top.explanation).toMatch(/load/);
    // one fault acting as three causes: the 1x chain (~58 ns) dwarfs the 200 MHz scope's 1.7 ns,
    // and the 1 kΩ·100 pF load (ln 9·RC ≈ 220 ns) dominates the edge
    expect(top.causes).toEqual(['attenuation-mismatch', 'bandwidth', 'loading']);
    expect(result.tags).toEqual(expect.arrayContaining(['1x-at-10x', 'attenuation-mismatch', 'bandwidth', 'loading']));
  });
});

describe('compensation at high frequency', () => {
  it('should rank compensation, not ground-lead, for a 12 MHz clock read 8 % high with flat tops', () => {
    // a square wave far faster than τ = (R1∥R2)(C1+C2) ≈ 0.12 ms only sees C1/(C1+C2)
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, bandwidthHz: 500e6 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 12e6, kind: 'square' },
      observed: { amplitudeV: 3.3 * 1.08, overshootPct: 0 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('compensation');
    expect(top.fits).toBe(true);
    expect(top.estimates?.state).toBe('over-compensated');
    // jump = 1.08 × settle = 1.08 × R2/(R1 + R2) (compensated-divider analysis)
    expect(top.estimates?.jumpRatio as number).toBeCloseTo(1.08 * 0.1, 3);
    expect(result.tags).not.toContain('ground-lead');
  });

  it('should predict under-compensation when the probe moves to a scope with more input capacitance', () => {
    // C1 = n·C_tip/(n−1), C2 = n·C_tip for a 12 pF 10x probe; +5 pF on the new input adds to C2:
    // the edge jumps to C1/(C1 + C2 + 5 pF) instead of C1/(C1 + C2)
    const c1 = (10 * 12e-12) / 9;
    const c2 = 10 * 12e-12;
    const k = (c1 + c2) / (c1 + c2 + 5e-12) - 1;
    const result = diagnose({
      probe: { attenuation: 10, tipCapacitanceF: 12e-12 },
      scope: { attenuationSetting: 10, inputCapacitanceF: 20e-12 },
      signal: { expectedAmplitudeV: 1, kind: 'pulse' },
    });
    const comp = result.hypotheses.find((h) => h.cause === 'compensation')!;
    expect(comp.predicted.overshootPct).toBeCloseTo(100 * k, 6);
    expect(comp.explanation).toMatch(/adjusted on a 15 pF input/);
  });
});

describe('bandwidth chain', () => {
  const base = { signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' as const } };
  const faithfulRise = (input: DiagnosisInput) => diagnose(input).hypotheses.find((h) => h.cause === 'faithful')!.predicted.riseTimeS as number;

  it('should treat a blank probe bandwidth as matched to the scope, not a second stage', () => {
    expect(faithfulRise({ ...base, scope: { bandwidthHz: 500e6 } })).toBeCloseTo(riseOf(500e6), 15);
  });

  it("should use the scope's recorded rise time instead of 0.35/BW", () => {
    expect(faithfulRise({ ...base, scope: { bandwidthHz: 500e6, riseTimeS: 0.8e-9 } })).toBeCloseTo(0.8e-9, 15);
  });

  it('should keep a 1x probe and a bandwidth-limit filter as stages of their own', () => {
    // source: root-sum-square rise-time rule; common practice: 1x passive probes reach a few MHz
    const expected = Math.sqrt(riseOf(6e6) ** 2 + riseOf(500e6) ** 2 + riseOf(20e6) ** 2);
    expect(faithfulRise({ ...base, probe: { attenuation: 1 }, scope: { bandwidthHz: 500e6, bandwidthLimitHz: 20e6 } })).toBeCloseTo(expected, 15);
  });
});

describe('a chain that slows a recorded edge', () => {
  it('should call a 1 ns edge shown at 3.6 ns by a 100 MHz scope a bandwidth error, not a true trace', () => {
    // source: root-sum-square rise-time rule, √(1 ns² + (0.35/100 MHz)²) ≈ 3.64 ns
    const shown = Math.sqrt(1e-9 ** 2 + riseOf(100e6) ** 2);
    const result = diagnose({
      probe: { attenuation: 10, groundKind: 'spring' },
      scope: { attenuationSetting: 10, bandwidthHz: 100e6 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square', riseTimeS: 1e-9 },
      observed: { amplitudeV: 1, riseTimeS: shown },
    });
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].cause).toBe('bandwidth');
  });

  it('should keep the trace true when a fast chain barely touches a recorded edge', () => {
    const shown = Math.sqrt(2e-9 ** 2 + riseOf(500e6) ** 2);
    const result = diagnose({
      probe: { attenuation: 10, groundKind: 'spring' },
      scope: { attenuationSetting: 10, bandwidthHz: 500e6 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square', riseTimeS: 2e-9 },
      observed: { amplitudeV: 1, riseTimeS: shown, overshootPct: 0 },
    });
    expect(result.verdict).toBe('faithful');
  });
});

describe('an observation the recorded setup itself rules out', () => {
  const squareAt = (amplitudeV: number): DiagnosisInput['signal'] => ({ expectedAmplitudeV: amplitudeV, frequencyHz: 1e3, kind: 'square' });

  it('should not call the trace true when a 10x probe is recorded on a 1x channel and the true amplitude was seen', () => {
    // common practice: the scope shows true × setting ÷ probe ratio, so 1 V reads 100 mV
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, signal: squareAt(1), observed: { amplitudeV: 1 } });
    expect(result.verdict).toBe('unexplained');
    const faithful = result.hypotheses.find((h) => h.cause === 'faithful')!;
    expect(faithful.fits).toBe(false);
    expect(faithful.explanation).toMatch(/100 mV instead of 1 V/);
    expect(faithful.explanation).not.toMatch(/probe ratio matches the channel/);
    // and no cause that leaves the recorded ratio out fits either (a ground lead adds ringing, not a factor of ten)
    expect(result.hypotheses.filter((h) => h.fits)).toEqual([]);
    expect(result.tags).toEqual([]);
  });

  it('should still diagnose the mismatch when what was seen is what the record predicts', () => {
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, signal: squareAt(1), observed: { amplitudeV: 0.1 } });
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].cause).toBe('attenuation-mismatch');
  });

  it('should not call a DC level true through a passive 10x probe recorded into 50 Ω', () => {
    // source: the DC divider (R_tip + 50 Ω)/50 Ω = 180,001 for a 9 MΩ tip resistor (DESIGN.md, termination mismatch)
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 10, inputResistanceOhm: 50 }, signal: { expectedAmplitudeV: 5, kind: 'dc' }, observed: { amplitudeV: 5 } });
    expect(result.verdict).toBe('unexplained');
  });

  it('should take two models of one divider as one effect: a generator set for a high impedance into a recorded 50 Ω input', () => {
    // source: a 50 Ω source into a 50 Ω load keeps R_L/(R_L + R_out) = 1/2 of its EMF; set for a
    // high impedance, the EMF is the set amplitude, so 2 V set reads 1 V
    const result = diagnose({
      probe: { attenuation: 1 },
      scope: { attenuationSetting: 1, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 50, loadResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 2, frequencyHz: 1e6, kind: 'sine', generatorLoad: 'high-z' },
      observed: { amplitudeV: 1 },
    });
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses.filter((h) => h.fits).map((h) => h.cause)).toEqual(expect.arrayContaining(['generator-load', 'termination-mismatch']));
  });

  it('should call the set amplitude true from a generator set for 50 Ω into a recorded 50 Ω input', () => {
    // source: a generator set for a 50 Ω load raises its EMF to twice the setting, and its 50 Ω output into
    // 50 Ω keeps half of that: the load sees the set amplitude. A 1x probe has no divider to mismatch.
    const result = diagnose({
      probe: { attenuation: 1 },
      scope: { attenuationSetting: 1, inputResistanceOhm: 50 },
      circuit: { sourceResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'sine', generatorLoad: '50-ohm' },
      observed: { amplitudeV: 1 },
    });
    expect(result.verdict).toBe('faithful');
  });

  it('should not take an assumed value for a recorded one: a generator set for 50 Ω with neither its load nor the input recorded', () => {
    // the engine assumes a 1 MΩ input (and so 2x), but the generator may drive an unrecorded 50 Ω load: nothing contradicts a true trace
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 10 }, signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'sine', generatorLoad: '50-ohm' }, observed: { amplitudeV: 1 } });
    expect(result.verdict).toBe('faithful');
  });

  it('should let AC coupling explain a DC level read near zero, and not one read whole', () => {
    // common practice: AC coupling blocks a DC level, so the trace sits at 0 V
    const dcLevel = (amplitudeV: number, acCornerHz?: number): DiagnosisInput => ({ probe: { attenuation: 10 }, scope: { attenuationSetting: 10, coupling: 'ac', acCornerHz }, signal: { expectedAmplitudeV: 12, kind: 'dc' }, observed: { amplitudeV } });
    const nearZero = diagnose(dcLevel(0.05));
    expect(nearZero.verdict).toBe('measurement-error');
    expect(nearZero.hypotheses[0].cause).toBe('ac-coupling');
    const whole = diagnose(dcLevel(12));
    expect(whole.hypotheses.find((h) => h.cause === 'ac-coupling')!.fits).toBe(false);
    expect(whole.tags).not.toContain('dc-level-lost');
    // with the corner recorded the record itself says the level cannot show
    expect(diagnose(dcLevel(12, 10)).verdict).toBe('unexplained');
  });

  it('should judge the screen window only with the offset recorded', () => {
    // common practice: 8 divisions of 1 V about a 0 V centre show −4 V to +4 V, so a 0–5 V square runs off
    // the top; centred at 2.5 V they show −1.5 V to 6.5 V and it fits
    const base: DiagnosisInput = { probe: { attenuation: 10 }, scope: { attenuationSetting: 10, voltsPerDiv: 1 }, signal: squareAt(5), observed: { amplitudeV: 5, clipped: false } };
    expect(diagnose(base).verdict).toBe('faithful');
    expect(diagnose({ ...base, scope: { ...base.scope, offsetV: 0 } }).verdict).toBe('unexplained');
    expect(diagnose({ ...base, scope: { ...base.scope, offsetV: 2.5 } }).verdict).toBe('faithful');
  });
});

describe('tags name only what explains the trace', () => {
  it('should tag no cause on a trace it calls true, however an unrecorded lead would ring', () => {
    // common practice: a 10x probe on a 10x channel shows the 5 V square at 5 V; no lead, no overshoot recorded
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10 },
      signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
      observed: { amplitudeV: 5 },
    });
    expect(result.verdict).toBe('faithful');
    expect(result.tags).toEqual([]);
    // the typical 15 cm lead still fits (nothing contradicts it) and is listed, untagged
    expect(result.hypotheses.find((h) => h.cause === 'ground-lead')!.fits).toBe(true);
  });

  it('should tag the cause that explains the corners, not a lead that merely fits as well as a true trace', () => {
    // source: compensated divider; corners 3 % short of the settled level on a 1 kHz square mean a trimmer off by 3 %
    const result = diagnose({
      probe: { attenuation: 10, tipCapacitanceF: 11e-12 },
      scope: { attenuationSetting: 10, inputCapacitanceF: 20e-12, bandwidthHz: 100e6 },
      signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
      observed: { amplitudeV: 5, overshootPct: -3 },
    });
    expect(result.verdict).toBe('measurement-error');
    expect(result.tags).toContain('compensation');
    expect(result.tags).not.toContain('ground-lead');
  });

  it('should, with nothing observed, predict an error only from what was recorded, not from a typical lead', () => {
    const plain: DiagnosisInput = {
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, bandwidthHz: 1e9 },
      signal: { expectedAmplitudeV: 3.3, frequencyHz: 10e6, riseTimeS: 1e-9, kind: 'square' },
    };
    const typical = diagnose(plain);
    expect(typical.verdict).toBe('faithful');
    expect(typical.tags).toEqual([]);
    // a recorded 20 cm lead with 10 pF rings near 1/(2π√(LC)) on a 1 ns edge: the record predicts it
    const recorded = diagnose({ ...plain, probe: { attenuation: 10, groundLeadM: 0.2, tipCapacitanceF: 10e-12 } });
    expect(recorded.verdict).toBe('measurement-error');
    expect(recorded.tags).toContain('ground-lead');
    const ringHz = 1 / (2 * Math.PI * Math.sqrt(wireH(0.2) * 10e-12));
    const lead = recorded.hypotheses.find((h) => h.cause === 'ground-lead')!;
    expect(Math.abs(Math.log(lead.predicted.ringingFrequencyHz! / ringHz))).toBeLessThan(0.15);
    // common practice: a 10x probe on a 1x channel shows a tenth, recorded or not observed
    const mismatch = diagnose({ ...plain, scope: { attenuationSetting: 1, bandwidthHz: 1e9 } });
    expect(mismatch.verdict).toBe('measurement-error');
    expect(mismatch.tags).toEqual(expect.arrayContaining(['attenuation-mismatch', '10x-at-1x']));
    expect(mismatch.tags).not.toContain('ground-lead');
  });
});

describe('a recorded assertion charged as one test', () => {
  it('should not let the agreeing readings of an assertion widen the gate for the true trace', () => {
    // source: single-pole rise time 0.35/BW and root-sum-square stages: a 300 MHz scope shows a
    // 1 ns edge as √(1² + 1.17²) ≈ 1.54 ns; 1.5 ns was read, the amplitude right
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, bandwidthHz: 300e6 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 10e6, riseTimeS: 1e-9, kind: 'square' },
      observed: { amplitudeV: 1, riseTimeS: 1.5e-9 },
    });
    const shownS = Math.hypot(1e-9, riseOf(300e6));
    expect(shownS).toBeGreaterThan(1.5e-9);
    expect(shownS).toBeLessThan(1.6e-9);
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].cause).toBe('bandwidth');
    // the true trace misses the reading by 2σ and the record by 2σ more: two tests failed, not four quantities compared
    const faithful = result.hypotheses.find((h) => h.cause === 'faithful')!;
    expect(faithful.ruledOutBy).toEqual(['bandwidth']);
    expect(faithful.fits).toBe(false);
  });
});

describe('a fitted cause beside a recorded one', () => {
  it('should not let a value fitted to the reading stand in for the recorded cause that explains it', () => {
    // common practice: a 10x probe on a 1x channel shows a tenth. A 90 MΩ source would also
    // divide 12 V to 1.2 V against the probe's 10 MΩ, but the recorded mismatch acts on top of
    // any such load: loading alone would need the record to be wrong
    const result = diagnose({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 1 },
      signal: { expectedAmplitudeV: 12, kind: 'dc' },
      observed: { amplitudeV: 1.2 },
    });
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].cause).toBe('attenuation-mismatch');
    const loading = result.hypotheses.find((h) => h.cause === 'loading')!;
    expect(loading.fits).toBe(false);
    expect(loading.ruledOutBy).toEqual(['attenuation-mismatch']);
    expect(result.tags).not.toContain('loading');
  });
});

