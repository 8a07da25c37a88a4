import type { Series } from './series';
import type { Transition } from './transitions';

/**
 * How the level after one edge moves until the next edge: flat at `finalV`; a straight droop
 * `startV` + slope·(t − t1); or a settle `finalV` + r1·e^(−(t − t1)/τ). A class rather than an
 * object holding a closure: a long clock capture has one per edge (20,000 at 10M samples), and a
 * closure each with its context was megabytes of heap.
 */
export class SegmentSettle {
  constructor(
    /** 'tilt': still moving when the next edge comes (droop); 'corner': settles with τ well inside; 'flat': neither. */
    readonly kind: 'tilt' | 'corner' | 'flat',
    /** Level the model gives at the edge's 50 % instant and at the next edge's, V. */
    readonly startV: number,
    readonly endV: number,
    /** Level the segment settles to (its asymptote; the end level for a linear droop), V. */
    readonly finalV: number,
    /** Settling time constant, s (Infinity for a straight droop, NaN when flat). */
    readonly tauS: number,
    // the model's other terms: the droop's slope (V/s) or the settle's r1 (V), from the instant t1 (s)
    private readonly term: number,
    private readonly t1S: number,
  ) {}

  static flat(levelV: number): SegmentSettle {
    return new SegmentSettle('flat', levelV, levelV, levelV, Number.NaN, 0, 0);
  }

  /** The segment's level at time t, V. */
  levelAt(tS: number): number {
    if (this.kind === 'flat') return this.finalV;
    if (this.kind === 'tilt') return this.startV + this.term * (tS - this.t1S);
    return this.finalV + this.term * Math.exp(-(tS - this.t1S) / this.tauS);
  }
}

// Window centres at 10 %, 50 % and 90 % of the span, each 10 % wide.
const WINDOW_SHARE = 0.1;
const MIN_SPAN_SAMPLES = 30;
// A difference of window means this many standard errors from zero is real.
const SIGNIFICANT = 4;

/**
 * Fits the level after a transition with three window means (at 10, 50 and 90 % of the span):
 * for v(t) = F + R·e^(−t/τ), equally spaced means give (m1 − m2)/(m2 − m3) = e^(Δ/τ), hence τ
 * and the asymptote F = m3 − (m2 − m3)/(q − 1) (a window mean of an exponential is the value
 * at its centre times sinh(h)/h, h = width/2τ, the same for the three windows, so the ratio is
 * exact and R is corrected by that factor). The span is halved while its second half is already
 * settled, so a τ much shorter than the segment is still seen. A ratio at or below 1 is a
 * straight droop (τ infinite). Means moving in opposite directions (ringing, noise) give null.
 *
 * @param from first sample after the edge's fast part
 * @param to last sample before the next edge
 * @param noiseV noise rms, V
 */
export function fitSettle(timesS: Series, volts: Series, from: number, to: number, noiseV: number): SegmentSettle | null {
  let span = to - from;
  if (span < MIN_SPAN_SAMPLES) return null;
  for (;;) {
    const width = Math.max(3, Math.round(WINDOW_SHARE * span));
    const c1 = from + 0.1 * span;
    const c2 = from + 0.5 * span;
    const c3 = from + 0.9 * span;
    const m1 = windowMean(volts, from, to, c1, width);
    const m2 = windowMean(volts, from, to, c2, width);
    const m3 = windowMean(volts, from, to, c3, width);
    const d1 = m1 - m2;
    const d2 = m2 - m3;
    const errorV = (SIGNIFICANT * noiseV * Math.SQRT2) / Math.sqrt(width);
    const flatLevel = (m1 + m2 + m3) / 3;
    if (Math.abs(d1) <= errorV && Math.abs(d2) <= errorV) {
      if (Math.abs(m1 - m3) <= errorV || d1 === 0) return SegmentSettle.flat(flatLevel);
    }
    // settled by the middle but moving early: look closer to the edge
    if (Math.abs(d2) <= errorV && Math.abs(d1) > errorV && span / 2 >= MIN_SPAN_SAMPLES) {
      span = Math.floor(span / 2);
      continue;
    }
    // a difference within the noise leaves the ratio to chance: no fit
    if (Math.abs(d2) <= errorV) return Math.abs(d1) <= errorV ? SegmentSettle.flat(flatLevel) : null;
    if (d1 * d2 < 0) return null;
    if (d2 === 0 || Math.abs(d1) <= Math.abs(d2) * (1 + 1e-9)) {
      // straight (or slightly accelerating) droop: a line through the outer windows
      const slope = (m3 - m1) / (timesS.get(Math.round(c3)) - timesS.get(Math.round(c1)));
      return new SegmentSettle('tilt', m1, m3, m3, Number.POSITIVE_INFINITY, slope, timesS.get(Math.round(c1)));
    }
    const q = d1 / d2;
    const stepS = (timesS.get(Math.round(c3)) - timesS.get(Math.round(c1))) / 2;
    const tauS = stepS / Math.log(q);
    const finalV = m3 - d2 / (q - 1);
    const h = ((width * (timesS.get(to) - timesS.get(from))) / (to - from) / 2) / tauS;
    const windowGain = h > 1e-6 ? Math.sinh(h) / h : 1;
    const r1 = (m1 - finalV) / windowGain;
    const t1 = timesS.get(Math.round(c1));
    const startV = finalV + r1 * Math.exp(-(timesS.get(from) - t1) / tauS);
    const endV = finalV + r1 * Math.exp(-(timesS.get(to) - t1) / tauS);
    return new SegmentSettle('corner', startV, endV, finalV, tauS, r1, t1);
  }
}

