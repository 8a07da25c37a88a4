import type { Series } from './series';
import type { Transition } from './transitions';

/** Post-transition aberrations of one transition, in percent of the amplitude. */
export interface Aberrations {
  /** How far the waveform goes past the state it enters, %. */
  overshootPct: number;
  /** How far it then swings back short of that state, %. */
  undershootPct: number;
}

/**
 * Post-transition overshoot and undershoot (IEEE Std 181-2011 aberration definitions):
 * overshoot = 100·(extreme beyond the final state level − that level)/amplitude, taken over the
 * post-transition region; undershoot = 100·(the level − the extreme on the near side)/amplitude
 * over the same region once the waveform has reached the level (before that, the samples on the
 * near side are the end of the transition itself, not an aberration). Both are reported as
 * zero rather than negative, so an overdamped edge reads 0 % overshoot.
 *
 * The region runs from the end of the transition to the start of the next one (or the end of
 * the record), which for a clock is the whole settled half-period.
 *
 * @param volts samples, V
 * @param transition the transition, from `findTransitions`
 * @param stopIndex last sample of the post-transition region
 * @param baseV low state level, V
 * @param topV high state level, V
 */
export function postTransitionAberrations(
  volts: Series,
  transition: Transition,
  stopIndex: number,
  baseV: number,
  topV: number,
): Aberrations {
  const amplitudeV = topV - baseV;
  const rising = transition.kind === 'rise';
  const finalV = rising ? topV : baseV;
  // Work in the direction of the transition so one loop serves both kinds.
  const sign = rising ? 1 : -1;
  const state = EXTREMES;
  state[0] = Number.NEGATIVE_INFINITY;
  state[1] = Number.POSITIVE_INFINITY;
  state[2] = 0;
  state[3] = sign;
  state[4] = finalV;
  volts.scan(transition.endIndex, stopIndex + 1, extremesAboutState);
  const beyondV = state[0];
  const shortV = state[1];
  const reached = state[2] === 1;
  return {
    overshootPct: Math.max(0, (100 * beyondV) / amplitudeV),
    undershootPct: reached ? Math.max(0, (-100 * shortV) / amplitudeV) : 0,
  };
}

// [beyond, short, 1 once the level is reached, sign, final level] and its visitor, made once:
// one edge is measured at a time
const EXTREMES = new Float64Array(5);
const extremesAboutState = (values: Float64Array) => extremesAbout(values, EXTREMES[3], EXTREMES[4], EXTREMES);

/** The excursions beyond and, once there, short of `finalV` in the direction `sign` (a module-level pass, as `scan` asks). */
function extremesAbout(values: Float64Array, sign: number, finalV: number, state: Float64Array): void {
  let beyondV = state[0];
  let shortV = state[1];
  let reached = state[2] === 1;
  for (let i = 0; i < values.length; i++) {
    const excessV = sign * (values[i] - finalV);
    if (excessV > beyondV) beyondV = excessV;
    if (excessV >= 0) reached = true;
    if (reached && excessV < shortV) shortV = excessV;
  }
  state[0] = beyondV;
  state[1] = shortV;
  state[2] = reached ? 1 : 0;
}
