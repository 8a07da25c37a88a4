import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { add, divide, magnitude, resistorParallelCapacitor } from './complex';
import { LOW_IMPEDANCE_INPUT_OHM } from './termination-mismatch';
import { eng, percent } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  "Put the probe on the scope's calibrator square wave: spiked or rounded corners there, not only on the circuit, confirm the trimmer.";

/** A compensated passive divider: tip R1 ∥ C1 over the scope end R2 ∥ C2. */
export interface DividerParams {
  /** Tip resistor R1, Ω. */
  tipResistanceOhm: number;
  /** Capacitance across the tip resistor C1, F. */
  tipCapacitanceF: number;
  /** Scope input resistance R2, Ω. */
  inputResistanceOhm: number;
  /** Everything across R2 (cable, trimmer, input) C2, F. */
  inputCapacitanceF: number;
}

export interface DividerLevels {
  /** Fraction the edge jumps to at once, C1/(C1 + C2). */
  jump: number;
  /** Fraction it settles to, R2/(R1 + R2). */
  settle: number;
  /** Time constant of the settling, (R1∥R2)(C1 + C2), in s. */
  timeConstantS: number;
}

/**
 * Step levels of a two-section RC divider driven by an ideal step: charge sharing sets the
 * instant jump C1/(C1+C2); the resistors set the final R2/(R1+R2); the change between them
 * decays with τ = (R1∥R2)(C1+C2). Flat only when R1·C1 = R2·C2.
 * source: circuit analysis of the compensated attenuator (Laplace transform of Z2/(Z1+Z2)).
 */
export function dividerLevels(p: DividerParams): DividerLevels {
  const { tipResistanceOhm: r1, tipCapacitanceF: c1, inputResistanceOhm: r2, inputCapacitanceF: c2 } = p;
  return {
    jump: c1 / (c1 + c2),
    settle: r2 / (r1 + r2),
    timeConstantS: ((r1 * r2) / (r1 + r2)) * (c1 + c2),
  };
}

/**
 * Output/input of the divider for a unit step at t = 0: settle + (jump − settle)·e^(−t/τ)
 * for t ≥ 0, 0 before.
 */
export function compensationStepResponse(p: DividerParams, timesS: readonly number[]): number[] {
  const { jump, settle, timeConstantS } = dividerLevels(p);
  return timesS.map((t) => (t < 0 ? 0 : settle + (jump - settle) * Math.exp(-t / timeConstantS)));
}

/** |Z2/(Z1 + Z2)| with Zi = Ri ∥ 1/(jωCi), over a list of frequencies (Hz). */
export function compensationFrequencyResponse(p: DividerParams, freqsHz: readonly number[]): number[] {
  return freqsHz.map((f) => {
    const z1 = resistorParallelCapacitor(p.tipResistanceOhm, p.tipCapacitanceF, f);
    const z2 = resistorParallelCapacitor(p.inputResistanceOhm, p.inputCapacitanceF, f);
    return magnitude(divide(z2, add(z1, z2)));
  });
}

/** Corner overshoot (+) or undershoot (−) in percent of the settled level, (jump/settle − 1)·100. */
export function cornerOvershootPct(p: DividerParams): number {
  const { jump, settle } = dividerLevels(p);
  return (jump / settle - 1) * 100;
}

/** C1 that balances the divider, R2·C2/R1, in F. */
export function balancingTipCapacitanceF(p: Omit<DividerParams, 'tipCapacitanceF'>): number {
  return (p.inputResistanceOhm * p.inputCapacitanceF) / p.tipResistanceOhm;
}

/**
 * Inverse: C1 that gives an observed corner overshoot, from C1/(C1+C2) = (1 + pct/100)·settle:
 * C1 = j·C2/(1 − j). Undefined when the overshoot is impossible (j ≥ 1 or ≤ 0).
 */
export function tipCapacitanceForOvershootF(p: Omit<DividerParams, 'tipCapacitanceF'>, overshootPct: number): number | undefined {
  const settle = p.inputResistanceOhm / (p.tipResistanceOhm + p.inputResistanceOhm);
  const jump = (1 + overshootPct / 100) * settle;
  if (!(jump > 0 && jump < 1)) return undefined;
  return (jump * p.inputCapacitanceF) / (1 - jump);
}

/**
 * The balanced divider behind a probe whose total tip capacitance is known: in series C1 and
 * C2 give C_tip, and balance gives C1 = C2·R2/R1, so C2 = C_tip·(R1 + R2)/R2.
 */
export function balancedDividerOf(setup: ResolvedSetup): DividerParams {
  const r1 = setup.tipResistanceOhm;
  const r2 = setup.scopeInputResistanceOhm;
  const c2 = (setup.tipCapacitanceF * (r1 + r2)) / r2;
  return { tipResistanceOhm: r1, tipCapacitanceF: (c2 * r2) / r1, inputResistanceOhm: r2, inputCapacitanceF: c2 };
}

