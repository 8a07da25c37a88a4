import { describe, expect, it } from 'vitest';
import { topK } from '../../server/search/top-k';

describe('topK', () => {
  it('should give the first k of a full sort, ties and all', () => {
    // the reference is Array.prototype.sort over the same total order (common practice, no source)
    let seed = 7;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const items = Array.from({ length: 500 }, (_, id) => ({ id, score: Math.floor(next() * 20) / 4 }));
    const order = (a: { id: number; score: number }, b: { id: number; score: number }) => b.score - a.score || a.id - b.id;
    const sorted = [...items].sort(order);
    for (const k of [0, 1, 20, 499, 500, 800]) expect(topK(items, k, order)).toEqual(sorted.slice(0, Math.max(0, k)));
    expect(topK([], 20, order)).toEqual([]);
  });
});
