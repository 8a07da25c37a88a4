import { describe, expect, it } from 'vitest';
import { FACET_ROW, FacetRows, ROW_AUTHOR, ROW_CAUSE, ROW_ENGINE_CAUSE, ROW_STATUS, ROW_TAG_COUNT, ROW_TAGS } from '../../server/search/facet-rows';

describe('FacetRows', () => {
  it('should keep every case’s codes through edits and deletes, reusing rows and compacting the tag pool', () => {
    // the reference is a plain Map of what was last set (common practice, no source)
    const rows = new FacetRows();
    const expected = new Map<number, { cause: number; status: number; engineCause: number; authorId: number; tags: number[] }>();
    let seed = 11;
    const next = (n: number) => Math.floor(((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31) * n);
    const read = (id: number) => {
      const row = rows.rowOf(id);
      if (row < 0) return undefined;
      const at = row * FACET_ROW;
      const start = rows.meta[at + ROW_TAGS];
      return {
        cause: rows.meta[at + ROW_CAUSE],
        status: rows.meta[at + ROW_STATUS],
        engineCause: rows.meta[at + ROW_ENGINE_CAUSE],
        authorId: rows.meta[at + ROW_AUTHOR],
        tags: [...rows.pool.subarray(start, start + rows.meta[at + ROW_TAG_COUNT])],
      };
    };
    for (let step = 0; step < 30_000; step++) {
      const id = next(500);
      if (next(5) === 0) {
        rows.delete(id);
        expected.delete(id);
      } else {
        const value = { cause: next(12) - 1, status: next(4), engineCause: next(12) - 1, authorId: 1 + next(30), tags: Array.from({ length: next(7) }, () => next(40)) };
        rows.set(id, value);
        expected.set(id, value);
      }
      if (step % 5000 === 4999) for (let k = 0; k < 500; k++) expect(read(k), `case ${k} at step ${step}`).toEqual(expected.get(k));
    }
    // rows are reused: never more than the cases that ever lived at once
    expect(rows.meta.length).toBeLessThanOrEqual(FACET_ROW * 1024);
  });
});
