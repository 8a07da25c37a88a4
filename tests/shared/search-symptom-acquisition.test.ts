import { describe, expect, it } from 'vitest';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import { assessAliasing } from '../../shared/diagnosis/aliasing';
import { assessAcCoupling } from '../../shared/diagnosis/ac-coupling';
import type { ModelContext } from '../../shared/diagnosis/types';
import { readFacts } from '../../shared/search/symptom-phrases';
import { readSymptomQuery } from '../../shared/search/symptom-query';
import { caseNumbersOf, symptomNumbersFit } from '../../shared/search/case-numbers';

const contextOf = (query: string): ModelContext => {
  const input = readSymptomQuery(query)!.input;
  return { setup: resolveSetup(input).setup, observed: observedOf(input) };
};

describe('symptom queries for the acquisition causes', () => {
  // The phrases engineers use at the bench for these causes (the causes issue's list).
  it.each([
    ['looks slower than it is', 'looks slower than it is', { frequencyHz: 2e3 }],
    ['sample rate too low', 'looks slower than it is', { frequencyHz: 2e3 }],
    ['shows a few kHz where the clock is MHz', '3 kHz shown for 1 MHz', { frequencyHz: 3e3 }],
    ['shows 2 kHz instead of 1 MHz', '2 kHz shown for 1 MHz', { frequencyHz: 2e3 }],
    ['tops flattened', 'tops cut flat (clipped)', { clipped: true }],
    ['clipped at the top of the screen', 'tops cut flat (clipped)', { clipped: true }],
    ['tops droop', 'tops droop', { tiltPct: 10 }],
    ['12% droop on the square', 'tops droop 12 %', { tiltPct: 12 }],
    ['hum on every channel', 'hum', { humFrequencyHz: 50 }],
    ['100 Hz hum', 'hum at 100 Hz', { humFrequencyHz: 100 }],
    ['reads double', 'amplitude ×2', { amplitudeV: 2 }],
  ])('should read "%s" as the observation', (query, observation, observed) => {
    const reading = readSymptomQuery(query);
    expect(reading?.observations[0]).toBe(observation);
    expect(reading?.input.observed).toEqual(observed);
  });

  it('should keep the stated tilt and hum for ranking cases by their numbers', () => {
    expect(readSymptomQuery('12% droop on the square')?.numbers).toEqual({ tiltPct: 12 });
    expect(readSymptomQuery('100 Hz hum')?.numbers).toEqual({ humFrequencyHz: 100 });
    expect(readSymptomQuery('tops droop')?.numbers).toEqual({});
    const ours = caseNumbersOf({ scope: { sampleRateHz: 1e6 }, observed: { frequencyHz: 2e3, tiltPct: 12, humFrequencyHz: 100 } });
    expect(ours).toEqual({ sampleRateHz: 1e6, shownFrequencyHz: 2e3, tiltPct: 12, humFrequencyHz: 100 });
    expect(symptomNumbersFit({ humFrequencyHz: 100 }, ours)).toBe(1);
    expect(symptomNumbersFit({ humFrequencyHz: 50 }, ours)).toBeLessThan(0.2);
  });

  it('should read "AC coupling droop" as droop with the channel AC-coupled', () => {
    const reading = readSymptomQuery('AC coupling droop');
    expect(reading?.observations).toEqual(['tops droop', 'AC coupling']);
    expect(reading?.input.scope?.coupling).toBe('ac');
    expect(reading?.input.signal).toMatchObject({ kind: 'square', frequencyHz: 100 });
  });

  it('should not take hum, a ground clip or 1/3 for an alias or a clipped trace', () => {
    expect(readFacts('ground clip ringing').map((f) => f.kind)).not.toContain('clipped');
    expect(readFacts('hum at 50 hz while the 1 khz tone plays').map((f) => f.kind)).not.toContain('alias');
    expect(readFacts('shows 2 mhz but expected 1 khz').map((f) => f.kind)).not.toContain('alias');
  });

  it('should name the causes the engine already separates on amplitude and presence', () => {
    expect(readSymptomQuery('tops flattened')?.causes[0].cause).toBe('clipping');
    expect(readSymptomQuery('hum on every channel')?.causes[0].cause).toBe('mains-pickup');
    expect(readSymptomQuery('ground loop')?.causes[0].cause).toBe('mains-pickup');
    expect(readSymptomQuery('reads double')?.causes[0].cause).toBe('generator-load');
  });

  it('should hand the alias and droop readings to models that fit them', () => {
    const alias = assessAliasing(contextOf('shows a few kHz where the clock is MHz')).find((c) => c.basis === 'fitted');
    // sampling theorem: 1 MHz shown at 3 kHz fits 1.003 MSa/s
    expect(alias?.estimates?.impliedSampleRateHz).toBeCloseTo(1.003e6, 0);
    const droop = assessAcCoupling(contextOf('AC coupling droop')).find((c) => c.basis === 'fitted');
    // 10 % on a 100 Hz square: f = 200·atanh(0.1)/π ≈ 6.4 Hz, within a scope's AC-coupling corners
    expect(droop?.estimates?.impliedEffectiveCornerHz).toBeCloseTo((200 * Math.atanh(0.1)) / Math.PI, 6);
  });
});
