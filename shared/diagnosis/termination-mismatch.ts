import type { Risk } from '../schemas/diagnosis';
import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng, factor, percent, withArticle } from './wording';
import { add, complex, divide, magnitude, resistorParallelCapacitor } from './complex';
import { shownRiseTimeS } from './bandwidth';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  "Look at the channel's input impedance menu; switch it to 1 MΩ and the amplitude should jump back to the expected level.";

/** Inputs below this are terminations, not high-impedance inputs (our threshold). */
export const LOW_IMPEDANCE_INPUT_OHM = 1000;

/** Usual rating of a 50 Ω scope input: 5 V rms, which is 0.5 W. common practice */
export const FIFTY_OHM_INPUT_LIMIT = { rmsV: 5, powerW: 0.5 } as const;

/**
 * Attenuation a passive probe really gives into a low-impedance input:
 * (R_tip + R_in)/R_in, e.g. (9 MΩ + 50 Ω)/50 Ω = 180,001.
 * source: resistive voltage divider.
 *
 * @param tipResistanceOhm the probe's series tip resistor, Ω
 * @param inputResistanceOhm the scope input it drives, Ω
 */
export function terminatedAttenuation(tipResistanceOhm: number, inputResistanceOhm: number): number {
  return (tipResistanceOhm + inputResistanceOhm) / inputResistanceOhm;
}

/**
 * Fraction of the open-circuit signal across the scope input: R_in/(R_s + R_tip + R_in).
 * source: resistive voltage divider.
 */
export function inputFraction(sourceResistanceOhm: number, tipResistanceOhm: number, inputResistanceOhm: number): number {
  return inputResistanceOhm / (sourceResistanceOhm + tipResistanceOhm + inputResistanceOhm);
}

/** Power dissipated in a resistive input, P = V²/R, in W. source: Joule's law. */
export function inputPowerW(rmsV: number, inputResistanceOhm: number): number {
  return (rmsV * rmsV) / inputResistanceOhm;
}

/** A passive probe into a low-impedance input: Z1 = R_tip ∥ C1 over Z2 = R_in ∥ C2, fed from R_s. */
export interface TerminationDivider {
  /** Probe ratio n the divider was built for. */
  ratio: number;
  tipResistanceOhm: number;
  /** C1 = n·C_tip/(n − 1), F (Infinity for a 1x probe, a plain wire). */
  tipSideCapacitanceF: number;
  inputResistanceOhm: number;
  /** C2 = n·C_tip, F: cable, trimmer and input the probe was compensated with. */
  inputSideCapacitanceF: number;
  sourceResistanceOhm: number;
}

/**
 * The compensated probe behind a tip capacitance: C1 in series with C2 gives C_tip, and
 * compensation gives C1/(C1 + C2) = 1/n, so C1 = n·C_tip/(n − 1) and C2 = n·C_tip.
 * source: series capacitors and the compensated-divider condition R1·C1 = R2·C2.
 */
export function terminationDividerOf(setup: ResolvedSetup, inputResistanceOhm = setup.scopeInputResistanceOhm): TerminationDivider {
  const n = setup.probeAttenuation;
  const ct = setup.tipCapacitanceF;
  return {
    ratio: n,
    tipResistanceOhm: setup.tipResistanceOhm,
    tipSideCapacitanceF: n > 1 ? (n * ct) / (n - 1) : Infinity,
    inputResistanceOhm,
    inputSideCapacitanceF: n > 1 ? n * ct : ct,
    sourceResistanceOhm: setup.sourceResistanceOhm,
  };
}

/**
 * |V_in/V_s| = |Z2/(R_s + Z1 + Z2)| at a frequency (the DC divider R_in/(R_s + R_tip + R_in) at 0).
 * source: voltage divider with complex impedances, Zi = Ri ∥ 1/(jωCi).
 */
export function terminationMagnitudeAt(d: TerminationDivider, frequencyHz: number): number {
  const z2 = resistorParallelCapacitor(d.inputResistanceOhm, d.inputSideCapacitanceF, frequencyHz);
  const z1 = Number.isFinite(d.tipSideCapacitanceF) && d.tipResistanceOhm > 0
    ? resistorParallelCapacitor(d.tipResistanceOhm, d.tipSideCapacitanceF, frequencyHz)
    : complex(0);
  return magnitude(divide(z2, add(complex(d.sourceResistanceOhm), add(z1, z2))));
}

