import { describe, expect, it } from 'vitest';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import { aliasFrequencyHz, assessAliasing, impliedSampleRatesHz } from '../../shared/diagnosis/aliasing';

const run = (input: DiagnosisInput) => assessAliasing({ setup: resolveSetup(input).setup, observed: observedOf(input) });

describe('aliasing', () => {
  // source: sampling theorem (Nyquist–Shannon): a sampled spectrum repeats every f_s, so a tone
  // above f_s/2 shows at |f − k·f_s|; worked by hand.
  it.each([
    [9e3, 10e3, 1e3],
    [7e3, 10e3, 3e3],
    [4e3, 10e3, 4e3],
    [1e6, 250e3, 0],
    [1.002e6, 1e6, 2e3],
    [10.1e6, 5e6, 100e3],
  ])('should show %d Hz sampled at %d Sa/s at %d Hz', (f, fs, shown) => {
    expect(aliasFrequencyHz(f, fs)).toBeCloseTo(shown, 6);
  });

  it('should give samples that cannot be told from a sine at the alias frequency', () => {
    // source: sampling theorem; cos(2π f n/f_s) = cos(2π (f − k f_s) n/f_s) for whole n, checked sample by sample
    const f = 1.37e6;
    const fs = 1e6;
    const alias = aliasFrequencyHz(f, fs);
    for (let n = 0; n < 200; n++) {
      expect(Math.cos((2 * Math.PI * f * n) / fs)).toBeCloseTo(Math.cos((2 * Math.PI * alias * n) / fs), 9);
    }
  });

  it('should infer the sample rate a shown frequency implies, mildest first', () => {
    // worked by hand: 1 MHz shown at 2 kHz; f_s = (f + f_obs)/1 = 1.002 MSa/s, then (f − f_obs)/1 = 998 kSa/s
    const rates = impliedSampleRatesHz(1e6, 2e3);
    expect(rates[0]).toBeCloseTo(1.002e6, 3);
    expect(rates[1]).toBeCloseTo(0.998e6, 3);
    expect(rates.every((r) => r < 2e6)).toBe(true);
  });

  it('should predict the alias from a recorded sample rate', () => {
    const [recorded] = run({ scope: { sampleRateHz: 1.002e6 }, signal: { frequencyHz: 1e6, kind: 'square' } });
    // worked by hand: |1 MHz − 1.002 MSa/s| = 2 kHz
    expect(recorded.predicted.frequencyHz).toBeCloseTo(2e3, 3);
    expect(recorded.deviation).toBeCloseTo(Math.log(500), 6);
    expect(recorded.detailTags).toContain('undersampled');
    expect(recorded.explanation).toMatch(/500 times slower/);
  });

  it('should predict the true frequency below half the sample rate', () => {
    const [recorded] = run({ scope: { sampleRateHz: 1e9 }, signal: { frequencyHz: 10e6, kind: 'square' } });
    expect(recorded.predicted.frequencyHz).toBe(10e6);
    expect(recorded.deviation).toBe(0);
  });

  it('should fit a sample rate to a frequency that looks slower than it is', () => {
    const candidates = run({ signal: { frequencyHz: 1e6, kind: 'square' }, observed: { frequencyHz: 2e3 } });
    const fitted = candidates.find((c) => c.basis === 'fitted')!;
    expect(fitted.estimates?.impliedSampleRateHz).toBeCloseTo(1.002e6, 3);
    expect(fitted.predicted.frequencyHz).toBeCloseTo(2e3, 3);
    expect(fitted.contradictions).toBeUndefined();
    expect(fitted.confirm).toMatch(/timebase/);
  });

  it('should call a recorded sample rate that the fit contradicts', () => {
    const candidates = run({ scope: { sampleRateHz: 1e9 }, signal: { frequencyHz: 1e6 }, observed: { frequencyHz: 2e3 } });
    const fitted = candidates.find((c) => c.basis === 'fitted')!;
    expect(fitted.contradictions?.[0]).toMatchObject({ field: 'scope.sampleRateHz', recorded: 1e9 });
  });

  it('should not fit when the shown frequency is the true one', () => {
    expect(run({ signal: { frequencyHz: 1e6 }, observed: { frequencyHz: 1.01e6 } })).toHaveLength(1);
  });
});
