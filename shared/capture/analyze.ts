import { postTransitionAberrations } from './aberrations';
import { isClipped } from './clipping';
import { referenceLevels, stateLevels, type ReferenceLevels } from './levels';
import { noisePeakV } from './noise';
import { addSquaredDeviations, summaryOf } from './passes';
import { settleSummary, type SegmentSettle } from './settle';
import { classifyShape, type WaveShape } from './shape';
import { humFrequencyHz as findHum, strongestLineShare, type CaptureSpectrum } from './spectrum';
import { periodS as measurePeriodS } from './period';
import { ringingAfter } from './ringing';
import { asSeries, headOf, type SampleSeries, type Series } from './series';
import { crossingTimeS, findTransitions, type EdgeKind, type Transition } from './transitions';
import type { CaptureSamples } from './types';
import { wholeRecordMeasures, type WholeRecordMeasures } from './whole-record';

/** One transition as reported. Instants are named by reference level: a fall crosses 90 % first. */
export interface CaptureEdge {
  kind: EdgeKind;
  t10S: number;
  t50S: number;
  t90S: number;
  durationS: number;
  overshootPct: number;
  undershootPct: number;
  ringingFrequencyHz: number | null;
}

/**
 * What a capture shows, in SI units; null where the capture has no such feature (a flat line
 * has no levels apart and no edges, a single step no period, an edge that settles cleanly no
 * ringing). The first ten fields are the `POST /api/captures/analyze` response.
 */
export interface CaptureAnalysis {
  points: number;
  sampleIntervalS: number | null;
  baseV: number | null;
  topV: number | null;
  amplitudeV: number | null;
  riseTimeS: number | null;
  fallTimeS: number | null;
  overshootPct: number | null;
  ringingFrequencyHz: number | null;
  periodS: number | null;
  undershootPct: number | null;
  frequencyHz: number | null;
  /** Every transition found; `edges` lists the first `maxListedEdges` of them. */
  edgeCount: number;
  edges: CaptureEdge[];
  referenceLevels: ReferenceLevels | null;
  /** What the waveform is, for the engine's signal kind. */
  shape: WaveShape;
  /** True when the trace sits in flat runs on its extremes (the ADC's or the screen's rails). */
  clipped: boolean;
  /** Droop across a flat top, % of the step (positive toward the other state); null without flats. */
  tiltPct: number | null;
  /** Level an edge reaches before a slow settle, % of the step, negative for rounded corners; null without edges. */
  cornerPct: number | null;
  /** Time constant of that settle, s; null without a corner. */
  settleTimeConstantS: number | null;
  /** Noise rms on the trace, V. */
  noiseRmsV: number;
  /** The strongest line at 50/60 Hz or a harmonic of it, Hz; null when none stands out or the record is too short. */
  humFrequencyHz: number | null;
  spectrum: CaptureSpectrum | null;
}

export interface AnalyzeOptions {
  /** Cap on `edges`, so a long clock capture does not answer with megabytes; default 1000. */
  maxListedEdges?: number;
  /** The channel's V/div and offset from the file, to tell the screen's rails. */
  voltsPerDiv?: number;
  offsetV?: number;
}

// Ringing must stand at least this share of the amplitude clear of the settled level, above
// the steps of an 8-bit ADC.
const RINGING_BAND_SHARE = 0.01;
// A capture rings when at least this share of its transitions do.
const RINGING_EDGE_SHARE = 0.25;

/**
 * Measures a capture: state levels by the histogram method and the 10/50/90 % reference
 * levels (IEEE Std 181-2011, 5.2.1 and 5.3.2), every transition's duration (5.3.3), post-
 * transition overshoot and undershoot, ringing frequency, period and frequency. Rise and fall
 * time, overshoot and undershoot are means over the transitions; the ringing frequency is the
 * median over the transitions that ring. An edge faster than the sampling reads as about 0.8
 * sample intervals: rise times near `sampleIntervalS` are limited by the capture, not the signal.
 * A few linear passes over the samples; the samples are never sorted.
 *
 * @param samples time (s, strictly increasing) and voltage (V), as `CaptureParser` returns them
 */
export function analyzeCapture(samples: CaptureSamples | SampleSeries, options: AnalyzeOptions = {}): CaptureAnalysis {
  const steps = analysisSteps(samples, options);
  let step = steps.next();
  while (!step.done) step = steps.next(wholeRecordMeasures(step.value.timesS, step.value.volts));
  return step.value;
}

