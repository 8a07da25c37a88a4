import type { Predicted } from '../schemas/diagnosis';
import type { ResolvedSetup } from './types';
import { shownRiseTimeS, systemRiseTimeS } from './bandwidth';
import { bandwidthFromRiseTimeHz } from './single-pole';
import { eng } from './wording';

/**
 * The reference picture: the recorded signal as it truly is, as far as the record says. The
 * expected amplitude (the channel setting matches the probe, the probe is compensated and
 * correctly terminated, nothing loads the node); the signal's own edge when it is recorded,
 * else the recorded chain's own rise time (an ideal edge shows at the chain's rise time, a
 * real effect every chain has: a matched 10x probe on a 500 MHz scope shows 0.7 ns); flat
 * tops, no overshoot, no ringing, no hum; the signal's own frequency. A chain that slows a
 * recorded edge beyond the models' accuracy is the bandwidth cause, not the true trace.
 */
export function faithfulPicture(setup: ResolvedSetup): Predicted {
  const periodic = setup.frequencyHz !== undefined && setup.signalKind !== 'dc';
  const picture: Predicted = {};
  if (setup.expectedAmplitudeV !== undefined) picture.amplitudeV = setup.expectedAmplitudeV;
  if (setup.hasEdges) {
    const rise = setup.signalRiseTimeS ?? shownRiseTimeS(setup);
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

/**
 * Words for the faithful hypothesis. When the recorded setup itself predicts an error on what was
 * observed (`contradicted`: a 10x probe recorded on a 1x channel), a true trace would need a
 * recorded value to be wrong, and the words say that instead of vouching for the setup.
 */
export function faithfulWording(setup: ResolvedSetup, contradicted: readonly { explanation: string }[] = []): { explanation: string; fix: string } {
  if (contradicted.length > 0) {
    return {
      explanation: `What was seen is what the signal itself would show, but the recorded setup does not allow a true trace. ${contradicted.map((c) => c.explanation).join(' ')} For the trace to be true, a recorded value must be wrong.`,
      fix: "Check the recorded settings at the bench (the probe's switch, the channel's attenuation and input menus, the generator's load setting), correct the record and diagnose again.",
    };
  }
  const system = systemRiseTimeS(setup);
  const chain =
    system === undefined
      ? ''
      : setup.signalRiseTimeS === undefined
        ? ` The recorded chain (about ${eng(bandwidthFromRiseTimeHz(system), 'Hz')}, ${eng(system, 's')} rise time) is part of this picture: edges faster than that show at its rise time.`
        : ` The recorded chain (about ${eng(bandwidthFromRiseTimeHz(system), 'Hz')}, ${eng(system, 's')} rise time) shows the ${eng(setup.signalRiseTimeS, 's')} edge as it is.`;
  return {
    explanation: `The recorded setup predicts what was seen: the probe ratio matches the channel, the input and compensation are right for the probe, and no model moves the trace beyond what readings and typical values allow. The trace is true.${chain}`,
    fix: 'Nothing to change in the measurement: debug the circuit itself.',
  };
}
