import type { Predicted } from '../schemas/diagnosis';
import type { Candidate, ModelContext, Observed, ResolvedSetup } from './types';
import { compensationPicture } from './compensation-picture';
import { compare } from './scoring';
import { isPlausible, PLAUSIBLE } from './plausibility';
import { TYPICAL } from './defaults';
import { add, divide, magnitude, resistorParallelCapacitor } from './complex';
import { LOW_IMPEDANCE_INPUT_OHM } from './termination-mismatch';
import { eng, percent, withArticle } from './wording';

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

/** Smaller errors are within trace noise (our threshold, % of the level). */
const MIN_ERROR = 0.02;
const HIDDEN_TRIMMER_PRIOR = 0.35; // our estimate: probes moved between scopes are often not re-adjusted
const TYPICAL_TRIMMER_ERROR = 0.5; // our estimate: the prior halves for every ~35 % of mis-trim
/**
 * The input capacitance a probe is taken to have been compensated on when only the scope it
 * is used with now is recorded: a general-purpose 1 MΩ input (common practice, 10–20 pF).
 */
export const DESIGN_INPUT_CAPACITANCE_F = TYPICAL.scopeInputCapacitanceF;

/**
 * The probe as it sits on the recorded scope. Compensated, unless the scope's input
 * capacitance is recorded and differs from the input the probe is taken to have been adjusted
 * on (`DESIGN_INPUT_CAPACITANCE_F`): moving a probe changes C2 by the difference.
 */
export function recordedDividerOf(setup: ResolvedSetup): { divider: DividerParams; deltaC2F: number } {
  const balanced = balancedDividerOf(setup);
  const recordedInput = !setup.assumed.has('scope.inputCapacitanceF');
  const deltaC2F = recordedInput ? setup.scopeInputCapacitanceF - DESIGN_INPUT_CAPACITANCE_F : 0;
  return { divider: { ...balanced, inputCapacitanceF: balanced.inputCapacitanceF + deltaC2F }, deltaC2F };
}

/** The divider whose edges jump to (1 + k) of the settled level, C1 = j·C2/(1 − j) with j = (1 + k)·settle. */
function dividerWithError(base: DividerParams, k: number): DividerParams | undefined {
  const settle = base.inputResistanceOhm / (base.tipResistanceOhm + base.inputResistanceOhm);
  const jump = (1 + k) * settle;
  if (!(jump > 0 && jump < 1)) return undefined;
  return { ...base, tipCapacitanceF: (jump * base.inputCapacitanceF) / (1 - jump) };
}

const errorOf = (d: DividerParams) => {
  const { jump, settle } = dividerLevels(d);
  return jump / settle - 1;
};

function predictedFor(setup: ResolvedSetup, d: DividerParams): Predicted {
  const pic = compensationPicture(setup, d);
  const expected = setup.expectedAmplitudeV;
  return {
    ...(expected === undefined ? {} : { amplitudeV: expected * pic.amplitudeRatio }),
    ...(pic.overshootPct === undefined ? {} : { overshootPct: pic.overshootPct }),
    ...(pic.tiltPct === undefined ? {} : { tiltPct: pic.tiltPct }),
  };
}

/**
 * The trimmer error that best explains the amplitude, corners and tilt seen, searched over the
 * plausible range (`PLAUSIBLE.compensationError`); undefined when nothing it predicts was seen.
 */
function fitError(setup: ResolvedSetup, observed: Observed, base: DividerParams): number | undefined {
  const seen: Observed = {
    amplitudeV: setup.expectedAmplitudeV === undefined ? undefined : observed.amplitudeV,
    overshootPct: observed.overshootPct,
    tiltPct: observed.tiltPct,
  };
  if (seen.amplitudeV === undefined && seen.overshootPct === undefined && seen.tiltPct === undefined) return undefined;
  const { min, max }: { min: number; max: number } = PLAUSIBLE.compensationError;
  const cost = (k: number) => {
    const d = dividerWithError(base, k);
    return d ? compare(predictedFor(setup, d), seen).chiSquare : Infinity;
  };
  let bestK = 0;
  let bestCost = Infinity;
  for (let step = (max - min) / 200, lo = min, hi = max, round = 0; round < 3; round++, step /= 40) {
    for (let k = lo; k <= hi + 1e-12; k += step) {
      const c = cost(k);
      if (c < bestCost) [bestK, bestCost] = [k, c];
    }
    [lo, hi] = [Math.max(min, bestK - step), Math.min(max, bestK + step)];
  }
  return bestK;
}

