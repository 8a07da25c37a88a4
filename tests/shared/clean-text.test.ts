import { describe, expect, it } from 'vitest';
import { personNameSchema, profileSchema } from '../../shared/schemas/auth';
import { caseCreateSchema, casePatchSchema, commentInputSchema, tagSchema } from '../../shared/schemas/case';
import { stripControlChars, stripControlCharsMultiline } from '../../shared/schemas/clean-text';
import { reviewInputSchema } from '../../shared/schemas/review';

// source: Unicode Standard Annex #9, table 4 (bidi formatting characters); ECMA-48 (C0/C1 controls)
const RLO = '\u202e';
const hidden = ['\u0000', '\u0007', '\u001b', '\u007f', '\u0085', '\u009b', '\u200e', '\u200f', '\u202a', '\u202b', '\u202c', '\u202d', RLO, '\u2066', '\u2067', '\u2068', '\u2069', '\u061c', '\u2028', '\u2029', '\ufeff'];

describe('stripControlChars', () => {
  it('drops every control and bidi character from a single-line value', () => {
    for (const ch of hidden) expect(stripControlChars(`a${ch}b`), `U+${ch.codePointAt(0)!.toString(16)}`).toBe('ab');
    expect(stripControlChars('a\tb\nc\rd')).toBe('abcd');
  });

  it('keeps letters of every script, zero-width joiners and emoji', () => {
    const kept = 'Messung ü Ω — עברית العربية क्‍ष 👩‍🔬';
    expect(stripControlChars(kept)).toBe(kept);
  });

  it('keeps tabs and newlines in multi-line text and turns CRLF into LF', () => {
    expect(stripControlCharsMultiline(`one\ttwo\r\nthree\n${RLO}four\u0007`)).toBe('one\ttwo\nthree\nfour');
  });
});

describe('schemas clean titles, summaries, tags and names', () => {
  it('a case title and summary lose a right-to-left override', () => {
    const c = caseCreateSchema.parse({ title: `Gate drive ${RLO}gnp.exe`, summary: `\u0007Channel read 1.2 V${'\u2066'}` });
    expect(c.title).toBe('Gate drive gnp.exe');
    expect(c.summary).toBe('Channel read 1.2 V');
    expect(casePatchSchema.parse({ title: `x${RLO}yz` }).title).toBe('xyz');
  });

  it('a title of only invisible characters is empty, so it is refused', () => {
    const r = caseCreateSchema.safeParse({ title: `${RLO}${RLO}\u200e\u200f`, summary: 'fine summary' });
    expect(r.success).toBe(false);
  });

  it('multi-line fields keep their lines', () => {
    const c = caseCreateSchema.parse({ title: 'Title', summary: 'Summary', narrative: `line 1\n\tline 2${RLO}` });
    expect(c.narrative).toBe('line 1\n\tline 2');
    expect(commentInputSchema.parse({ body: `a\nb${'\u202d'}` }).body).toBe('a\nb');
    expect(reviewInputSchema.parse({ action: 'send_back', note: `fix\nthis${RLO}` }).note).toBe('fix\nthis');
  });

  it('tags lose control characters before the slug check', () => {
    expect(tagSchema.parse(`gate${RLO}-drive`)).toBe('gate-drive');
  });

  it('person names (invitation, profile) lose them too', () => {
    expect(personNameSchema.parse(`Ada ${RLO}Lovelace\u0000`)).toBe('Ada Lovelace');
    expect(profileSchema.parse({ name: `\u202bMira\u202c` }).name).toBe('Mira');
    expect(personNameSchema.safeParse(`${RLO}`).success).toBe(false);
  });
});
