import { describe, expect, it } from 'vitest';
import { diagnose } from '../../shared/diagnosis/ranker';
import { verdictWords } from '../../src/lib/hypothesis-words';

describe('the verdict in plain words', () => {
  it('should say the record rules out a trace that looks true, and which recorded value does', () => {
    // common practice: a 10x probe on a channel set to 1x shows a tenth, so 1 V seen as 1 V cannot be read that way
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, signal: { expectedAmplitudeV: 1, frequencyHz: 1e3, kind: 'square' }, observed: { amplitudeV: 1 } });
    const words = verdictWords(result, true);
    expect(words.title).toBe('The record rules out what was seen');
    expect(words.body).toMatch(/channel assumes 1x but the probe divides by 10/);
  });

  it('should keep "nothing fits" for a trace that no reading of the record reaches', () => {
    // every setting right, a DC level 1.7 times what it should be
    const result = diagnose({ probe: { attenuation: 10 }, scope: { attenuationSetting: 10 }, signal: { expectedAmplitudeV: 5, kind: 'dc' }, observed: { amplitudeV: 8.5 } });
    expect(result.verdict).toBe('unexplained');
    expect(verdictWords(result, true).title).toBe('Nothing we model fits this trace');
  });
});
