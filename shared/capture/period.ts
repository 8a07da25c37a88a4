import type { EdgeKind, Transition } from './transitions';

// Spacings of same-direction mid crossings further than this share from their mean mean
// the edges are not a repetition of one cycle (a burst, a one-off glitch): no period.
const MAX_SPACING_DEVIATION = 0.25;

/**
 * Period of a repetitive waveform, s: the mean spacing of the 50 % reference level crossings
 * of the same direction (IEEE Std 181-2011 defines the period of a periodic waveform between
 * like points of successive cycles; the mid crossings are the points least moved by noise and
 * by the slope of the edges). Rising and falling crossings are pooled, weighted by the number
 * of spacings each gives; a direction whose spacings disagree by more than 25 % is left out.
 *
 * @returns the period, s, or null with fewer than two transitions of one direction
 */
export function periodS(transitions: Transition[]): number | null {
  let totalS = 0;
  let spacings = 0;
  for (const kind of ['rise', 'fall'] as EdgeKind[]) {
    const midsS = transitions.filter((t) => t.kind === kind).map((t) => t.t50S);
    if (midsS.length < 2) continue;
    const count = midsS.length - 1;
    const meanS = (midsS[count] - midsS[0]) / count;
    let regular = true;
    for (let i = 1; i <= count; i++) {
      if (Math.abs(midsS[i] - midsS[i - 1] - meanS) > MAX_SPACING_DEVIATION * meanS) regular = false;
    }
    if (!regular) continue;
    totalS += meanS * count;
    spacings += count;
  }
  return spacings > 0 ? totalS / spacings : null;
}
