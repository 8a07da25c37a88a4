import { CAUSE_LABELS, type DiagnosisInput, type Hypothesis } from '../schemas/diagnosis';
import { diagnosisPlot } from './curves';
import { eng, inSentence } from './wording';

/** The parts of a capture analysis the overlay is placed by (a stored analysis has them). */
export interface OverlayAnchor {
  baseV: number | null;
  topV: number | null;
  edges: { kind: 'rise' | 'fall'; t10S: number; t50S: number; t90S: number }[];
}

/**
 * A hypothesis's predicted trace in the capture's own time and voltage: `timesS` ascending,
 * absolute capture time in s; `volts` in V. `label` is the legend entry, `summary` says in a
 * sentence what was drawn and how it was placed.
 */
export interface CaptureOverlay {
  label: string;
  summary: string;
  timesS: number[];
  volts: number[];
}

export type CaptureOverlayResult = { ok: true; overlay: CaptureOverlay } | { ok: false; reason: string };

const LN9 = Math.log(9);

/** Causes whose prediction is a height on the screen: drawn as the level the top would reach. */
const LEVEL_CAUSES: ReadonlySet<Hypothesis['cause']> = new Set(['attenuation-mismatch', 'termination-mismatch', 'clipping', 'common-mode', 'generator-load']);
/** Causes that predict a frequency, a droop or hum, not an edge: compared in numbers, not drawn over a capture. */
const NO_EDGE_CAUSES: ReadonlySet<Hypothesis['cause']> = new Set(['aliasing', 'ac-coupling', 'mains-pickup']);

/** First time the ascending-in-time curve reaches `level`, linearly interpolated; undefined when it never does. */
function crossingS(x: readonly number[], y: readonly number[], level: number): number | undefined {
  for (let i = 1; i < x.length; i++) {
    if (y[i - 1] < level && y[i] >= level) return x[i - 1] + ((level - y[i - 1]) / (y[i] - y[i - 1])) * (x[i] - x[i - 1]);
  }
  return undefined;
}

/** A unit step response shape on its own grid (t = 0 at the edge), with what it stands for. */
interface UnitShape {
  x: number[];
  unit: number[];
  label: string;
  what: string;
}

function unitShape(input: DiagnosisInput, hypothesis: Hypothesis): UnitShape | { reason: string } {
  const name = CAUSE_LABELS[hypothesis.cause];
  const plot = diagnosisPlot(input, hypothesis.cause, hypothesis);
  if (plot?.kind === 'line' && plot.xUnit === 's') {
    const model = plot.series.find((s) => s.role === 'model');
    if (!model) return { reason: `the ${inSentence(name)} model draws no step here` };
    const startV = model.values[0];
    // the mean over the last tenth: a lightly damped ring may not have died out by the plot's end
    const tail = model.values.slice(Math.floor(model.values.length * 0.9));
    const finalV = tail.reduce((sum, v) => sum + v, 0) / tail.length;
    if (!(Math.abs(finalV - startV) > 0)) return { reason: `the ${inSentence(name)} model predicts no step` };
    // the shape only: the capture's own levels give the scale
    return { x: plot.x, unit: model.values.map((v) => (v - startV) / (finalV - startV)), label: model.label.replace(/^Model: /, ''), what: plot.title };
  }
  const riseS = hypothesis.predicted.riseTimeS;
  if ((hypothesis.cause === 'bandwidth' || hypothesis.cause === 'loading') && riseS !== undefined && riseS > 0) {
    // A frequency-response model read in time: one pole with the predicted 10–90 % rise time,
    // t_r = τ·ln 9. source: standard first-order step response.
    const tauS = riseS / LN9;
    const x = Array.from({ length: 481 }, (_, i) => (i - 40) * (tauS / 60));
    return { x, unit: x.map((t) => (t <= 0 ? 0 : -Math.expm1(-t / tauS))), label: `single-pole edge, rise time ${eng(riseS, 's')}`, what: `${name}: predicted edge` };
  }
  return { reason: `the ${inSentence(name)} model predicts no edge shape for this setup` };
}

/**
 * Places the engine's top hypothesis over a capture. Shape models (the compensation divider's
 * step, the ground-lead ringing, a bandwidth or loading edge) are scaled from the capture's
 * base to its top level and shifted so the model's 50 % point sits on the first rising edge's
 * t50 (the first edge, mirrored, when the capture only falls); they run until the next edge
 * starts. Amplitude models (attenuation, termination, clipping, common mode, generator load) say only how tall the trace should be,
 * so they are drawn as a level: base + the predicted amplitude, across the capture.
 *
 * @param input the case's setup as the engine reads it (`diagnosisInputFromSetup`)
 * @param hypothesis the engine's top hypothesis for that setup
 * @param anchor the capture's levels (V) and edges (s)
 * @param extent first and last sample time of the capture, s
 */
