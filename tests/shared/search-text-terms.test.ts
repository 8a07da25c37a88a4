import { describe, expect, it } from 'vitest';
import { stem } from '../../shared/search/stem';
import { lastWordOpen, termsWithOffsets } from '../../shared/search/text-terms';

describe('search text analysis', () => {
  it('should strip inflections as Porter steps 1a–1c do', () => {
    // source: M. F. Porter, "An algorithm for suffix stripping" (1980), the worked examples of steps 1a–1c
    const examples: [string, string][] = [
      ['caresses', 'caress'], ['ponies', 'poni'], ['ties', 'ti'], ['caress', 'caress'], ['cats', 'cat'],
      ['feed', 'feed'], ['agreed', 'agree'], ['plastered', 'plaster'], ['bled', 'bled'], ['motoring', 'motor'], ['sing', 'sing'],
      ['conflated', 'conflate'], ['troubled', 'trouble'], ['sized', 'size'], ['hopping', 'hop'], ['tanned', 'tan'], ['falling', 'fall'],
      ['hissing', 'hiss'], ['fizzed', 'fizz'], ['failing', 'fail'], ['filing', 'file'], ['happy', 'happi'], ['sky', 'sky'],
    ];
    for (const [word, expected] of examples) expect(stem(word)).toBe(expected);
    // the trade's words meet their inflections
    expect(['ringing', 'rings', 'ring'].map(stem)).toEqual(['ring', 'ring', 'ring']);
    expect(['probing', 'probes'].map(stem)).toEqual(['probe', 'probe']);
  });

  it('should fold the spellings of one thing into one term, keeping where each came from', () => {
    const text = 'x10 or 10x or ten times; 50 ohm, 50Ω and 50-ohm; spring tip; 120MHz; 15 %';
    const terms = termsWithOffsets(text, 'query');
    expect(terms.map((t) => t.term)).toEqual(['10x', '10x', '10x', '50ω', '50ω', '50ω', 'groundspring', '120mhz', '15%']);
    expect(terms.map((t) => text.slice(t.start, t.end))).toEqual(['x10', '10x', 'ten times', '50 ohm', '50Ω', '50-ohm', 'spring tip', '120MHz', '15 %']);
  });

  it('should keep the words of a phrase in the index but not in a query', () => {
    expect(termsWithOffsets('ground spring', 'index').map((t) => t.term)).toEqual(['groundspring', 'ground', 'spring']);
    expect(termsWithOffsets('ground spring', 'query').map((t) => t.term)).toEqual(['groundspring']);
  });

  it('should drop function words and split slugs into their words', () => {
    expect(termsWithOffsets('The probe on the 10x-at-1x channel').map((t) => t.term)).toEqual(['probe', '10x', '1x', 'channel']);
  });

  it('should tell a word being typed from a finished one', () => {
    expect(lastWordOpen('ringin')).toBe(true);
    expect(lastWordOpen('ringing ')).toBe(false);
    expect(lastWordOpen('ringing,')).toBe(false);
  });
});