/**
 * `analyzeCapture` in two steps, for a caller with a second thread: the first `next()` finds
 * the levels and, on a two-level trace, the edges and their ringing, then yields the series
 * whose `wholeRecordMeasures` it needs (computed meanwhile elsewhere, or now); `next(measures)`
 * finishes. A record of fewer than 2 samples finishes at once, without yielding.
 */
export function* analysisSteps(
  samples: CaptureSamples | SampleSeries,
  options: AnalyzeOptions = {},
): Generator<SampleSeries, CaptureAnalysis, WholeRecordMeasures> {
  const allTimesS = asSeries(samples.timesS);
  const allVolts = asSeries(samples.volts);
  const points = Math.min(allTimesS.length, allVolts.length);
  const timesS = headOf(allTimesS, points);
  const volts = headOf(allVolts, points);
  const none: CaptureAnalysis = {
    points,
    sampleIntervalS: null,
    baseV: null,
    topV: null,
    amplitudeV: null,
    riseTimeS: null,
    fallTimeS: null,
    overshootPct: null,
    ringingFrequencyHz: null,
    periodS: null,
    undershootPct: null,
    frequencyHz: null,
    edgeCount: 0,
    edges: [],
    referenceLevels: null,
    shape: 'other',
    clipped: false,
    tiltPct: null,
    cornerPct: null,
    settleTimeConstantS: null,
    noiseRmsV: 0,
    humFrequencyHz: null,
    spectrum: null,
  };
  // too short for a spacing (the sample interval is null too)
  if (points < 2) return none;

  const meanV = summaryOf(volts).sumV / points;
  const squares = new Float64Array(1);
  volts.scan(0, points, (values) => addSquaredDeviations(values, meanV, squares));
  const variance = squares[0];
  const stdV = Math.sqrt(variance / points);

  const levels = stateLevels(volts);
  const rangeV = levels.maxV - levels.minV;
  const lowV = levels.twoStates ? levels.baseV : levels.minV;
  const highV = levels.twoStates ? levels.topV : levels.maxV;
  // edges found with the state levels; whether each rings (against the state) keeps ringing from being read as a corner
  const edgesAt = (reference: ReferenceLevels | null) => {
    const transitions = reference ? findTransitions(timesS, volts, reference, levels.noiseV) : [];
    const ringingAtState = transitions.map((transition, index) => {
      const stopIndex = index + 1 < transitions.length ? transitions[index + 1].startIndex : points - 1;
      const stateV = transition.kind === 'rise' ? highV : lowV;
      return ringingAfter(timesS, volts, transition, stopIndex, stateV, levels.noiseV, RINGING_BAND_SHARE * (highV - lowV));
    });
    return { reference, transitions, ringingAtState };
  };
  // two histogram peaks: the edges need nothing more, and are found before the rest is known
  const twoLevelEdges = levels.twoStates ? edgesAt(referenceLevels(levels.baseV, levels.topV)) : null;

  const { sampleIntervalS, rails, topRail, bottomRail, noiseV, spectral } = yield { timesS, volts };

  // Without two histogram peaks (a heavily drooping square has none) edges are still looked for
  // between the extremes, so droop can be told from a waveform with no flats at all.
  const { reference, transitions, ringingAtState } = twoLevelEdges ?? edgesAt(rangeV > 8 * noiseV ? referenceLevels(levels.minV, levels.maxV) : null);
  const period = measurePeriodS(transitions);
  const clipped = isClipped(volts, rails, topRail, bottomRail, noiseV, rangeV, options);
  const ringsAtState = ringingAtState.map((ringing) => ringing !== null);
  const droopProbe = !levels.twoStates && hasFastEdges(transitions, timesS) ? settleSummary(timesS, volts, transitions, lowV, highV, noiseV, ringsAtState) : null;

  const fundamentalShare = spectral ? strongestLineShare(spectral.amplitudesV) : null;
  const shape = classifyShape({ volts, levels, transitions, periodS: period, noiseV, fundamentalShare, clipped, meanV, stdV, drooped: droopProbe?.tilted ?? false });
  const durationS = timesS.get(points - 1) - timesS.get(0);
  const hum = spectral ? findHum(spectral.amplitudesV, spectral.spectrum.binHz, durationS, shape === 'dc' ? null : period) : null;
  const common = {
    ...none,
    sampleIntervalS,
    shape,
    clipped,
    noiseRmsV: noiseV,
    humFrequencyHz: hum ? Math.round(hum.frequencyHz * 10) / 10 : null,
    spectrum: spectral?.spectrum ?? null,
  };
  const hasFlats = shape === 'square' || shape === 'pulse' || shape === 'step';
  if (shape === 'dc' || reference === null) {
    const dcV = levels.twoStates ? meanV : levels.baseV;
    return { ...common, baseV: shape === 'dc' ? dcV : levels.baseV, topV: shape === 'dc' ? dcV : levels.topV, amplitudeV: shape === 'dc' ? 0 : levels.twoStates ? levels.topV - levels.baseV : rangeV };
  }
  const periodic = { periodS: period, frequencyHz: period === null ? null : 1 / period };
  if (!hasFlats && (shape === 'sine' || !levels.twoStates)) {
    // no flat states: levels are the extremes, and there is no rise time, overshoot or ringing to speak of
    return { ...common, ...periodic, baseV: levels.minV, topV: levels.maxV, amplitudeV: rangeV, referenceLevels: reference };
  }

  const settle = hasFlats ? (droopProbe ?? settleSummary(timesS, volts, transitions, lowV, highV, noiseV, ringsAtState)) : null;
  let baseV = lowV;
  let topV = highV;
  if (settle?.tilted) {
    // with droop the histogram's modes sit at the ends of the flats: take each flat's middle
    const mids = { rise: [] as number[], fall: [] as number[] };
    transitions.forEach((edge, i) => {
      const segment = settle.segments[i];
      const endS = transitions[i + 1]?.t50S;
      if (segment && endS !== undefined) mids[edge.kind].push(segment.levelAt((edge.t50S + endS) / 2));
    });
    if (mids.rise.length && mids.fall.length) {
      topV = mean(mids.rise)!;
      baseV = mean(mids.fall)!;
    }
  }
  const amplitudeV = topV - baseV;
  if (settle?.tilted) {
    // droop moves the flats across the fixed reference levels: time each edge between 10 % and 90 % of its own step
    transitions.forEach((transition, i) => {
      const after = settle.segments[i];
      const before = i > 0 ? settle.segments[i - 1] : null;
      if (after && before) transitions[i] = retimeEdge(timesS, volts, transition, before.levelAt(transition.t50S), after.levelAt(transition.t50S));
    });
  }
  // each edge's figures summed in edge order as it is measured (the means are the same), and only
  // the listed edges kept: a long clock capture has tens of thousands, an object each
  const listed = options.maxListedEdges ?? 1000;
  const edges: CaptureEdge[] = [];
  const ringingHz: number[] = [];
  const sums = { rise: 0, rises: 0, fall: 0, falls: 0, overshoot: 0, undershoot: 0 };
  transitions.forEach((transition, index) => {
    const stopIndex = index + 1 < transitions.length ? transitions[index + 1].startIndex : points - 1;
    const segment: SegmentSettle | null = settle?.segments[index] ?? null;
    const stateV = transition.kind === 'rise' ? highV : lowV;
    const finalV = segment && segment.kind !== 'flat' ? segment.finalV : stateV;
    const regionCount = stopIndex - transition.endIndex + 1;
    const boundPct = (100 * noisePeakV(noiseV, regionCount)) / amplitudeV;
    let overshootPct: number;
    let undershootPct: number;
    if (segment && settle?.tilted) {
      ({ overshootPct, undershootPct } = aberrationsAgainst(timesS, volts, transition, stopIndex, segment, amplitudeV));
    } else {
      ({ overshootPct, undershootPct } = postTransitionAberrations(volts, transition, stopIndex, lowV, highV));
    }
    // against the state level it was already looked for; a fitted flat moves the level it rings about
    const ringing =
      finalV === stateV && !settle?.tilted
        ? ringingAtState[index]
        : ringingAfter(timesS, volts, transition, stopIndex, finalV, levels.noiseV, RINGING_BAND_SHARE * amplitudeV);
    const edge: CaptureEdge = {
      kind: transition.kind,
      t10S: transition.t10S,
      t50S: transition.t50S,
      t90S: transition.t90S,
      durationS: transition.durationS,
      overshootPct: overshootPct <= boundPct ? 0 : overshootPct,
      // without an overshoot beyond the noise the edge approaches its level from one side: what dips below is noise
      undershootPct: undershootPct <= boundPct || overshootPct <= boundPct ? 0 : undershootPct,
      ringingFrequencyHz: ringing?.frequencyHz ?? null,
    };
    if (edge.kind === 'rise') {
      sums.rise += edge.durationS;
      sums.rises++;
    } else {
      sums.fall += edge.durationS;
      sums.falls++;
    }
    sums.overshoot += edge.overshootPct;
    sums.undershoot += edge.undershootPct;
    if (edge.ringingFrequencyHz !== null) ringingHz.push(edge.ringingFrequencyHz);
    if (edges.length < listed) edges.push(edge);
  });
  const count = transitions.length;
  return {
    ...common,
    ...periodic,
    baseV,
    topV,
    amplitudeV,
    riseTimeS: sums.rises > 0 ? sums.rise / sums.rises : null,
    fallTimeS: sums.falls > 0 ? sums.fall / sums.falls : null,
    overshootPct: count > 0 ? sums.overshoot / count : null,
    undershootPct: count > 0 ? sums.undershoot / count : null,
    ringingFrequencyHz: ringingHz.length > 0 && ringingHz.length >= RINGING_EDGE_SHARE * count ? median(ringingHz) : null,
    edgeCount: count,
    edges,
    referenceLevels: reference,
    tiltPct: settle ? settle.tiltPct : null,
    cornerPct: settle ? settle.cornerPct : null,
    settleTimeConstantS: settle ? settle.settleTimeConstantS : null,
  };
}