const MIN_OVERSHOOT_PCT = 2; // smaller corners are within trace noise (our threshold)
const HIDDEN_TRIMMER_PRIOR = 0.35; // our estimate: probes moved between scopes are often not re-adjusted

/** Compensation candidates: the probe as adjusted, and a mis-adjustment read off the corners. */
export function assessCompensation({ setup, observed }: ModelContext): Candidate[] {
  const applicable = setup.tipResistanceOhm > 0 && setup.scopeInputResistanceOhm >= LOW_IMPEDANCE_INPUT_OHM;
  if (!applicable) {
    return [
      {
        cause: 'compensation',
        basis: 'recorded',
        deviation: 0,
        predicted: setup.hasEdges ? { overshootPct: 0 } : {},
        explanation:
          setup.tipResistanceOhm > 0
            ? 'On a low-impedance input the tip network is swamped by the termination; compensation does not apply.'
            : 'A 1x probe has no divider and no compensation trimmer.',
        confirm: CONFIRM,
        fix: 'Nothing to adjust.',
        detailTags: [],
      },
    ];
  }
  const balanced = balancedDividerOf(setup);
  const levels = dividerLevels(balanced);
  const candidates: Candidate[] = [
    {
      cause: 'compensation',
      basis: 'recorded',
      deviation: 0,
      predicted: setup.hasEdges ? { overshootPct: 0 } : {},
      explanation: `No compensation state is recorded, so the probe is taken as adjusted: R1·C1 = R2·C2 (${eng(balanced.tipResistanceOhm, 'Ω')} · ${eng(balanced.tipCapacitanceF, 'F')} = ${eng(balanced.inputResistanceOhm, 'Ω')} · ${eng(balanced.inputCapacitanceF, 'F')}) and square-wave tops are flat. Out of adjustment, an edge would jump to C1/(C1+C2) and settle to R2/(R1+R2) = ${percent(levels.settle * 100)} with τ ≈ ${eng(levels.timeConstantS, 's')}.`,
      confirm: CONFIRM,
      fix: "Check the probe on the scope's calibrator square wave and turn the trimmer until the top is flat.",
      estimates: { timeConstantS: levels.timeConstantS, balancedTipCapacitanceF: balanced.tipCapacitanceF },
      detailTags: [],
    },
  ];
  const pct = observed.overshootPct;
  if (!setup.hasEdges || pct === undefined || Math.abs(pct) < MIN_OVERSHOOT_PCT) return candidates;
  const c1 = tipCapacitanceForOvershootF(balanced, pct);
  if (c1 === undefined) return candidates;
  const fitted = { ...balanced, tipCapacitanceF: c1 };
  const fittedLevels = dividerLevels(fitted);
  const over = pct > 0;
  const inverse = { tipCapacitanceF: c1, state: over ? 'over-compensated' : 'under-compensated', adjust: over ? 'reduce' : 'increase' };
  candidates[0].estimates = { ...candidates[0].estimates, ...inverse };
  // A square wave much faster than τ never shows the decay, only a shifted level.
  const halfPeriodS = setup.frequencyHz === undefined ? Infinity : 1 / (2 * setup.frequencyHz);
  const visible = halfPeriodS >= fittedLevels.timeConstantS / 20 ? 1 : 0.1;
  candidates.push({
    cause: 'compensation',
    basis: 'fitted',
    hiddenPrior: HIDDEN_TRIMMER_PRIOR * visible,
    deviation: Math.abs(Math.log(1 + pct / 100)),
    predicted: { overshootPct: cornerOvershootPct(fitted) },
    explanation: `Corners that ${over ? 'spike' : 'round off'} by ${percent(Math.abs(pct))} and recover with τ ≈ ${eng(fittedLevels.timeConstantS, 's')} mean the probe is ${over ? 'over' : 'under'}-compensated: the fast divider C1/(C1+C2) passes ${percent(fittedLevels.jump * 100)} against the resistive ${percent(fittedLevels.settle * 100)}, as if C1 were ${eng(c1, 'F')} instead of the ${eng(balanced.tipCapacitanceF, 'F')} that balances R2·C2.`,
    confirm: CONFIRM,
    fix: `On the calibrator square wave, turn the compensation trimmer to ${over ? 'reduce' : 'increase'} the high-frequency gain until the corners are square, with no spike and no rounding.`,
    estimates: {
      timeConstantS: fittedLevels.timeConstantS,
      balancedTipCapacitanceF: balanced.tipCapacitanceF,
      jumpRatio: fittedLevels.jump,
      settleRatio: fittedLevels.settle,
      ...inverse,
    },
    detailTags: [over ? 'over-compensated' : 'under-compensated'],
  });
  return candidates;
}
