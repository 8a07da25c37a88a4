import { describe, expect, it } from 'vitest';
import { abs, add, complex, divide, multiply, type Complex } from 'mathjs';
import {
  balancedDividerOf,
  balancingTipCapacitanceF,
  compensationFrequencyResponse,
  compensationStepResponse,
  cornerOvershootPct,
  dividerLevels,
  tipCapacitanceForOvershootF,
} from '../../shared/diagnosis/compensation';
import { resolveSetup } from '../../shared/diagnosis/defaults';
import { diagnose } from '../../shared/diagnosis/ranker';

// common practice: 10x probe, 9 MΩ tip over a 1 MΩ input with about 120 pF at the scope end
const balanced = { tipResistanceOhm: 9e6, tipCapacitanceF: 120e-12 / 9, inputResistanceOhm: 1e6, inputCapacitanceF: 120e-12 };
const over = { ...balanced, tipCapacitanceF: 20e-12 };

function mathjsDivider(p: typeof balanced, f: number): number {
  const section = (r: number, c: number) => {
    const zr = complex(r, 0);
    const zc = complex(0, -1 / (2 * Math.PI * f * c));
    return divide(multiply(zr, zc), add(zr, zc)) as Complex;
  };
  const z1 = section(p.tipResistanceOhm, p.tipCapacitanceF);
  const z2 = section(p.inputResistanceOhm, p.inputCapacitanceF);
  return abs(divide(z2, add(z1, z2)) as Complex) as unknown as number;
}

describe('compensation model', () => {
  it('should be flat when R1·C1 = R2·C2', () => {
    // source: compensated attenuator condition R1C1 = R2C2
    const { jump, settle } = dividerLevels(balanced);
    expect(jump).toBeCloseTo(0.1, 12);
    expect(settle).toBeCloseTo(0.1, 12);
    for (const v of compensationStepResponse(balanced, [0, 1e-6, 1e-4, 1e-2])) expect(v).toBeCloseTo(0.1, 12);
    expect(cornerOvershootPct(balanced)).toBeCloseTo(0, 9);
  });

  it('should jump to C1/(C1+C2) and settle to R2/(R1+R2) when over-compensated', () => {
    // source: charge sharing between C1 and C2 at the edge; resistive divider at DC
    const { jump, settle, timeConstantS } = dividerLevels(over);
    expect(jump).toBeCloseTo(20 / 140, 12);
    expect(settle).toBeCloseTo(0.1, 12);
    // τ = (R1∥R2)(C1+C2) = 900 kΩ × 140 pF
    expect(timeConstantS).toBeCloseTo(900e3 * 140e-12, 15);
    expect(cornerOvershootPct(over)).toBeCloseTo((20 / 140 / 0.1 - 1) * 100, 9);
  });

  it('should decay to 1/e of the step between the levels after one τ', () => {
    const { jump, settle, timeConstantS } = dividerLevels(over);
    const [before, atZero, atTau, late] = compensationStepResponse(over, [-1e-9, 0, timeConstantS, 50 * timeConstantS]);
    expect(before).toBe(0);
    expect(atZero).toBeCloseTo(jump, 12);
    expect(atTau).toBeCloseTo(settle + (jump - settle) / Math.E, 12);
    expect(late).toBeCloseTo(settle, 12);
  });

  it('should match mathjs for the frequency response, from R2/(R1+R2) up to C1/(C1+C2)', () => {
    // source: mathjs complex arithmetic for Z2/(Z1+Z2), Zi = Ri ∥ 1/(jωCi)
    const freqs = [10, 1e3, 10e3, 1e6];
    const ours = compensationFrequencyResponse(over, freqs);
    freqs.forEach((f, i) => expect(ours[i]).toBeCloseTo(mathjsDivider(over, f), 12));
    expect(compensationFrequencyResponse(over, [0])[0]).toBeCloseTo(0.1, 12);
    expect(ours[3]).toBeCloseTo(20 / 140, 4);
    for (const m of compensationFrequencyResponse(balanced, freqs)) expect(m).toBeCloseTo(0.1, 12);
  });

  it('should infer C1 back from the corner overshoot', () => {
    const rest = { tipResistanceOhm: 9e6, inputResistanceOhm: 1e6, inputCapacitanceF: 120e-12 };
    expect(tipCapacitanceForOvershootF(rest, cornerOvershootPct(over))).toBeCloseTo(20e-12, 20);
    expect(balancingTipCapacitanceF(rest)).toBeCloseTo(120e-12 / 9, 20);
    expect(tipCapacitanceForOvershootF(rest, 900)).toBeUndefined();
  });

  it('should rebuild the balanced divider from the tip capacitance a data sheet gives', () => {
    // C1 and C2 in series make the tip capacitance: 13.3 pF in series with 120 pF is 12 pF
    const { setup } = resolveSetup({ probe: { attenuation: 10, tipCapacitanceF: 12e-12 } });
    const d = balancedDividerOf(setup);
    expect(d.inputCapacitanceF).toBeCloseTo(120e-12, 20);
    expect(d.tipCapacitanceF).toBeCloseTo(120e-12 / 9, 20);
    expect((d.tipCapacitanceF * d.inputCapacitanceF) / (d.tipCapacitanceF + d.inputCapacitanceF)).toBeCloseTo(12e-12, 20);
  });
});

