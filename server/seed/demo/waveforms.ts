import { compensationStepResponse, dividerLevels, tipCapacitanceForOvershootF, type DividerParams } from '../../../shared/diagnosis/compensation';
import { groundLeadStepResponse } from '../../../shared/diagnosis/ground-lead';
import { TYPICAL } from '../../../shared/diagnosis/defaults';
import { gaussian, mulberry32, seedFrom } from './prng';
import type { DemoWave } from './types';

export interface DemoTrace {
  timesS: Float64Array;
  /** What the scope recorded: the model plus seeded noise. */
  volts: Float64Array;
  /** The noise-free model, drawn dashed over the capture. */
  modelVolts: Float64Array;
}

const POINTS = 2500;

/** A step response normalised to settle at 1, as a function of time since the step (s). */
type StepResponse = (sinceS: readonly number[]) => number[];

const singlePole = (timeConstantS: number): StepResponse => (ts) =>
  ts.map((t) => (t < 0 ? 0 : timeConstantS > 0 ? 1 - Math.exp(-t / timeConstantS) : 1));

/**
 * A 10x passive probe like the bay's (9 MΩ tip into 1 MΩ, 11 pF at the tip) whose trimmer is off
 * by what the corner overshoot says, via the engine's own divider model.
 */
function misadjustedDivider(overshootPct: number): StepResponse {
  const r1 = (TYPICAL.probeAttenuation - 1) * TYPICAL.probeDesignInputOhm;
  const r2 = TYPICAL.scopeInputResistanceOhm;
  const c2 = (11e-12 * (r1 + r2)) / r2;
  const c1 = tipCapacitanceForOvershootF({ tipResistanceOhm: r1, inputResistanceOhm: r2, inputCapacitanceF: c2 }, overshootPct);
  const p: DividerParams = { tipResistanceOhm: r1, tipCapacitanceF: c1 ?? (c2 * r2) / r1, inputResistanceOhm: r2, inputCapacitanceF: c2 };
  const { settle } = dividerLevels(p);
  return (ts) => compensationStepResponse(p, ts).map((v) => v / settle);
}

/**
 * The series-RLC ring of a ground lead, driven by a linear ramp of 10–90 % time `edgeS`
 * (ramp length edgeS/0.8), approximated as the mean of 24 step responses spread over the ramp.
 */
function ringingLead(w: Extract<DemoWave, { shape: 'ground-lead' }>): StepResponse {
  const p = { sourceResistanceOhm: w.sourceResistanceOhm, inductanceH: w.inductanceH, capacitanceF: w.capacitanceF };
  const rampS = w.edgeS / 0.8;
  const slices = 24;
  return (ts) => {
    const sum = new Array<number>(ts.length).fill(0);
    for (let i = 0; i < slices; i++) {
      const shift = ((i + 0.5) / slices) * rampS;
      groundLeadStepResponse(p, ts.map((t) => t - shift)).forEach((v, k) => (sum[k] += v / slices));
    }
    return sum;
  };
}

/** A square wave (or one edge) as a sum of alternating steps through `response`. */
function squareThrough(timesS: Float64Array, response: StepResponse, levelV: number, baseV: number, firstEdgeS: number, periodS?: number): Float64Array {
  const out = new Float64Array(timesS.length).fill(baseV);
  const span = timesS[timesS.length - 1];
  const edges: number[] = [];
  if (periodS === undefined) edges.push(firstEdgeS);
  else for (let e = firstEdgeS; e <= span; e += periodS / 2) edges.push(e);
  const ts = Array.from(timesS);
  edges.forEach((edge, k) => {
    const sign = k % 2 === 0 ? 1 : -1;
    response(ts.map((t) => t - edge)).forEach((v, i) => (out[i] += sign * (levelV - baseV) * v));
  });
  return out;
}

function modelOf(w: DemoWave, timesS: Float64Array): Float64Array {
  const firstEdgeS = 0.1 * w.spanS;
  switch (w.shape) {
    case 'edge':
      return squareThrough(timesS, singlePole(w.timeConstantS), w.levelV, w.baseV ?? 0, firstEdgeS, w.periodS);
    case 'compensation':
      return squareThrough(timesS, misadjustedDivider(w.overshootPct), w.levelV, 0, firstEdgeS, w.periodS);
    case 'ground-lead':
      // more of the trace before the edge, as one triggers on a ringing edge, so both levels show
      return squareThrough(timesS, ringingLead(w), w.levelV, 0, 0.25 * w.spanS);
    case 'sine':
      return timesS.map((t) => (w.offsetV ?? 0) + (w.amplitudeV / 2) * Math.sin(2 * Math.PI * w.frequencyHz * t));
    case 'dc':
      return timesS.map((t) => w.levelV + (w.humV ?? 0) * Math.sin(2 * Math.PI * (w.humHz ?? 50) * t));
  }
}

/** The capture of a demo case: evenly sampled, the same for the same key on every run. */
export function demoTrace(key: string, wave: DemoWave): DemoTrace {
  const dt = wave.spanS / (POINTS - 1);
  const timesS = Float64Array.from({ length: POINTS }, (_, i) => i * dt);
  const modelVolts = modelOf(wave, timesS);
  const noise = gaussian(mulberry32(seedFrom(key)));
  const volts = modelVolts.map((v) => v + wave.noiseV * noise());
  return { timesS, volts, modelVolts };
}

/** `time_s,voltage_v` rows, six significant digits: what a scope's CSV export looks like. */
export function traceCsv(trace: DemoTrace): Buffer {
  const rows = ['time_s,voltage_v'];
  for (let i = 0; i < trace.timesS.length; i++) rows.push(`${trace.timesS[i].toExponential(5)},${trace.volts[i].toPrecision(6)}`);
  return Buffer.from(`${rows.join('\n')}\n`);
}
