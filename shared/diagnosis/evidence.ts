import type { Contradiction } from './types';
import type { Term } from './scoring';

/**
 * How far, in natural-log units, an inferred value may sit from a recorded one before that
 * counts as one standard deviation (our estimates): lead lengths are recorded roughly and
 * ringing pins them only to ±50 % (f ∝ 1/√L); source impedances are usually estimates; input
 * resistances and probe ratios are read off a menu or a marking.
 */
export const CONTRADICTION_TOLERANCE_LN: Record<string, number> = {
  'probe.groundLeadM': 0.5,
  'circuit.sourceResistanceOhm': 0.5,
  'scope.inputResistanceOhm': 0.1,
  // DC coupling off the channel menu, as a corner of 0 Hz: read off a menu as the input resistance is
  'scope.coupling': 0.1,
  // a switchable probe's position is the value most often recorded wrongly
  'probe.attenuation': Math.log(10),
  'probe.tipCapacitanceF': 0.3,
};
const DEFAULT_TOLERANCE_LN = 0.3;

/** Values at or below this are floored before taking a log ratio (0 Ω, 0 m). */
const FLOOR = 1e-3;

/**
 * Recorded values are evidence: each contradiction becomes a residual ln(implied/recorded)
 * judged by the field's tolerance, so a fit that needs a 90 cm lead where 1 cm was recorded
 * is charged ((ln 90)/0.5)² ≈ 81 in χ² and fails the fit gate, while a fit within the
 * tolerance pays little. Adding a contradiction can only add χ², never remove it.
 */
export function contradictionTerms(contradictions: readonly Contradiction[] | undefined): Term[] {
  return (contradictions ?? []).map((c) => {
    const recorded = Math.max(FLOOR, Math.abs(c.recorded));
    const implied = Math.max(FLOOR, Math.abs(c.implied));
    return {
      quantity: c.field,
      residual: Math.log(implied / recorded),
      sigma: c.toleranceLn ?? CONTRADICTION_TOLERANCE_LN[c.field] ?? DEFAULT_TOLERANCE_LN,
    };
  });
}
