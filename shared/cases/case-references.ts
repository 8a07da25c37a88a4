import { z } from 'zod';

/** A case another text links to as `#123`, as the reader may see it. */
export const caseReferenceSchema = z.object({ id: z.number(), title: z.string() });
export type CaseReference = z.infer<typeof caseReferenceSchema>;

/**
 * `#123` standing on its own: not inside a word, an anchor (`page#12`), a path (`/#12`) or an
 * HTML entity (`&#123;`), and not running into more letters (`#12a`).
 */
export const CASE_REF_PATTERN = /(?<![\w&#/])#([1-9]\d{0,8})(?![\w])/g;

/** At most this many distinct ids are looked up per text: a list of every case is not a link. */
export const MAX_REFERENCES_PER_TEXT = 50;

/** `GET /api/cases/references?ids=12,40`: the cases a draft names, for its preview. */
export const caseReferencesQuerySchema = z.object({
  ids: z
    .string({ error: 'ids must be case numbers separated by commas' })
    .regex(/^\d{1,9}(,\d{1,9})*$/, 'ids must be case numbers separated by commas, like 12,40')
    .transform((text) => [...new Set(text.split(',').map(Number))])
    .refine((ids) => ids.length <= MAX_REFERENCES_PER_TEXT, `at most ${MAX_REFERENCES_PER_TEXT} case numbers at a time`),
});

// fenced blocks, indented code is rare in notes and stays matched (a false link costs little)
const FENCED = /(^|\n)(`{3,}|~{3,})[^\n]*\n[\s\S]*?(\n\2[^\n]*(?=\n|$)|$)/g;
const INLINE_CODE = /(`+)[^`]*?\1/g;
const LINK_TARGET = /\]\([^)]*\)/g;
const AUTOLINK = /<[a-z][a-z0-9+.-]*:[^\s>]*>|\bhttps?:\/\/\S+|\bwww\.\S+/gi;

/** The case ids a Markdown text names as `#123`, outside code and URLs, in order of first mention. */
export function referencedCaseIds(...texts: (string | null | undefined)[]): number[] {
  const ids = new Set<number>();
  for (const text of texts) {
    if (!text) continue;
    const prose = text.replace(FENCED, '\n').replace(INLINE_CODE, ' ').replace(LINK_TARGET, ']').replace(AUTOLINK, ' ');
    for (const m of prose.matchAll(CASE_REF_PATTERN)) {
      ids.add(Number(m[1]));
      if (ids.size >= MAX_REFERENCES_PER_TEXT) return [...ids];
    }
  }
  return [...ids];
}

/**
 * The text with each `#123` that `referencedCaseIds` would read renumbered by `to` (an imported
 * casebook's ids become this casebook's); one `to` has no number for is written as `archive
 * case 123`, no longer a link, since here `#123` is another case. Code, link targets and URLs
 * are left as they are. Also returns the numbers that had no counterpart.
 */
export function renumberCaseReferences(text: string, to: (id: number) => number | undefined): { text: string; unmatched: number[] } {
  const kept: [number, number][] = [];
  for (const pattern of [FENCED, INLINE_CODE, LINK_TARGET, AUTOLINK]) for (const m of text.matchAll(pattern)) kept.push([m.index, m.index + m[0].length]);
  const unmatched = new Set<number>();
  const out = text.replace(CASE_REF_PATTERN, (whole: string, digits: string, at: number) => {
    if (kept.some(([s, e]) => at >= s && at < e)) return whole;
    const id = Number(digits);
    const here = to(id);
    if (here !== undefined) return `#${here}`;
    unmatched.add(id);
    return `archive case ${id}`;
  });
  return { text: out, unmatched: [...unmatched] };
}
