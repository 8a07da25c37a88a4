import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { caseNumbersOf, numbersSimilarity, symptomNumbersFit } from '../../shared/search/case-numbers';
import { readSymptomQuery } from '../../shared/search/symptom-query';

describe('symptom queries', () => {
  // The phrases engineers use at the bench (DESIGN.md's symptom chips and the search issue);
  // the causes are what the diagnosis engine infers for each observation.
  it.each([
    ['10x too small', 'read as: amplitude ×0.1 → attenuation mismatch'],
    ['reads a tenth', 'read as: amplitude ×0.1 → attenuation mismatch'],
    ['x10 too low', 'read as: amplitude ×0.1 → attenuation mismatch'],
    ['ten times too small', 'read as: amplitude ×0.1 → attenuation mismatch'],
    ['reads 1.2 V instead of 12 V', 'read as: amplitude ×0.1 → attenuation mismatch'],
    ['expected 3.3 V got 0.33 V', 'read as: amplitude ×0.1 → attenuation mismatch'],
    ['ringing at 120 MHz', 'read as: ringing at 120 MHz → ground-lead ringing'],
    // an assumed 15 cm clip lead can also spike the corners when no ringing is stated
    ['15% overshoot on the square wave corners', 'read as: overshoot +15 % → compensation or ground-lead ringing'],
    ['spikes on corners', 'read as: spikes on corners → compensation or ground-lead ringing'],
    ['rounded corners on the calibrator', 'read as: rounded corners → compensation'],
    ['edges rounded', 'read as: rounded edges → bandwidth'],
    ['amplitude falls with frequency', 'read as: amplitude falling with frequency → loading'],
    ['dc level sags', 'read as: DC level sagging → loading'],
    ['passive probe into a 50 ohm input', 'read as: 50 Ω input → termination mismatch'],
    ['10x probe at 1x', 'read as: 10x probe read as 1x → attenuation mismatch'],
  ])('should read "%s"', (query, reading) => {
    expect(readSymptomQuery(query)?.text).toBe(reading);
  });

  it('should read the six symptom chips of the Bench', () => {
    const chips = ['Amplitude off by a round factor', 'Ringing after edges', 'Rounded edges', 'Spikes on square-wave corners', 'Amplitude falls with frequency', 'DC level sags'];
    expect(chips.map((c) => readSymptomQuery(c)?.causes[0].cause)).toEqual(['attenuation-mismatch', 'ground-lead', 'bandwidth', 'compensation', 'loading', 'loading']);
  });

  it('should keep only the numbers the query stated, in SI units', () => {
    expect(readSymptomQuery('ringing at 120 MHz')?.numbers).toEqual({ ringingFrequencyHz: 120e6 });
    expect(readSymptomQuery('15% overshoot')?.numbers).toEqual({ overshootPct: 15 });
    expect(readSymptomQuery('8 % undershoot')?.numbers).toEqual({ overshootPct: -8 });
    expect(readSymptomQuery('rise time 35 ns')?.numbers).toEqual({ riseTimeS: 35e-9 });
    expect(readSymptomQuery('reads 500 mV instead of 5 V')?.numbers.amplitudeRatio).toBeCloseTo(0.1, 12);
    // a stand-in value (typical ringing of a clip lead) is used for the engine but not ranked on
    expect(readSymptomQuery('ringing after edges')?.numbers).toEqual({});
  });

  it('should give no reading for a query that states no symptom', () => {
    for (const q of ['uart firmware bug', 'gate driver', '', '10x probe', 'scope at 100 MHz']) expect(readSymptomQuery(q)).toBeNull();
  });

  it('should read any round factor too small as an amplitude of its inverse', () => {
    fc.assert(
      fc.property(fc.constantFrom(2, 10, 100, 1000), fc.constantFrom('x', '×', ' times', 'x'), fc.constantFrom('small', 'low'), (n, sign, word) => {
        const r = readSymptomQuery(`${n}${sign} too ${word}`);
        expect(r?.observations[0]).toBe(`amplitude ×${Number((1 / n).toPrecision(2))}`);
      }),
    );
  });

  it('should read a ringing frequency in any prefix and never fail on arbitrary text', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 999 }), fc.constantFrom(['khz', 1e3], ['MHz', 1e6], ['GHz', 1e9]), (n, [unit, scale]) => {
        expect(readSymptomQuery(`rings at ${n} ${unit}`)?.numbers.ringingFrequencyHz).toBeCloseTo(n * (scale as number), 0);
      }),
    );
    fc.assert(fc.property(fc.string({ maxLength: 80 }), (s) => void readSymptomQuery(s)));
  });
});

describe('case numbers', () => {
  it('should compare cases in decades over the numbers both record', () => {
    const a = caseNumbersOf({ signal: { frequencyHz: 25e6 }, observed: { ringingFrequencyHz: 180e6 } });
    const near = caseNumbersOf({ signal: { frequencyHz: 25e6 }, observed: { ringingFrequencyHz: 150e6 } });
    const far = caseNumbersOf({ signal: { frequencyHz: 25e3 }, observed: { ringingFrequencyHz: 1.5e6 } });
    expect(numbersSimilarity(a, a)).toBe(1);
    expect(numbersSimilarity(a, near)).toBeGreaterThan(numbersSimilarity(a, far));
    expect(numbersSimilarity(a, caseNumbersOf({ probe: { attenuation: 10 } }))).toBe(0);
  });

  it('should fit stated symptom numbers to a case within a fraction of a decade', () => {
    const c = caseNumbersOf({ signal: { expectedAmplitudeV: 12 }, observed: { amplitudeV: 1.2, ringingFrequencyHz: 110e6 } });
    expect(symptomNumbersFit({ amplitudeRatio: 0.1 }, c)).toBeCloseTo(1, 9);
    expect(symptomNumbersFit({ ringingFrequencyHz: 120e6 }, c)!).toBeGreaterThan(0.9);
    expect(symptomNumbersFit({ ringingFrequencyHz: 480e6 }, c)!).toBeLessThan(0.05);
    expect(symptomNumbersFit({ riseTimeS: 1e-9 }, c)).toBeUndefined();
  });

  it('should average the fits of the numbers both state and skip the ones the case lacks', () => {
    // a Gaussian in decades, σ = 0.15: one σ off gives e^(−1/2), worked by hand
    const c = caseNumbersOf({ signal: { expectedAmplitudeV: 12 }, observed: { amplitudeV: 1.2, ringingFrequencyHz: 100e6 * 10 ** 0.15 } });
    expect(symptomNumbersFit({ amplitudeRatio: 0.1, ringingFrequencyHz: 100e6 }, c)).toBeCloseTo((1 + Math.exp(-0.5)) / 2, 9);
    expect(symptomNumbersFit({ ringingFrequencyHz: 100e6, riseTimeS: 1e-9 }, c)).toBeCloseTo(Math.exp(-0.5), 9);
    expect(symptomNumbersFit({}, c)).toBeUndefined();
  });
});
