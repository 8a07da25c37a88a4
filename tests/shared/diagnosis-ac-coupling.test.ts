import { describe, expect, it } from 'vitest';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import { diagnose } from '../../shared/diagnosis/ranker';
import {
  assessAcCoupling,
  cornerForTiltHz,
  effectiveAcCornerHz,
  highPassMagnitude,
  squareWaveTiltFraction,
} from '../../shared/diagnosis/ac-coupling';

const run = (input: DiagnosisInput) => assessAcCoupling({ setup: resolveSetup(input).setup, observed: observedOf(input) });

/**
 * Independent of the closed form: steps a single-pole RC high-pass exactly from edge to edge
 * (v decays by e^(−Δt/τ) between edges, each edge adds the input's jump) until the levels
 * repeat, and returns the droop across the last top as a fraction of the step.
 */
function simulatedTilt(frequencyHz: number, cornerHz: number): number {
  const tauS = 1 / (2 * Math.PI * cornerHz);
  const decay = Math.exp(-1 / (2 * frequencyHz) / tauS);
  let v = 0;
  let topStart = 0;
  let topEnd = 0;
  for (let cycle = 0; cycle < 20000; cycle++) {
    v += 1; // rising edge
    topStart = v;
    v *= decay;
    topEnd = v;
    v -= 1; // falling edge
    v *= decay;
  }
  return topStart - topEnd;
}

