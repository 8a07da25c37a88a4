import type { Predicted } from '../schemas/diagnosis';

/** One member of a combined hypothesis: what it predicts, over the reference picture. */
export interface Member {
  predicted: Predicted;
  overshootUpperBound?: boolean;
}

/** Quantities carried by the member that changes them (overshoot, ringing, tilt, frequency, hum). */
const FEATURES = ['overshootPct', 'ringingFrequencyHz', 'tiltPct', 'frequencyHz', 'humFrequencyHz'] as const;

const differs = (value: number | undefined, reference: number | undefined) =>
  value !== undefined && (reference === undefined || Math.abs(value - reference) > 1e-9 * Math.max(1, Math.abs(reference)));

/**
 * Two causes acting together through the measurement chain, composed field by field so any
 * model's prediction joins without special cases:
 * - amplitude: each member's ratio to the reference multiplies (dividers and gains in cascade);
 * - rise time: each member's extra stage adds in quadrature, t² = t_ref² + Σ(tᵢ² − t_ref²)
 *   (source: root-sum-square rise-time rule for cascaded stages);
 * - overshoot, ringing, tilt, frequency, hum: from the member that changes them (the first
 *   when both do);
 * - spike: a voltage on the screen, so it is scaled by the other member's amplitude ratio.
 */
export function composePredictions(reference: Predicted, a: Member, b: Member): { predicted: Predicted; overshootUpperBound: boolean } {
  const predicted: Predicted = {};
  const refAmp = reference.amplitudeV;
  const ratioOf = (m: Member) =>
    refAmp !== undefined && refAmp > 0 && m.predicted.amplitudeV !== undefined ? m.predicted.amplitudeV / refAmp : 1;
  if (refAmp !== undefined) predicted.amplitudeV = refAmp * ratioOf(a) * ratioOf(b);

  const refRise = reference.riseTimeS;
  const ra = a.predicted.riseTimeS ?? refRise;
  const rb = b.predicted.riseTimeS ?? refRise;
  if (ra !== undefined && rb !== undefined) {
    const base = refRise ?? 0;
    const squared = ra * ra + rb * rb - base * base;
    predicted.riseTimeS = squared > 0 ? Math.max(Math.sqrt(squared), Math.min(ra, rb)) : Math.min(ra, rb);
  } else if (ra !== undefined || rb !== undefined) predicted.riseTimeS = ra ?? rb;

  let overshootUpperBound = false;
  for (const key of FEATURES) {
    const from = differs(a.predicted[key], reference[key]) ? a : differs(b.predicted[key], reference[key]) ? b : undefined;
    const value = from ? from.predicted[key] : reference[key];
    if (value !== undefined) predicted[key] = value;
    if (key === 'overshootPct' && from) overshootUpperBound = Boolean(from.overshootUpperBound);
  }
  // the ringing and its overshoot come from the same member
  const ringer = differs(a.predicted.ringingFrequencyHz, reference.ringingFrequencyHz) ? a : differs(b.predicted.ringingFrequencyHz, reference.ringingFrequencyHz) ? b : undefined;
  if (ringer?.predicted.overshootPct !== undefined) {
    predicted.overshootPct = ringer.predicted.overshootPct;
    overshootUpperBound = Boolean(ringer.overshootUpperBound);
  }

  const spikeA = a.predicted.spikeV;
  const spikeB = b.predicted.spikeV;
  if (spikeA !== undefined) predicted.spikeV = spikeA * ratioOf(b);
  else if (spikeB !== undefined) predicted.spikeV = spikeB * ratioOf(a);
  return { predicted, overshootUpperBound };
}
