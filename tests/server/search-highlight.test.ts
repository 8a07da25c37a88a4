import { describe, expect, it } from 'vitest';
import { matchRanges, plainText } from '../../server/search/highlight';
import { termsWithOffsets } from '../../shared/search/text-terms';

/** Every word of `text` whose term is one of `terms`, found by tokenising all of it. */
const everywhere = (text: string, terms: Set<string>) => termsWithOffsets(text, 'index').filter((t) => terms.has(t.term)).map((t) => [t.start, t.end]);

describe('highlights of long fields', () => {
  const filler = 'The bench log went on about fixtures and coffee and the weather for a while. ';
  const text = `${filler.repeat(8)}The output rang after every edge, ringing at 120 MHz. ${filler.repeat(8)}A ground spring at the tip, ten times better, and the rings stopped. ${filler.repeat(8)}`;

  it('should mark the same words as tokenising the whole field, irregular forms, quantities and phrases included', () => {
    expect(text.length).toBeGreaterThan(600);
    for (const terms of [new Set(['ring']), new Set(['edge', '120mhz']), new Set(['groundspring', '10x'])]) {
      expect(matchRanges(text, terms)).toEqual(everywhere(text, terms));
    }
  });

  it('should read a word that occurs all through a long field only as far as a few snippets need, from the start', () => {
    const terms = new Set(['weather']);
    const all = everywhere(text, terms);
    const found = matchRanges(text, terms);
    expect(all.length).toBe(24);
    expect(found.length).toBeGreaterThanOrEqual(4);
    expect(found.length).toBeLessThan(all.length);
    expect(found).toEqual(all.slice(0, found.length));
  });

  it('should find nothing when no term occurs', () => {
    expect(matchRanges(text, new Set(['piezo']))).toEqual([]);
  });
});

describe('highlights of short fields', () => {
  // a short field is now also read only around the places a term may be written
  it('should mark a word whose stem changed its last letter, and the same words as tokenising it whole', () => {
    const title = 'Copies of the tidy scope setup differed; the copy on the bench was dying';
    for (const terms of [new Set(['copi']), new Set(['tidi', 'dy']), new Set(['scope', 'setup'])]) {
      const found = matchRanges(title, terms, false);
      expect(found.length).toBeGreaterThan(0);
      expect(found).toEqual(everywhere(title, terms));
    }
  });
});

describe('a story as the plain text of a result card', () => {
  it('should drop emphasis, code marks, fences, headings, quotes and link targets, and join the lines', () => {
    // worked by hand from the markdown (CommonMark's emphasis, code spans, fences, ATX headings, block quotes, links)
    const story = 'Probe **tip** and *ground* with `x10`, see [the note](http://a/b).\n\n## Fix\n> Spring tip\n```\nclip\n```\nDone';
    expect(plainText(story)).toBe('Probe tip and ground with x10, see the note. Fix Spring tip clip Done');
    expect(plainText('No marks at all, one line')).toBe('No marks at all, one line');
    expect(plainText('two\n  lines')).toBe('two lines');
  });
});