export interface TerminationEdge {
  /** Fraction of an edge that comes through at once, C1/(C1 + C2) (1/n for a compensated probe). */
  jump: number;
  /** Fraction the trace settles to, R_in/(R_s + R_tip + R_in). */
  settle: number;
  /** Decay of the spike, (R_tip ∥ R_in)·(C1 + C2) ≈ 50 Ω·(C1 + C2), s. */
  timeConstantS: number;
}

/**
 * An ideal edge through the divider: charge sharing passes C1/(C1 + C2) at once, which then
 * decays with τ = (R_tip ∥ R_in)(C1 + C2) to the resistive ratio. The source resistance only
 * delays the jump by R_s·C_tip and is left out. source: Laplace analysis of Z2/(Z1 + Z2)
 * (initial- and final-value theorems).
 */
export function terminationEdge(d: TerminationDivider): TerminationEdge {
  const settle = d.inputResistanceOhm / (d.sourceResistanceOhm + d.tipResistanceOhm + d.inputResistanceOhm);
  if (!Number.isFinite(d.tipSideCapacitanceF) || d.tipResistanceOhm <= 0) return { jump: settle, settle, timeConstantS: 0 };
  const c = d.tipSideCapacitanceF + d.inputSideCapacitanceF;
  const r = (d.tipResistanceOhm * d.inputResistanceOhm) / (d.tipResistanceOhm + d.inputResistanceOhm);
  return { jump: d.tipSideCapacitanceF / c, settle, timeConstantS: r * c };
}

/**
 * Share of the ideal spike left by an edge of 10–90 % time t_r (a ramp of T = t_r/0.8 into a
 * decay τ peaks at (τ/T)(1 − e^(−T/τ)) of the step response's jump). source: convolution of a
 * ramp with an exponential decay.
 */
export function spikeEdgeFactor(timeConstantS: number, edgeRiseTimeS: number | undefined): number {
  if (!edgeRiseTimeS || timeConstantS <= 0) return 1;
  const rampS = edgeRiseTimeS / 0.8;
  return (timeConstantS / rampS) * -Math.expm1(-rampS / timeConstantS);
}

/** Flat tops need the spike to have died: half a period at least this many τ (our threshold). */
const FLAT_TOP_TIME_CONSTANTS = 5;

/**
 * What the screen shows, relative to the true amplitude, with the channel set for the probe
 * (a wrong channel setting is the attenuation-mismatch cause): ×n × the divider. For a sine,
 * |H(f)|; for edges, the settled flat top R_in/(R_s + R_tip + R_in) and a spike of
 * C1/(C1 + C2) per edge; for a square too fast to settle, |H| at its fundamental.
 */
export function terminationPicture(setup: ResolvedSetup, inputResistanceOhm = setup.scopeInputResistanceOhm): { ratio: number; spikeRatio?: number; edge: TerminationEdge } {
  const d = terminationDividerOf(setup, inputResistanceOhm);
  const edge = terminationEdge(d);
  const gain = setup.probeAttenuation;
  const f = setup.frequencyHz;
  // a needle a few ns wide is cut by the edge that makes it and by the chain that shows it:
  // both in quadrature, as for any edge on the screen
  const edgeRiseS = shownRiseTimeS(setup);
  if (setup.hasEdges) {
    const halfPeriodS = f === undefined ? Infinity : 1 / (2 * f);
    if (halfPeriodS >= FLAT_TOP_TIME_CONSTANTS * edge.timeConstantS) {
      const spike = edge.jump > edge.settle * 1.01 ? edge.jump * spikeEdgeFactor(edge.timeConstantS, edgeRiseS) * gain : undefined;
      return { ratio: edge.settle * gain, spikeRatio: spike, edge };
    }
    if (edge.timeConstantS > 0 && edge.jump > edge.settle * 1.01) {
      // Too fast to settle: the capacitive divider is a first-order high-pass, and a square's
      // steady state swings 2·g·A/(1 + e^(−T/2τ)) peak to peak (g = C1/(C1+C2)); its needles are
      // what the screen shows. source: first-order high-pass step response, steady state
      const x = halfPeriodS / edge.timeConstantS;
      const spikeFactor = spikeEdgeFactor(edge.timeConstantS, edgeRiseS);
      const peakToPeak = (2 * edge.jump * spikeFactor) / (1 + Math.exp(-x));
      return { ratio: peakToPeak * gain, spikeRatio: edge.jump * spikeFactor * gain, edge };
    }
  }
  const atHz = f !== undefined && setup.signalKind !== 'dc' ? f : 0;
  return { ratio: terminationMagnitudeAt(d, atHz) * gain, edge };
}