export function captureOverlay(input: DiagnosisInput, hypothesis: Hypothesis, anchor: OverlayAnchor, extent: { startS: number; endS: number }): CaptureOverlayResult {
  const { baseV, topV } = anchor;
  if (baseV === null || topV === null || !(topV > baseV)) return { ok: false, reason: 'the capture has no two levels to scale a model to' };
  // only ever inside a sentence here
  const name = inSentence(CAUSE_LABELS[hypothesis.cause]);
  if (hypothesis.cause === 'faithful') return { ok: false, reason: 'the engine reads the trace as true, so there is no error to draw over it' };
  if (NO_EDGE_CAUSES.has(hypothesis.cause)) {
    return { ok: false, reason: `the ${name} model predicts a frequency, droop or hum rather than an edge, so it is compared in numbers (see its plot) and not drawn over the capture` };
  }
  if (hypothesis.cause === 'termination-mismatch') {
    const drawn = terminationOverlay(input, hypothesis, anchor, extent);
    if (drawn) return { ok: true, overlay: drawn };
  }
  if (LEVEL_CAUSES.has(hypothesis.cause)) {
    const predictedV = hypothesis.predicted.amplitudeV;
    if (predictedV === undefined) return { ok: false, reason: 'record the expected amplitude so the engine can predict how tall the trace should be' };
    const levelV = baseV + predictedV;
    return {
      ok: true,
      overlay: {
        label: `Model (${name}): predicted top at ${eng(levelV, 'V')}`,
        summary: `The ${name} hypothesis predicts an amplitude of ${eng(predictedV, 'V')}; the dashed line marks where the top would be, against ${eng(topV - baseV, 'V')} measured.`,
        timesS: [extent.startS, extent.endS],
        volts: [levelV, levelV],
      },
    };
  }
  const index = anchor.edges.findIndex((e) => e.kind === 'rise');
  const edgeIndex = index >= 0 ? index : 0;
  const edge = anchor.edges[edgeIndex];
  if (!edge) return { ok: false, reason: 'the capture has no edge to align a model with' };
  const shape = unitShape(input, hypothesis);
  if ('reason' in shape) return { ok: false, reason: shape.reason };
  const modelT50S = crossingS(shape.x, shape.unit, 0.5);
  if (modelT50S === undefined) return { ok: false, reason: `the ${name} model never reaches half its step` };
  const shiftS = edge.t50S - modelT50S;
  const fromS = edgeIndex > 0 ? anchor.edges[edgeIndex - 1].t90S : extent.startS;
  const next = anchor.edges[edgeIndex + 1];
  const untilS = next ? next.t10S : extent.endS;
  const amplitudeV = topV - baseV;
  const toVolts = (u: number) => (edge.kind === 'rise' ? baseV + amplitudeV * u : topV - amplitudeV * u);
  const timesS: number[] = [];
  const volts: number[] = [];
  const push = (t: number, u: number) => {
    if (t < fromS || t > untilS || (timesS.length > 0 && t <= timesS[timesS.length - 1])) return;
    timesS.push(t);
    volts.push(toVolts(u));
  };
  push(fromS, 0);
  shape.x.forEach((t, i) => push(t + shiftS, shape.unit[i]));
  // settled beyond the model's own span, until the next edge
  push(untilS, 1);
  if (timesS.length < 2) return { ok: false, reason: 'the model falls outside the capture' };
  return {
    ok: true,
    overlay: {
      label: `Model (${name}): ${shape.label}`,
      summary: `${shape.what}, scaled to the capture's ${eng(baseV, 'V')} base and ${eng(topV, 'V')} top and aligned at the 50 % point of the ${edge.kind === 'rise' ? 'first rising' : 'first'} edge (${eng(edge.t50S, 's')}).`,
      timesS,
      volts,
    },
  };
}

/**
 * Termination draws the spikes it predicts in volts, not a shape stretched to the capture's
 * levels: from the capture's base, the model's screen voltage after each rising edge, which
 * starts at the edge's 10 % time. Undefined when the model draws no edge for this setup.
 */
function terminationOverlay(input: DiagnosisInput, hypothesis: Hypothesis, anchor: OverlayAnchor, extent: { startS: number; endS: number }): CaptureOverlay | undefined {
  const plot = diagnosisPlot(input, 'termination-mismatch', hypothesis);
  if (plot?.kind !== 'line' || plot.xUnit !== 's' || plot.yUnit !== 'V') return undefined;
  const model = plot.series.find((s) => s.role === 'model');
  const rises = anchor.edges.filter((e) => e.kind === 'rise');
  if (!model || rises.length === 0 || anchor.baseV === null) return undefined;
  const baseV = anchor.baseV;
  const timesS: number[] = [extent.startS];
  const volts: number[] = [baseV];
  for (const edge of rises) {
    plot.x.forEach((t, i) => {
      const at = edge.t10S + t;
      if (at > timesS[timesS.length - 1] && at <= extent.endS) {
        timesS.push(at);
        volts.push(baseV + model.values[i]);
      }
    });
  }
  return {
    label: `Model (${inSentence(CAUSE_LABELS['termination-mismatch'])}): spikes at each rising edge`,
    summary: `${plot.summary} Drawn from the capture's ${eng(baseV, 'V')} base at each rising edge.`,
    timesS,
    volts,
  };
}
