import { countBetween } from './passes';
import type { StateLevels } from './levels';
import type { Series } from './series';
import type { Transition } from './transitions';

export type WaveShape = 'square' | 'pulse' | 'step' | 'sine' | 'dc' | 'other';

export interface ShapeInputs {
  volts: Series;
  levels: StateLevels;
  transitions: Transition[];
  periodS: number | null;
  noiseV: number;
  /** Share of the AC power (mean removed) in the strongest spectral line and its neighbours. */
  fundamentalShare: number | null;
  clipped: boolean;
  meanV: number;
  stdV: number;
  /** Fast edges between flats that droop too much for two histogram peaks (heavy AC coupling). */
  drooped?: boolean;
}

// Share of samples within 10 % of the range of either state that makes a two-level waveform:
// a sine has 41 % there (2·arccos(0.8)/π), a square with edges of a fifth of its period 80 %.
const TWO_LEVEL_SHARE = 0.7;
const SINE_POWER_SHARE = 0.92;
// A sine spends 41 % of its time near its extremes; a square rounded by one pole that settles
// within its half period (τ ≤ T/12) spends more than 55 % there, however sine-like its spectrum.
const ROUNDED_SQUARE_SHARE = 0.55;
const CLIPPED_SINE_POWER_SHARE = 0.8;
// A clipped trace this close to two levels is a square clipped at its rails, not a clipped sine (74 % at twice the rails).
const CLIPPED_SQUARE_SHARE = 0.85;
const DC_RIPPLE_SHARE = 0.02;
const DC_NOISE_MULTIPLE = 8;

/**
 * Names the waveform for the engine (`signal.kind` and its check): 'dc' when the trace varies
 * by less than 2 % of its level or less than 8 noise rms from peak to peak; 'square', 'pulse' or
 * 'step' when at least 70 % of the samples sit near the two state levels (by duty cycle between
 * 30 and 70 %, by a repeating train otherwise, by a single edge); 'sine' when 92 % of the AC
 * power is in one spectral line (80 % for a clipped trace, whose flat tops add harmonics); a
 * clipped trace is a square only when 85 % of it sits at the two levels (a sine clipped at half
 * its amplitude has 74 % there), as its flats are the rails, not its states; else 'other'.
 */
export function classifyShape(input: ShapeInputs): WaveShape {
  const { volts, levels, transitions, periodS, noiseV, fundamentalShare, clipped, meanV, stdV, drooped } = input;
  const rangeV = levels.maxV - levels.minV;
  if (!(rangeV > 0)) return 'dc';
  if (stdV <= DC_RIPPLE_SHARE * Math.abs(meanV) || rangeV <= DC_NOISE_MULTIPLE * noiseV) return 'dc';
  // the count near the states is the same for every test below: one pass over the record, made only if needed
  let near: number | undefined;
  const isTwoLevel = (share: number) => (near ??= countNearStates(volts, levels)) >= share * volts.length;
  if (clipped && !isTwoLevel(CLIPPED_SQUARE_SHARE)) {
    return fundamentalShare !== null && fundamentalShare >= CLIPPED_SINE_POWER_SHARE ? 'sine' : 'other';
  }
  // a square puts at most 81 % of its power in the fundamental (8/π²), less with sharp edges;
  // a sine clipped at half its amplitude still has 95 % there
  // (and repeats: a single step's spectrum also crowds into its lowest bins)
  const sineLike =
    fundamentalShare !== null && fundamentalShare >= SINE_POWER_SHARE && periodS !== null && !(transitions.length > 1 && isTwoLevel(ROUNDED_SQUARE_SHARE));
  if (!sineLike && transitions.length > 0 && (drooped || (levels.twoStates && isTwoLevel(TWO_LEVEL_SHARE)))) {
    if (transitions.length === 1) return 'step';
    if (periodS === null) return transitions.length === 2 ? 'pulse' : 'other';
    const duty = dutyCycle(transitions, periodS);
    return duty !== null && duty >= 0.3 && duty <= 0.7 ? 'square' : 'pulse';
  }
  if (sineLike) return 'sine';
  return 'other';
}

/** The samples within 10 % of the range of either state (of the extremes without two states). */
function countNearStates(volts: Series, levels: StateLevels): number {
  const bandV = 0.1 * (levels.maxV - levels.minV);
  const lowV = (levels.twoStates ? levels.baseV : levels.minV) + bandV;
  const highV = (levels.twoStates ? levels.topV : levels.maxV) - bandV;
  const between = new Float64Array(1);
  volts.scan(0, volts.length, (values) => countBetween(values, lowV, highV, between));
  return volts.length - between[0];
}

/** Mean time high (rise mid to next fall mid) over the period. */
function dutyCycle(transitions: Transition[], periodS: number): number | null {
  const highs: number[] = [];
  for (let i = 0; i + 1 < transitions.length; i++) {
    if (transitions[i].kind === 'rise' && transitions[i + 1].kind === 'fall') highs.push(transitions[i + 1].t50S - transitions[i].t50S);
  }
  if (highs.length === 0) return null;
  return highs.reduce((a, b) => a + b, 0) / highs.length / periodS;
}