/** Shown ÷ true amplitude for the recorded setup on a given input (the old name, kept for the plots). */
export function terminationShownRatio(setup: ResolvedSetup, inputResistanceOhm = setup.scopeInputResistanceOhm): number {
  return terminationPicture(setup, inputResistanceOhm).ratio;
}

const HIDDEN_FIFTY_OHM_PRIOR = 0.15; // our estimate: the input menu is rarely recorded wrongly
const MATCH_TOLERANCE = 0.3; // ln units, ±35 %
const NEEDLE_SIGMA = 0.1; // ln units: a lumped divider predicts needle heights within about 10 % (our estimate)

/** Termination candidates: the recorded input, and a 50 Ω input the record missed. */
export function assessTermination({ setup, observed }: ModelContext): Candidate[] {
  const rin = setup.scopeInputResistanceOhm;
  const expected = setup.expectedAmplitudeV;
  if (rin < LOW_IMPEDANCE_INPUT_OHM) return [lowImpedance(setup, rin, 'recorded')];

  const candidates: Candidate[] = [
    {
      cause: 'termination-mismatch',
      basis: 'recorded',
      deviation: 0,
      predicted: { amplitudeV: expected },
      explanation: `The input is ${eng(rin, 'Ω')}, the high-impedance setting passive probes are built for, so there is no termination error.`,
      confirm: CONFIRM,
      fix: 'Nothing to change; if an amplitude is thousands of times too small, check that the input menu really reads 1 MΩ and not 50 Ω.',
      detailTags: [],
    },
  ];
  if (expected !== undefined && observed.amplitudeV !== undefined && setup.probeKind === 'passive') {
    const fiftyRatio = terminationShownRatio(setup, 50);
    // Only worth suggesting when a 50 Ω input would change what the scope shows.
    const distinct = Math.abs(Math.log(fiftyRatio)) > MATCH_TOLERANCE;
    if (distinct && Math.abs(Math.log(observed.amplitudeV / expected / fiftyRatio)) < MATCH_TOLERANCE) {
      const hidden = lowImpedance(setup, 50, 'fitted');
      hidden.hiddenPrior = HIDDEN_FIFTY_OHM_PRIOR;
      hidden.explanation = `The observed amplitude fits a 50 Ω input, not the ${eng(rin, 'Ω')} recorded. ${hidden.explanation}`;
      if (!setup.assumed.has('scope.inputResistanceOhm')) {
        hidden.contradictions = [{ field: 'scope.inputResistanceOhm', recorded: rin, implied: 50 }];
      }
      candidates.push(hidden);
    }
  }
  return candidates;
}