/**
 * An edge timed against the levels either side of it (IEEE Std 181-2011, 5.3.3, with local
 * state levels): from the mid crossing outward to the 10 % and 90 % points of the step
 * `fromV` → `toV`, interpolated between samples.
 */
function retimeEdge(timesS: Series, volts: Series, transition: Transition, fromV: number, toV: number): Transition {
  const n = volts.length;
  const lowV = fromV + 0.1 * (toV - fromV);
  const midV = fromV + 0.5 * (toV - fromV);
  const highV = fromV + 0.9 * (toV - fromV);
  const up = toV > fromV;
  const past = (v: number, levelV: number) => (up ? v >= levelV : v <= levelV);
  let k = transition.startIndex;
  while (k < n - 1 && !past(volts.get(k + 1), midV)) k++;
  let a = k;
  while (a > 0 && past(volts.get(a), lowV)) a--;
  let b = k + 1;
  while (b < n - 1 && !past(volts.get(b), highV)) b++;
  if (a === 0 || b >= n - 1) return transition;
  const cross = (i: number, levelV: number) => crossingTimeS(timesS.get(i), volts.get(i), timesS.get(i + 1), volts.get(i + 1), levelV);
  const t10S = cross(a, lowV);
  const t50S = cross(k, midV);
  const t90S = cross(b - 1, highV);
  const durationS = Math.abs(t90S - t10S);
  return { ...transition, t10S: up ? t10S : t90S, t90S: up ? t90S : t10S, t50S, durationS, startIndex: a, endIndex: b };
}

