import { postTransitionAberrations } from './aberrations';
import { referenceLevels, stateLevels, type ReferenceLevels } from './levels';
import { periodS as measurePeriodS } from './period';
import { ringingAfter } from './ringing';
import { medianSampleIntervalS } from './sample-interval';
import { findTransitions, type EdgeKind } from './transitions';
import type { CaptureSamples } from './types';

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
}

export interface AnalyzeOptions {
  /** Cap on `edges`, so a long clock capture does not answer with megabytes; default 1000. */
  maxListedEdges?: number;
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
export function analyzeCapture(samples: CaptureSamples, options: AnalyzeOptions = {}): CaptureAnalysis {
  const { timesS, volts } = samples;
  const points = Math.min(timesS.length, volts.length);
  const none: CaptureAnalysis = {
    points,
    sampleIntervalS: medianSampleIntervalS(timesS.subarray(0, points)),
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
  };
  if (points < 2) return none;
  const levels = stateLevels(volts.subarray(0, points));
  if (!levels.twoStates) return { ...none, baseV: levels.baseV, topV: levels.topV, amplitudeV: 0 };

  const { baseV, topV } = levels;
  const amplitudeV = topV - baseV;
  const reference = referenceLevels(baseV, topV);
  const transitions = findTransitions(timesS, volts.subarray(0, points), reference, levels.noiseV);
  const edges: CaptureEdge[] = transitions.map((transition, index) => {
    const stopIndex = index + 1 < transitions.length ? transitions[index + 1].startIndex : points - 1;
    const finalV = transition.kind === 'rise' ? topV : baseV;
    const aberrations = postTransitionAberrations(volts, transition, stopIndex, baseV, topV);
    const ringing = ringingAfter(timesS, volts, transition, stopIndex, finalV, levels.noiseV, RINGING_BAND_SHARE * amplitudeV);
    return {
      kind: transition.kind,
      t10S: transition.t10S,
      t50S: transition.t50S,
      t90S: transition.t90S,
      durationS: transition.durationS,
      overshootPct: aberrations.overshootPct,
      undershootPct: aberrations.undershootPct,
      ringingFrequencyHz: ringing?.frequencyHz ?? null,
    };
  });
  const period = measurePeriodS(transitions);
  const ringingHz = edges.flatMap((edge) => (edge.ringingFrequencyHz === null ? [] : [edge.ringingFrequencyHz]));
  return {
    ...none,
    baseV,
    topV,
    amplitudeV,
    riseTimeS: mean(edges.filter((edge) => edge.kind === 'rise').map((edge) => edge.durationS)),
    fallTimeS: mean(edges.filter((edge) => edge.kind === 'fall').map((edge) => edge.durationS)),
    overshootPct: mean(edges.map((edge) => edge.overshootPct)),
    undershootPct: mean(edges.map((edge) => edge.undershootPct)),
    ringingFrequencyHz:
      ringingHz.length > 0 && ringingHz.length >= RINGING_EDGE_SHARE * edges.length ? median(ringingHz) : null,
    periodS: period,
    frequencyHz: period === null ? null : 1 / period,
    edgeCount: edges.length,
    edges: edges.slice(0, options.maxListedEdges ?? 1000),
    referenceLevels: reference,
  };
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
