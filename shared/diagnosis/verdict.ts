import type { Verdict } from '../schemas/diagnosis';

/**
 * Upper 5 % points of the chi-square distribution, χ²₀.₉₅(k) for k = 1…10 degrees of freedom.
 * source: NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.4 (critical values of the
 * chi-square distribution).
 */
export const CHI_SQUARE_95 = [3.841, 5.991, 7.815, 9.488, 11.07, 12.592, 14.067, 15.507, 16.919, 18.307] as const;

/**
 * The fit gate. Residuals are divided by the models' stated accuracy (`SIGMA` in scoring.ts),
 * so for a hypothesis that is right each (r/σ)² is about one draw of a squared unit normal and
 * their sum follows χ² with one degree of freedom per compared quantity. A hypothesis fits
 * when its χ² is under the 95 % point for that many quantities: a right model fails the gate
 * one time in twenty, and the gate widens as more is compared instead of punishing detail.
 * With nothing compared, χ² = 0 and everything passes.
 */
export function fitGate(count: number): number {
  if (count <= 0) return 0;
  if (count <= CHI_SQUARE_95.length) return CHI_SQUARE_95[count - 1];
  // Wilson–Hilferty approximation beyond the table. source: Wilson & Hilferty (1931)
  const z = 1.6449;
  const t = 1 - 2 / (9 * count) + z * Math.sqrt(2 / (9 * count));
  return count * t ** 3;
}

/**
 * A cause fits *significantly better* than the faithful reading when its χ² is lower by more
 * than χ²₀.₉₅(1) = 3.84: a likelihood-ratio test for the one parameter a cause adds (a switch
 * position, a lead, a source impedance). source: Wilks' theorem, as in any likelihood-ratio test.
 */
export const SIGNIFICANT_IMPROVEMENT = CHI_SQUARE_95[0];

/**
 * A predicted error this large (log units, about 10 %) counts even where the prediction cannot
 * be put in numbers, e.g. a ×10 mismatch with no expected amplitude recorded (our threshold).
 */
export const SIGNIFICANT_DEVIATION = Math.log(1.1);

export interface Fitness {
  /** The faithful hypothesis passes the gate. */
  faithfulFits: boolean;
  faithfulChiSquare: number;
  /** χ² of each fitting cause hypothesis (single or combined). */
  fittingCauseChiSquares: number[];
  /** Anything was observed to compare with. */
  observed: boolean;
  /** With nothing observed: the recorded setup itself predicts an error beyond significance. */
  setupPredictsError: boolean;
}

/**
 * `faithful` when the faithful reading fits and no fitting cause is significantly better;
 * `measurement-error` when some cause fits and the faithful reading does not, or a cause is
 * significantly better; `unexplained` when nothing fits. With nothing observed nothing can be
 * compared, so the verdict says what the recorded setup predicts: an error when some recorded
 * cause moves the trace beyond the models' accuracy, else faithful — the honest reading of a
 * setup that has not been looked at yet.
 */
export function decideVerdict(f: Fitness): Verdict {
  if (!f.observed) return f.setupPredictsError ? 'measurement-error' : 'faithful';
  const bestCause = f.fittingCauseChiSquares.length ? Math.min(...f.fittingCauseChiSquares) : undefined;
  if (f.faithfulFits) {
    if (bestCause !== undefined && f.faithfulChiSquare - bestCause > SIGNIFICANT_IMPROVEMENT) return 'measurement-error';
    return 'faithful';
  }
  return bestCause !== undefined ? 'measurement-error' : 'unexplained';
}
