import type { Predicted } from '../schemas/diagnosis';
import type { ResolvedSetup } from './types';
import { shownRiseTimeS, systemRiseTimeS } from './bandwidth';
import { bandwidthFromRiseTimeHz } from './single-pole';
import { eng } from './wording';

/**
 * The reference picture: what a correct measurement of the recorded signal shows through the
 * recorded chain. The expected amplitude (the channel setting matches the probe, the probe is
 * compensated and correctly terminated, nothing loads the node); edges no faster than the
 * chain's own rise time added in quadrature to the signal's (a real effect every chain has);
 * flat tops, no overshoot, no ringing, no hum; the signal's own frequency.
 */
export function faithfulPicture(setup: ResolvedSetup): Predicted {
  const periodic = setup.frequencyHz !== undefined && setup.signalKind !== 'dc';
  const picture: Predicted = {};
  if (setup.expectedAmplitudeV !== undefined) picture.amplitudeV = setup.expectedAmplitudeV;
  if (setup.hasEdges) {
    const rise = shownRiseTimeS(setup);
    if (rise !== undefined && rise > 0) picture.riseTimeS = rise;
    picture.overshootPct = 0;
    if (periodic) picture.tiltPct = 0;
  }
  if (periodic) picture.frequencyHz = setup.frequencyHz;
  return picture;
}

/** The bench action that tells a true trace from a measurement error. */
export const FAITHFUL_CONFIRM =
  'Measure the same node another way (a meter for a DC level, a second probe on another channel, or the probe on the calibrator first): the same reading confirms the circuit, not the measurement, is doing it.';

/** Words for the faithful hypothesis. */
export function faithfulWording(setup: ResolvedSetup): { explanation: string; fix: string } {
  const system = systemRiseTimeS(setup);
  const chain =
    system === undefined
      ? ''
      : ` The recorded chain (about ${eng(bandwidthFromRiseTimeHz(system), 'Hz')}, ${eng(system, 's')} rise time) is part of this picture: edges faster than that show at its rise time.`;
  return {
    explanation: `The recorded setup predicts what was seen: the probe ratio matches the channel, the input and compensation are right for the probe, and no model moves the trace beyond what readings and typical values allow. The trace is true.${chain}`,
    fix: 'Nothing to change in the measurement: debug the circuit itself.',
  };
}
