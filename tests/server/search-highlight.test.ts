import { describe, expect, it } from 'vitest';
import { matchRanges } from '../../server/search/highlight';
import { termsWithOffsets } from '../../shared/search/text-terms';

/** Every word of `text` whose term is one of `terms`, found by tokenising all of it. */
const everywhere = (text: string, terms: Set<string>) => termsWithOffsets(text, 'index').filter((t) => terms.has(t.term)).map((t) => [t.start, t.end]);

describe('highlights of long fields', () => {
  const filler = 'The bench log went on about fixtures and coffee and the weather for a while. ';
  const text = `${filler.repeat(8)}The output rang after every edge, ringing at 120 MHz. ${filler.repeat(8)}A ground spring at the tip, ten times better, and the rings stopped. ${filler.repeat(8)}`;

  it('should mark the same words as tokenising the whole field, irregular forms, quantities and phrases included', () => {
    expect(text.length).toBeGreaterThan(600);
    for (const terms of [new Set(['ring']), new Set(['edge', '120mhz']), new Set(['groundspring', '10x']), new Set(['weather'])]) {
      expect(matchRanges(text, terms)).toEqual(everywhere(text, terms));
    }
  });

  it('should find nothing when no term occurs', () => {
    expect(matchRanges(text, new Set(['piezo']))).toEqual([]);
  });
});