/** Compensation candidates: the probe as it sits on the recorded scope, and a trimmer error read off the trace. */
export function assessCompensation({ setup, observed }: ModelContext): Candidate[] {
  // the trimmer belongs to a passive divider; a buffered or clamp-on probe's network is set where it is built
  const passive = setup.probeKind === 'passive';
  const applicable = passive && setup.tipResistanceOhm > 0 && setup.scopeInputResistanceOhm >= LOW_IMPEDANCE_INPUT_OHM;
  if (!applicable) {
    return [
      {
        cause: 'compensation',
        basis: 'recorded',
        deviation: 0,
        predicted: setup.hasEdges ? { overshootPct: 0 } : {},
        explanation: !passive
          ? `${withArticle(setup.probeKind)} probe has no compensation trimmer for the user: its input network is set at the factory, so a trimmer error does not apply.`
          : setup.tipResistanceOhm > 0
            ? 'On a low-impedance input the tip network is swamped by the termination; compensation does not apply.'
            : 'A 1x probe has no divider and no compensation trimmer.',
        confirm: CONFIRM,
        fix: 'Nothing to adjust.',
        detailTags: [],
      },
    ];
  }
  const { divider, deltaC2F } = recordedDividerOf(setup);
  const recordedK = errorOf(divider);
  const levels = dividerLevels(divider);
  const moved = Math.abs(recordedK) >= 1e-6;
  const movedText = moved
    ? ` The probe is taken to have been adjusted on a ${eng(DESIGN_INPUT_CAPACITANCE_F, 'F')} input (a typical one; no earlier scope is recorded); this scope's ${eng(setup.scopeInputCapacitanceF, 'F')} changes C2 by ${eng(deltaC2F, 'F')}, so edges jump to ${percent((1 + recordedK) * 100)} of the settled level until the trimmer is turned again.`
    : '';
  const candidates: Candidate[] = [
    {
      cause: 'compensation',
      basis: 'recorded',
      deviation: Math.abs(Math.log(1 + recordedK)),
      predicted: setup.hasEdges || moved ? predictedFor(setup, divider) : {},
      explanation: moved
        ? `A compensated probe keeps R₁C₁ = R₂C₂.${movedText} Signals much faster than τ ≈ ${eng(levels.timeConstantS, 's')} show that capacitive ratio as an amplitude error with flat tops; slower ones show it at the corners.`
        : `No compensation state is recorded, so the probe is taken as adjusted: R₁C₁ = R₂C₂ (${eng(divider.tipResistanceOhm, 'Ω')} · ${eng(divider.tipCapacitanceF, 'F')} = ${eng(divider.inputResistanceOhm, 'Ω')} · ${eng(divider.inputCapacitanceF, 'F')}) and square-wave tops are flat. Out of adjustment, an edge would jump to C₁/(C₁ + C₂) and settle to R₂/(R₁ + R₂) = ${percent(levels.settle * 100)} with τ ≈ ${eng(levels.timeConstantS, 's')}; signals much faster than τ would show the capacitive ratio as an amplitude error.`,
      confirm: CONFIRM,
      fix: "Check the probe on this scope's calibrator square wave and turn the trimmer until the top is flat.",
      estimates: { timeConstantS: levels.timeConstantS, balancedTipCapacitanceF: balancedDividerOf(setup).tipCapacitanceF, ...(moved ? { scopeChangeDeltaC2F: deltaC2F, jumpRatio: levels.jump, settleRatio: levels.settle } : {}) },
      detailTags: moved ? ['probe-moved-between-scopes'] : [],
    },
  ];
  if (setup.signalKind === 'dc' || (!setup.hasEdges && setup.frequencyHz === undefined)) return candidates;
  const k = fitError(setup, observed, divider);
  if (k === undefined || Math.abs(k) < MIN_ERROR) return candidates;
  const fitted = dividerWithError(divider, k) as DividerParams;
  if (!isPlausible('tipCapacitanceF', fitted.tipCapacitanceF)) return candidates;
  const fittedLevels = dividerLevels(fitted);
  const over = k > 0;
  const inverse = { tipCapacitanceF: fitted.tipCapacitanceF, state: over ? 'over-compensated' : 'under-compensated', adjust: over ? 'reduce' : 'increase' };
  const fast = setup.frequencyHz !== undefined && 1 / (2 * setup.frequencyHz) < fittedLevels.timeConstantS / 5;
  const seenAs = fast
    ? `a ${percent(Math.abs(k) * 100)} ${over ? 'higher' : 'lower'} amplitude with flat tops: a ${setup.frequencyHz === undefined ? '' : `${eng(setup.frequencyHz, 'Hz')} `}signal is far faster than τ ≈ ${eng(fittedLevels.timeConstantS, 's')}, so it only ever sees the capacitive ratio`
    : `corners that ${over ? 'spike' : 'round off'} by about ${percent(Math.abs(k) * 100)} and recover with τ ≈ ${eng(fittedLevels.timeConstantS, 's')}`;
  candidates.push({
    cause: 'compensation',
    basis: 'fitted',
    // a probe moved between scopes is off by a few percent; a large error needs a trimmer turned far
    hiddenPrior: HIDDEN_TRIMMER_PRIOR * Math.exp(-Math.abs(k) / TYPICAL_TRIMMER_ERROR),
    deviation: Math.abs(Math.log(1 + k)),
    predicted: predictedFor(setup, fitted),
    explanation: `The trace fits a probe ${over ? 'over' : 'under'}-compensated by ${percent(Math.abs(k) * 100)}: ${seenAs}. The fast divider C₁/(C₁ + C₂) passes ${percent(fittedLevels.jump * 100)} against the resistive ${percent(fittedLevels.settle * 100)}, as if C1 were ${eng(fitted.tipCapacitanceF, 'F')} instead of the ${eng(divider.tipCapacitanceF, 'F')} that balances R2·C2.`,
    confirm: CONFIRM,
    fix: `On the calibrator square wave, turn the compensation trimmer to ${over ? 'reduce' : 'increase'} the high-frequency gain until the corners are square, with no spike and no rounding.`,
    estimates: {
      timeConstantS: fittedLevels.timeConstantS,
      balancedTipCapacitanceF: divider.tipCapacitanceF,
      jumpRatio: fittedLevels.jump,
      settleRatio: fittedLevels.settle,
      ...inverse,
    },
    detailTags: [over ? 'over-compensated' : 'under-compensated'],
  });
  return candidates;
}