describe('compensation in diagnose', () => {
  const square = { expectedAmplitudeV: 1, frequencyHz: 1e3, kind: 'square' as const };

  it('should call spiking corners over-compensated and say to reduce', () => {
    const result = diagnose({ probe: { attenuation: 10 }, signal: square, observed: { amplitudeV: 1, overshootPct: 12 } });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('compensation');
    expect(top.estimates?.adjust).toBe('reduce');
    // the fit weighs the corner against the amplitude it also predicts; within 0.5 points of 12 %
    expect(Math.abs((top.predicted.overshootPct as number) - 12)).toBeLessThan(0.5);
    expect(result.tags).toEqual(expect.arrayContaining(['compensation', 'over-compensated']));
  });

  it('should call rounded corners under-compensated and say to increase', () => {
    const result = diagnose({ probe: { attenuation: 10 }, signal: square, observed: { amplitudeV: 1, overshootPct: -15 } });
    expect(result.hypotheses[0].cause).toBe('compensation');
    expect(result.hypotheses[0].estimates?.adjust).toBe('increase');
    expect(result.tags).toContain('under-compensated');
  });

  it('should not offer compensation for a 1x probe', () => {
    const result = diagnose({ probe: { attenuation: 1 }, signal: square, observed: { overshootPct: 12 } });
    const comp = result.hypotheses.find((h) => h.cause === 'compensation');
    expect(comp?.explanation).toMatch(/no compensation trimmer/);
    expect(result.hypotheses[0].cause).not.toBe('compensation');
  });
});

describe('compensation only where there is a trimmer', () => {
  // fact of the trade: the compensation trimmer belongs to a passive divider probe; active,
  // differential and current probes have their input network set where they are built
  const square = { signal: { expectedAmplitudeV: 1, frequencyHz: 1e3, kind: 'square' as const }, observed: { amplitudeV: 1, overshootPct: 20 } };

  it('should offer a trimmer error for corners spiking 20 % on a passive 10x probe', () => {
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 10, bandwidthHz: 100e6 }, ...square });
    expect(result.hypotheses.some((h) => h.fits && h.causes.includes('compensation'))).toBe(true);
  });

  it.each(['active', 'differential', 'current'] as const)('should never blame a trimmer when the probe is %s', (kind) => {
    const result = diagnose({ probe: { kind, attenuation: 10, groundKind: 'spring' }, scope: { attenuationSetting: 10, bandwidthHz: 1e9 }, ...square });
    expect(result.hypotheses.filter((h) => h.fits && h.causes.includes('compensation'))).toEqual([]);
    expect(result.tags).not.toContain('compensation');
    const own = result.hypotheses.find((h) => h.causes.length === 1 && h.cause === 'compensation')!;
    expect(own.explanation).toMatch(new RegExp(`^An? ${kind} probe has no compensation trimmer`));
  });
});
