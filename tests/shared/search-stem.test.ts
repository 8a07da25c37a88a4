import { describe, expect, it } from 'vitest';
import { stem, WRITTEN_FORM_MARK } from '../../shared/search/stem';
import { indexTerms } from '../../shared/search/text-terms';

// source: English grammar, principal parts of irregular verbs (ring–rang–rung, fall–fell–fallen, rise–rose–risen)
describe('stemmer: irregular verb forms', () => {
  it.each([
    ['ring', ['ring', 'rings', 'ringing', 'rang', 'rung']],
    ['fall', ['fall', 'falls', 'falling', 'fell', 'fallen']],
    ['rise', ['rise', 'rises', 'rising', 'rose', 'risen']],
    ['clip', ['clip', 'clips', 'clipping', 'clipped']],
    ['drive', ['drive', 'drives', 'driving', 'drove', 'driven']],
  ])('should bring every form of "%s" to one term', (base, forms) => {
    for (const f of forms) expect(stem(f), f).toBe(stem(base));
  });

  it('should leave trade nouns that look like past forms alone', () => {
    // "led" is the diode, not a form of "lead"
    expect(stem('led')).toBe('led');
    expect(stem('left')).toBe('left');
  });

  it('should index a sentence in the past tense with the terms of the present', () => {
    const past = indexTerms('The output rang and the rail fell');
    expect(past.filter((t) => !t.startsWith(WRITTEN_FORM_MARK))).toEqual(indexTerms('The output rings and the rail falls'));
    // the irregular forms are kept as written besides, so the exact form can count for more
    expect(past.filter((t) => t.startsWith(WRITTEN_FORM_MARK))).toEqual(['=rang', '=fell']);
    expect(indexTerms('The output rings and the rail falls').some((t) => t.startsWith(WRITTEN_FORM_MARK))).toBe(false);
  });
});