/** Edges short next to their spacing (under a tenth of it on average): a waveform of flats and jumps. */
function hasFastEdges(transitions: Transition[], timesS: Series): boolean {
  if (transitions.length === 0) return false;
  const spanS = transitions.length > 1 ? (transitions[transitions.length - 1].t50S - transitions[0].t50S) / (transitions.length - 1) : timesS.get(timesS.length - 1) - timesS.get(0);
  const edgeS = transitions.reduce((sum, t) => sum + t.durationS, 0) / transitions.length;
  return edgeS < 0.1 * spanS;
}

/**
 * Overshoot and undershoot against a drooping flat's own level (its fitted model) rather than a
 * fixed state level, so droop is not read as an aberration: taken over the first quarter of the flat.
 */
function aberrationsAgainst(
  timesS: Series,
  volts: Series,
  transition: Transition,
  stopIndex: number,
  segment: SegmentSettle,
  amplitudeV: number,
): { overshootPct: number; undershootPct: number } {
  const sign = transition.kind === 'rise' ? 1 : -1;
  const last = transition.endIndex + Math.floor((stopIndex - transition.endIndex) / 4);
  let beyondV = 0;
  let shortV = 0;
  for (let i = transition.endIndex; i <= last; i++) {
    const excessV = sign * (volts.get(i) - segment.levelAt(timesS.get(i)));
    if (excessV > beyondV) beyondV = excessV;
    if (-excessV > shortV) shortV = -excessV;
  }
  return { overshootPct: (100 * beyondV) / amplitudeV, undershootPct: (100 * shortV) / amplitudeV };
}

function mean(values: number[]): number | null {
  if (values.length === 0) return null;
  let sum = 0;
  for (const value of values) sum += value;
  return sum / values.length;
}

// Only over the per-edge results (a few thousand at most), so a sort is fine here.
function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}
