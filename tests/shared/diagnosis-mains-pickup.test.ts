import { describe, expect, it } from 'vitest';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import { assessMainsPickup, matchMainsHarmonic, nearestHarmonic } from '../../shared/diagnosis/mains-pickup';

const run = (input: DiagnosisInput) => assessMainsPickup({ setup: resolveSetup(input).setup, observed: observedOf(input) });

describe('mains pickup', () => {
  it('should find the mains harmonic nearest a hum line', () => {
    // source: Fourier series of a mains-locked disturbance (lines at n·f_mains); worked by hand
    expect(nearestHarmonic(100, 50).harmonic).toBe(2);
    expect(nearestHarmonic(49.8, 50).harmonic).toBe(1);
    expect(nearestHarmonic(180, 60).harmonic).toBe(3);
  });

  it('should pick the grid that fits when the mains frequency is not recorded', () => {
    // 180 Hz is 3 × 60 Hz, and 20 Hz from any multiple of 50 Hz
    expect(matchMainsHarmonic(180)).toMatchObject({ mainsFrequencyHz: 60, harmonic: 3 });
    expect(matchMainsHarmonic(150)).toMatchObject({ mainsFrequencyHz: 50, harmonic: 3 });
  });

  it('should not call a line between harmonics mains', () => {
    expect(matchMainsHarmonic(1234)).toBeUndefined();
    expect(matchMainsHarmonic(75, 50)).toBeUndefined();
    expect(matchMainsHarmonic(1e3, 60)).toBeUndefined();
  });

  it('should fit the harmonic of an observed hum line', () => {
    const fitted = run({ circuit: { mainsFrequencyHz: 50, mainsConnected: true }, observed: { humFrequencyHz: 100 } }).find((c) => c.basis === 'fitted')!;
    expect(fitted.predicted.humFrequencyHz).toBe(100);
    expect(fitted.estimates?.humHarmonic).toBe(2);
    expect(fitted.detailTags).toContain('mains-harmonic');
    expect(fitted.risks?.[0].level).toBe('caution');
  });

  it('should predict hum at the mains frequency on mains-connected equipment', () => {
    const [c] = run({ circuit: { mainsConnected: true, mainsFrequencyHz: 60 } });
    expect(c.predicted.humFrequencyHz).toBe(60);
    const [quiet] = run({});
    expect(quiet.predicted).toEqual({});
  });
});
