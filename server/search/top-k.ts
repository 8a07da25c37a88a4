/**
 * The first `k` items in `compare` order, without sorting everything: a page of results
 * from thousands of matches. Keeps a sorted buffer of k and inserts only what beats its last.
 * An index loop over an array: through the iterator protocol the optimised search kept
 * falling back to the interpreter (a "wrong map" deopt on nearly every query).
 */
export function topK<T>(items: readonly T[], k: number, compare: (a: T, b: T) => number): T[] {
  const top: T[] = [];
  if (k <= 0) return top;
  for (let i = 0; i < items.length; i++) {
    const item = items[i];
    if (top.length === k && compare(item, top[k - 1]) >= 0) continue;
    let lo = 0;
    let hi = top.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (compare(item, top[mid]) < 0) hi = mid;
      else lo = mid + 1;
    }
    top.splice(lo, 0, item);
    if (top.length > k) top.pop();
  }
  return top;
}