describe('AC coupling', () => {
  it('should lower the corner by R_in/(R_tip + R_in) behind a 10x probe', () => {
    // source: first-order RC high-pass f_c = 1/(2πRC); the tip resistor adds to R: 10 Hz × 1 MΩ/10 MΩ = 1 Hz
    expect(effectiveAcCornerHz(10, 1e6, 9e6)).toBeCloseTo(1, 12);
    expect(effectiveAcCornerHz(10, 1e6, 0)).toBe(10);
  });

  it('should pass 1/√2 at the corner and f/√(f² + f_c²) elsewhere', () => {
    // source: first-order high-pass H = jωτ/(1 + jωτ); −3 dB at f_c
    expect(highPassMagnitude(10, 10)).toBeCloseTo(Math.SQRT1_2, 12);
    expect(highPassMagnitude(1, 10)).toBeCloseTo(1 / Math.sqrt(101), 12);
  });

  it.each([
    [100, 10],
    [50, 1],
    [20, 10],
    [1e3, 0.5],
  ])('should droop a %d Hz square through a %d Hz high-pass as the stepped RC does', (f, fc) => {
    // source: single-pole RC high-pass steady state, simulated edge by edge above
    expect(squareWaveTiltFraction(f, fc)).toBeCloseTo(simulatedTilt(f, fc), 9);
  });

  it('should approach the handbook tilt π·f_c/f of the half amplitude for f ≫ f_c', () => {
    // source: common practice (pulse-amplifier low-frequency tilt ≈ π f_L/f of the peak, half the step)
    expect(squareWaveTiltFraction(1e3, 1) / ((Math.PI * 1) / 1e3 / 2)).toBeCloseTo(1, 5);
  });

  it('should invert the tilt to the corner', () => {
    // worked by hand: 20 % at 100 Hz → f_c = 200·atanh(0.2)/π = 12.906 Hz
    expect(cornerForTiltHz(0.2, 100)).toBeCloseTo(12.906, 3);
  });

  it('should predict the droop of a 50 Hz square on an AC-coupled channel behind a 10x probe', () => {
    // worked example (Help page): 10 Hz corner, 9 MΩ + 1 MΩ → 1 Hz; tanh(π·1/(2·50)) = 3.1406 %
    const [c] = run({ probe: { attenuation: 10 }, scope: { coupling: 'ac', acCornerHz: 10 }, circuit: { sourceResistanceOhm: 0 }, signal: { frequencyHz: 50, kind: 'square', expectedAmplitudeV: 5 } });
    expect(c.predicted.tiltPct).toBeCloseTo(3.1406, 3);
    expect(c.predicted.amplitudeV).toBe(5);
    expect(c.detailTags).toContain('ac-coupling-droop');
  });

  it('should list the corner it assumed when none is recorded', () => {
    const [c] = run({ probe: { attenuation: 1 }, scope: { coupling: 'ac' }, signal: { frequencyHz: 100, kind: 'square' } });
    expect(c.estimates?.assumedAcCornerHz).toBe(10);
    expect(c.explanation).toMatch(/not recorded/);
  });

  it('should read a DC level as zero', () => {
    const [c] = run({ scope: { coupling: 'ac' }, signal: { expectedAmplitudeV: 12, kind: 'dc' } });
    expect(c.predicted.amplitudeV).toBe(0);
    expect(c.detailTags).toContain('dc-level-lost');
  });

  it('should attenuate a sine below the corner by f/√(f² + f_c²)', () => {
    // 1x probe, 10 Hz corner, 50 Ω source: corner 10·1e6/(1e6 + 50); a 10 Hz sine keeps about 70.7 %
    const [c] = run({ probe: { attenuation: 1 }, scope: { coupling: 'ac', acCornerHz: 10 }, signal: { frequencyHz: 10, kind: 'sine', expectedAmplitudeV: 1 } });
    expect(c.predicted.amplitudeV).toBeCloseTo(0.7071, 3);
  });

  it('should fit a corner to observed droop, and only a plausible one', () => {
    const fitted = run({ probe: { attenuation: 1 }, circuit: { sourceResistanceOhm: 0 }, signal: { frequencyHz: 100, kind: 'square' }, observed: { tiltPct: 20 } }).find((c) => c.basis === 'fitted')!;
    expect(fitted.estimates?.impliedAcCornerHz).toBeCloseTo(12.906, 3);
    expect(fitted.predicted.tiltPct).toBe(20);
    // 20 % at 1 MHz would need a corner of about 130 kHz: no scope's AC coupling
    expect(run({ signal: { frequencyHz: 1e6, kind: 'square' }, observed: { tiltPct: 20 } })).toHaveLength(1);
  });

  it('should not lower the corner behind an active probe, whose output drives the input', () => {
    const [c] = run({ probe: { kind: 'active', attenuation: 10 }, scope: { coupling: 'ac', acCornerHz: 10 }, signal: { frequencyHz: 100, kind: 'square' } });
    expect(c.estimates?.effectiveCornerHz).toBe(10);
  });

  it('should predict nothing on a DC-coupled channel', () => {
    const [c] = run({ signal: { frequencyHz: 100, kind: 'square' } });
    expect(c.predicted).toEqual({});
    expect(c.deviation).toBe(0);
  });

  it('should not blame AC coupling for droop on a channel recorded as DC-coupled', () => {
    // a 10 Hz square drooping 15 %: behind a 10x probe that needs an AC corner near 9.6 Hz
    // (the closed form checked above against the stepped simulation)
    const droop = (coupling?: 'dc'): DiagnosisInput => ({
      probe: { attenuation: 10 },
      scope: { attenuationSetting: 10, ...(coupling ? { coupling } : {}) },
      signal: { expectedAmplitudeV: 5, frequencyHz: 10, kind: 'square' },
      observed: { amplitudeV: 5, tiltPct: 15 },
    });
    // unsaid: a channel left on AC is a fair guess
    const unsaid = diagnose(droop());
    expect(unsaid.verdict).toBe('measurement-error');
    expect(unsaid.hypotheses[0].cause).toBe('ac-coupling');
    // recorded DC off the channel menu: the droop is the circuit's or a wrong record, not a cause the engine can name
    const recorded = diagnose(droop('dc'));
    expect(recorded.verdict).toBe('unexplained');
    const ac = recorded.hypotheses.find((h) => h.cause === 'ac-coupling')!;
    expect(ac.fits).toBe(false);
    expect(ac.explanation).toMatch(/DC-coupled/);
    expect(recorded.tags).toEqual([]);
  });
});
