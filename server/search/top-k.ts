/**
 * The first `k` items in `compare` order, without sorting everything: a page of results
 * from thousands of matches. Keeps a sorted buffer of k and inserts only what beats its last.
 */
export function topK<T>(items: Iterable<T>, k: number, compare: (a: T, b: T) => number): T[] {
  const top: T[] = [];
  if (k <= 0) return top;
  for (const item of items) {
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