/** Mean of `width` samples about `center`, within [from, to]. */
function windowMean(volts: Series, from: number, to: number, center: number, width: number): number {
  const a = Math.max(from, Math.round(center - width / 2));
  const b = Math.min(to, a + width - 1);
  WINDOW_SUM[0] = 0;
  volts.scan(a, b + 1, addToWindowSum);
  return WINDOW_SUM[0] / (b - a + 1);
}

// the running sum of `windowMean` and its visitor, made once: one window is summed at a time
const WINDOW_SUM = new Float64Array(1);
const addToWindowSum = (values: Float64Array) => addValues(values, WINDOW_SUM);

/** sum[0] += the values, in order (a module-level pass, as `scan` asks). */
function addValues(values: Float64Array, sum: Float64Array): void {
  let total = sum[0];
  for (let i = 0; i < values.length; i++) total += values[i];
  sum[0] = total;
}

export interface SettleSummary {
  /** Mean droop across the flats, % of the step (positive: back toward the other state); 0 within the noise. */
  tiltPct: number;
  /** Mean level the edges reach before a slow settle, % of the step (negative: short of it); 0 when none. */
  cornerPct: number;
  settleTimeConstantS: number | null;
  /** Per transition: the segment after it, or null where it could not be fitted. */
  segments: (SegmentSettle | null)[];
  tilted: boolean;
}

// A corner's settle must be this many times slower than the edge's fast part to be told from the edge itself.
const CORNER_TAU_OVER_EDGE = 4;
// Below this share of the step a droop or corner is not reported.
const MIN_SHARE = 0.002;

/**
 * Tilt and corner error over a train of transitions. After each edge the level is fitted by
 * `fitSettle` from a point four fast-part durations past the 50 % instant (the fast part: 10 %
 * to 50 % for a rise) up to the next edge. A settle slower than half the segment is droop:
 * tilt = (level at this edge − level at the next edge)/step, the step being the jump at this
 * edge between the models either side of it; a settle between 4× the fast part and half the
 * segment is a corner: corner = (level reached at the 50 % instant − final level)/step, with its
 * τ. Each is the median over the flats. An edge that rings has no corner: its decaying ringing is not a settle. Source for the closed forms the tests check: a first-order high-pass (AC coupling) of a
 * square of period T gives tilt = tanh(T/(4τ)); a probe's divider with mismatched time
 * constants gives a jump to k·A then e^(−t/τ) settling to A, corner = (k − 1).
 */
export function settleSummary(
  timesS: Series,
  volts: Series,
  transitions: Transition[],
  baseV: number,
  topV: number,
  noiseV: number,
  ringingEdges: boolean[] = [],
): SettleSummary {
  const n = volts.length;
  const segments: (SegmentSettle | null)[] = [];
  const fastS: number[] = [];
  for (let i = 0; i < transitions.length; i++) {
    const edge = transitions[i];
    const next = transitions[i + 1];
    const fast = edge.kind === 'rise' ? edge.t50S - edge.t10S : edge.t50S - edge.t90S;
    fastS.push(fast);
    const guardS = edge.t50S + CORNER_TAU_OVER_EDGE * fast;
    let from = edge.endIndex;
    while (from < n - 1 && timesS.get(from) < guardS) from++;
    const to = next ? next.startIndex : n - 1;
    segments.push(fitSettle(timesS, volts, from, to, noiseV));
  }
  const tilts: number[] = [];
  const corners: number[] = [];
  const taus: number[] = [];
  let cornerCandidates = 0;
  for (let i = 0; i < transitions.length; i++) {
    const segment = segments[i];
    // the record's last flat is cut short: it tells the level after the edge, not the droop across a whole flat
    if (!segment || (i === transitions.length - 1 && transitions.length > 1)) continue;
    const edge = transitions[i];
    const dir = edge.kind === 'rise' ? 1 : -1;
    const before = i > 0 ? segments[i - 1] : null;
    const priorV = before ? before.levelAt(edge.t50S) : dir > 0 ? baseV : topV;
    const startV = segment.levelAt(edge.t50S);
    const endS = transitions[i + 1]?.t50S ?? timesS.get(n - 1);
    const durationS = endS - edge.t50S;
    const stepV = Math.abs(startV - priorV);
    if (!(stepV > 0)) continue;
    cornerCandidates++;
    if (segment.kind === 'flat') {
      tilts.push(0);
      corners.push(0);
    } else if (segment.kind === 'tilt' || segment.tauS > 0.5 * durationS) {
      const droop = (dir * (startV - segment.levelAt(endS))) / stepV;
      tilts.push(Math.abs(droop) < MIN_SHARE ? 0 : 100 * droop);
      corners.push(0);
    } else if (segment.tauS >= CORNER_TAU_OVER_EDGE * fastS[i] && !ringingEdges[i]) {
      const corner = (dir * (startV - segment.finalV)) / Math.abs(segment.finalV - priorV);
      tilts.push(0);
      if (Math.abs(corner) >= MIN_SHARE) {
        corners.push(100 * corner);
        taus.push(segment.tauS);
      } else corners.push(0);
    } else {
      tilts.push(0);
      corners.push(0);
    }
  }
  // medians: a droop or a corner is the same on every flat, a noisy fit of one flat is not
  const middleTilt = median(tilts);
  const tiltPct = Math.abs(middleTilt) < 100 * MIN_SHARE ? 0 : middleTilt;
  const withCorner = corners.filter((c) => c !== 0);
  const cornerPct = withCorner.length * 2 > cornerCandidates ? median(withCorner) : 0;
  taus.sort((a, b) => a - b);
  return {
    tiltPct,
    cornerPct,
    settleTimeConstantS: cornerPct !== 0 && taus.length ? taus[taus.length >> 1] : null,
    segments,
    tilted: Math.abs(tiltPct) >= 100 * MIN_SHARE * 5,
  };
}

function median(values: number[]): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}
