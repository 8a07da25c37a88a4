import { describe, expect, it } from 'vitest';
import { stem } from '../../shared/search/stem';
import { lastWordOpen, patternTokens, rawTokens, termsWithOffsets } from '../../shared/search/text-terms';

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

describe('rawTokens, the ASCII scanner', () => {
  // the reference is the token pattern itself (patternTokens): the scanner must find exactly its tokens
  const alphabet = ['a', 'B', 'z', '7', '0', ' ', ' ', '.', '-', '+', '/', "'", '%', ',', '(', ')', '\n', '_', ':', 'µ', 'Ω', '’', '×', 'é', '—', '²', '中'];
  let seed = 20261203;
  const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  const randomText = (length: number, wideShare: number) =>
    Array.from({ length }, () => {
      const wide = next() < wideShare;
      const pool = wide ? alphabet.slice(19) : alphabet.slice(0, 19);
      return pool[Math.floor(next() * pool.length)];
    }).join('');

  it('should find the same tokens as the pattern in random text, with and without non-ASCII characters', () => {
    for (let k = 0; k < 3000; k++) {
      const text = randomText(1 + Math.floor(next() * 40), k % 3 === 0 ? 0 : 0.05);
      expect(rawTokens(text), JSON.stringify(text)).toEqual(patternTokens(text));
    }
  });

  it('should hand over to the pattern where a non-ASCII character joins or starts a token', () => {
    for (const text of ["10µs at 50 Ω", 'scope’s 10×probe', 'abc-é x', "ab'é", 'x×10', 'a—b', '100%µ', 'ground-lead loop — 22 cm', 'plain ascii, 10x-at-1x 1.2 scope\'s 50%']) {
      expect(rawTokens(text), text).toEqual(patternTokens(text));
    }
    // NFKC reads the micro sign as the Greek letter mu (Unicode Standard Annex #15)
    expect(rawTokens('10\u00b5s at 50 Ω').map((t) => t.text)).toEqual(['10\u03bcs', 'at', '50', 'ω']);
  });
});
