/**
 * The median spacing of the sample instants, in seconds: the sample interval of a uniformly
 * sampled capture, and a robust one of a capture with gaps or jitter in its time stamps.
 * Linear time (quickselect on a scratch copy of the spacings) rather than a sort of a million
 * values. For an even count, the mean of the two middle spacings.
 *
 * @param timesS strictly increasing sample instants, s
 * @returns the median interval, s, or null for fewer than 2 samples
 */
export function medianSampleIntervalS(timesS: Float64Array): number | null {
  const count = timesS.length - 1;
  if (count < 1) return null;
  const spacings = new Float64Array(count);
  let uniform = true;
  const first = timesS[1] - timesS[0];
  for (let i = 0; i < count; i++) {
    spacings[i] = timesS[i + 1] - timesS[i];
    if (spacings[i] !== first) uniform = false;
  }
  if (uniform) return first;
  const upper = selectInPlace(spacings, count >> 1);
  if (count % 2 === 1) return upper;
  let lower = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < count >> 1; i++) if (spacings[i] > lower) lower = spacings[i];
  return (lower + upper) / 2;
}

/**
 * Hoare's selection with a median-of-three pivot: on return `values[k]` is the k-th smallest
 * and everything before it is no larger. Expected linear time.
 */
export function selectInPlace(values: Float64Array, k: number): number {
  let left = 0;
  let right = values.length - 1;
  while (right > left) {
    const middle = (left + right) >> 1;
    const a = values[left];
    const b = values[middle];
    const c = values[right];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = left;
    let j = right;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const swap = values[i];
        values[i] = values[j];
        values[j] = swap;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return values[k];
}