function lowImpedance(setup: ResolvedSetup, rin: number, basis: Candidate['basis']): Candidate {
  const expected = setup.expectedAmplitudeV;
  if (setup.probeKind !== 'passive') {
    return {
      cause: 'termination-mismatch',
      basis,
      deviation: 0,
      predicted: { amplitudeV: expected },
      explanation: `${withArticle(setup.probeKind)} probe is normally built to drive a ${eng(rin, 'Ω')} input, so the termination is taken as right.`,
      confirm: CONFIRM,
      fix: "Check the probe's data sheet for the input impedance it expects.",
      detailTags: [],
    };
  }
  const { ratio: shown, spikeRatio, edge } = terminationPicture(setup, rin);
  const rtip = setup.tipResistanceOhm;
  const actualRatio = terminatedAttenuation(rtip, rin);
  const numbers = expected === undefined ? '' : ` (${eng(expected * shown, 'V')} instead of ${eng(expected, 'V')})`;
  const d = terminationDividerOf(setup, rin);
  const atHz = setup.frequencyHz;
  let explanation: string;
  if (rtip > 0) {
    explanation = `A ${factor(setup.probeAttenuation)}x passive probe is built to divide into 1 MΩ. Into ${eng(rin, 'Ω')} it becomes a divider of R_tip ∥ C1 (${eng(rtip, 'Ω')} ∥ ${eng(d.tipSideCapacitanceF, 'F')}) over ${eng(rin, 'Ω')} ∥ C2 (${eng(d.inputSideCapacitanceF, 'F')}): at DC it divides by (R_tip + R_in)/R_in = ${factor(actualRatio)}, but above a few kHz C1 sets the ratio.`;
    if (spikeRatio !== undefined) {
      explanation += ` Each edge comes through as a spike of about ${percent(spikeRatio * 100)} of the step on the screen's scale, decaying with τ = ${eng(edge.timeConstantS, 's')}, over flat tops at 1/${factor(1 / shown)} of the signal${numbers}.`;
    } else {
      explanation += ` ${atHz && setup.signalKind !== 'dc' ? `At ${eng(atHz, 'Hz')}` : 'Here'} the scope shows ${shown < 1 ? `1/${factor(1 / shown)}` : factor(shown)} of the signal${numbers}; the shape is not kept, since the ratio changes with frequency.`;
    }
  } else {
    explanation = `The ${eng(rin, 'Ω')} input loads the ${eng(setup.sourceResistanceOhm, 'Ω')} source directly, so the scope shows ${percent(shown * 100)} of the open-circuit signal${numbers}.`;
  }
  const fix =
    rtip > 0
      ? 'Set the channel input to 1 MΩ for a passive high-impedance probe; keep 50 Ω for coax from 50 Ω sources and for probes designed for a 50 Ω input.'
      : 'Use the 1 MΩ input (and a 10x probe) on high-impedance nodes; the 50 Ω input suits 50 Ω sources fed by coax.';
  const tags = [Math.abs(rin - 50) <= 10 ? '50-ohm-input' : 'low-impedance-input'];
  if (rtip > 0) tags.push('passive-probe-into-50-ohm');
  return {
    cause: 'termination-mismatch',
    basis,
    deviation: Math.abs(Math.log(shown)),
    predicted: {
      amplitudeV: expected === undefined ? undefined : expected * shown,
      ...(spikeRatio !== undefined && expected !== undefined ? { spikeV: expected * spikeRatio } : {}),
    },
    // needle heights follow the edge's shape and the channel's bandwidth (our estimate: ±10 %)
    ...(spikeRatio !== undefined ? { amplitudeSigma: NEEDLE_SIGMA } : {}),
    explanation,
    confirm: CONFIRM,
    fix,
    estimates: {
      actualAttenuation: actualRatio,
      shownToTrueRatio: shown,
      inputResistanceOhm: rin,
      tipSideCapacitanceF: d.tipSideCapacitanceF,
      inputSideCapacitanceF: d.inputSideCapacitanceF,
      ...(edge.timeConstantS > 0 ? { spikeTimeConstantS: edge.timeConstantS, spikeRatio: edge.jump * setup.probeAttenuation } : {}),
    },
    detailTags: tags,
    risks: basis === 'recorded' ? overloadRisks(setup, rin) : undefined,
  };
}

/**
 * Worst case for the input's power rating: the amplitude across the input treated as a DC
 * level (its rms can be no larger), against 5 V rms / 0.5 W.
 */
function overloadRisks(setup: ResolvedSetup, rin: number): Risk[] {
  if (setup.expectedAmplitudeV === undefined) return [];
  const volts = setup.expectedAmplitudeV * inputFraction(setup.sourceResistanceOhm, setup.tipResistanceOhm, rin);
  const watts = inputPowerW(volts, rin);
  if (volts <= FIFTY_OHM_INPUT_LIMIT.rmsV && watts <= FIFTY_OHM_INPUT_LIMIT.powerW) return [];
  return [
    {
      id: 'low-impedance-input-overload',
      level: 'caution',
      message: `Up to ${eng(volts, 'V')} (${eng(watts, 'W')}) could reach the ${eng(rin, 'Ω')} input, above the usual 5 V rms / 0.5 W rating: reduce the signal or add an attenuator before connecting.`,
    },
  ];
}
