import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { add, complex, divide, magnitude, resistorParallelCapacitor } from './complex';
import { cascadeRiseTimeS, riseTimeFromTimeConstantS, squareWaveAmplitudeRatio } from './single-pole';
import { shownRiseTimeS } from './bandwidth';
import { eng, percent } from './wording';
import { clampPlausible } from './plausibility';
import { CONTRADICTION_TOLERANCE_LN } from './evidence';
import { SIGMA } from './scoring';
import { isOneXPassive } from './defaults';
import { SIGNIFICANT_DEVIATION, SIGNIFICANT_IMPROVEMENT } from './verdict';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  'Read the node with a high-impedance meter, or move between 1x and 10x: a level that changes with the probe is being loaded by it.';

export interface LoadingParams {
  /** Thevenin resistance of the node probed, Ω. */
  sourceResistanceOhm: number;
  /** Resistance the probe presents at its tip (R_tip + scope input), Ω. */
  inputResistanceOhm: number;
  /** Capacitance the probe presents at its tip, F. */
  inputCapacitanceF: number;
}

/** DC voltage divider R_in/(R_s + R_in). source: voltage-divider rule. */
export function dcLoadingRatio(p: LoadingParams): number {
  return p.inputResistanceOhm / (p.sourceResistanceOhm + p.inputResistanceOhm);
}

/**
 * AC divider |Z_p/(Z_s + Z_p)| with Z_p = R_in ∥ 1/(jωC) and Z_s = R_s, at one frequency
 * (the DC divider at f = 0). source: voltage-divider rule with complex impedances.
 */
export function loadingRatioAt(p: LoadingParams, frequencyHz: number): number {
  const probe = resistorParallelCapacitor(p.inputResistanceOhm, p.inputCapacitanceF, frequencyHz);
  return magnitude(divide(probe, add(complex(p.sourceResistanceOhm), probe)));
}

/** `loadingRatioAt` over a list of frequencies, for the plots. */
export function loadingFrequencyResponse(p: LoadingParams, freqsHz: readonly number[]): number[] {
  return freqsHz.map((f) => loadingRatioAt(p, f));
}

/** Thevenin resistance the probe capacitance charges through, R_s ∥ R_in, Ω. */
export function loadingResistanceOhm(p: LoadingParams): number {
  const { sourceResistanceOhm: rs, inputResistanceOhm: rin } = p;
  return rs === 0 ? 0 : (rs * rin) / (rs + rin);
}

/** RC corner of the loaded node, 1/(2π (R_s∥R_in) C), in Hz (Infinity for an ideal source). */
export function loadingCornerHz(p: LoadingParams): number {
  return 1 / (2 * Math.PI * loadingResistanceOhm(p) * p.inputCapacitanceF);
}

/** 10–90 % rise time the load alone causes, ln 9·(R_s∥R_in)·C ≈ 2.2 RC, in s. */
export function loadedRiseTimeS(p: LoadingParams): number {
  return riseTimeFromTimeConstantS(loadingResistanceOhm(p) * p.inputCapacitanceF);
}

/**
 * Inverse: the resistive source impedance that leaves a fraction `ratio` of the signal at a
 * frequency. From |Z_p|/|R_s + Z_p| = ratio with Z_p = a + jb: R_s = −a + √(|Z_p|²/ratio² − b²).
 * Undefined when no non-negative R_s fits.
 */
export function impliedSourceResistanceOhm(
  probe: Omit<LoadingParams, 'sourceResistanceOhm'>,
  ratio: number,
  frequencyHz = 0,
): number | undefined {
  const z = resistorParallelCapacitor(probe.inputResistanceOhm, probe.inputCapacitanceF, frequencyHz);
  const inside = (z.re ** 2 + z.im ** 2) / ratio ** 2 - z.im ** 2;
  if (!(ratio > 0) || inside < 0) return undefined;
  const rs = -z.re + Math.sqrt(inside);
  return rs >= 0 ? rs : undefined;
}

/**
 * Loading params of the recorded setup: through a passive (or differential) probe the tip sees
 * R_tip + R_in ∥ C_tip; an active probe's buffer keeps the scope input off the circuit, so the
 * tip sees only the probe's own input.
 */
export function loadingParamsOf(setup: ResolvedSetup, sourceResistanceOhm = setup.sourceResistanceOhm): LoadingParams {
  return {
    sourceResistanceOhm,
    inputResistanceOhm: setup.probeKind === 'active' ? setup.tipResistanceOhm : setup.tipResistanceOhm + setup.scopeInputResistanceOhm,
    inputCapacitanceF: setup.tipCapacitanceF,
  };
}

/** Fraction of the signal's amplitude left by the load, for the signal as recorded. */
export function loadedAmplitudeRatio(setup: ResolvedSetup, p: LoadingParams): number {
  const f = setup.frequencyHz;
  if (f === undefined || setup.signalKind === 'dc' || setup.signalKind === 'pulse') return dcLoadingRatio(p);
  if (setup.signalKind === 'square') {
    return dcLoadingRatio(p) * squareWaveAmplitudeRatio(loadingResistanceOhm(p) * p.inputCapacitanceF, f);
  }
  return loadingRatioAt(p, f);
}

const HIDDEN_SOURCE_PRIOR = 0.25; // our estimate: node impedances are often unknown when filing

/** Loading candidates: the recorded source impedance, and one inferred from the amplitude. */
export function assessLoading({ setup, observed }: ModelContext): Candidate[] {
  if (setup.probeKind === 'current') {
    return [
      {
        cause: 'loading',
        basis: 'recorded',
        deviation: 0,
        predicted: {},
        explanation: 'A current probe closes around the conductor and touches no node, so it loads no voltage in the circuit.',
        confirm: CONFIRM,
        fix: 'Nothing to change.',
        detailTags: [],
      },
    ];
  }
  const candidates = [loadingCandidate(setup, loadingParamsOf(setup), 'recorded')];
  if (!setup.assumed.has('circuit.sourceResistanceOhm')) candidates[0].recordSpread = recordedSourceSpread(setup);
  const expected = setup.expectedAmplitudeV;
  if (expected !== undefined && observed.amplitudeV !== undefined) {
    const ratio = observed.amplitudeV / expected;
    const sineLike = setup.signalKind === 'sine' || setup.signalKind === 'other';
    const atHz = sineLike ? (setup.frequencyHz ?? 0) : 0;
    const raw = ratio > 1e-4 && ratio < 0.95 ? impliedSourceResistanceOhm(loadingParamsOf(setup), ratio, atHz) : undefined;
    if (raw !== undefined) {
      // held to a plausible node impedance: beyond it the clamped fit predicts its own, wrong amplitude
      const { value: fitted, clamped } = clampPlausible('sourceResistanceOhm', raw);
      const recordedSource = !setup.assumed.has('circuit.sourceResistanceOhm');
      const prior = HIDDEN_SOURCE_PRIOR * (fitted <= 1e6 ? 1 : 0.3);
      const candidate = loadingCandidate(setup, loadingParamsOf(setup, fitted), 'fitted');
      candidate.hiddenPrior = prior;
      candidate.estimates = { ...candidate.estimates, impliedSourceResistanceOhm: raw };
      candidates[0].estimates = { ...candidates[0].estimates, impliedSourceResistanceOhm: raw };
      if (recordedSource) {
        candidate.contradictions = [{ field: 'circuit.sourceResistanceOhm', recorded: setup.sourceResistanceOhm, implied: fitted }];
      }
      const heldText = clamped ? ` No plausible node reaches that (above ${eng(fitted, 'Ω')}), so the fit is held there.` : '';
      const recordedText = recordedSource ? ` The case records ${eng(setup.sourceResistanceOhm, 'Ω')}.` : '';
      candidate.explanation = `The observed ${percent(ratio * 100)} of the expected amplitude fits a source impedance of about ${eng(raw, 'Ω')} against the probe's load.${heldText}${recordedText} ${candidate.explanation}`;
      candidates.push(candidate);
    }
  }
  return candidates;
}

/**
 * Whether the load on the recorded source moves the trace beyond that estimate's spread: the
 * level it keeps and the edge it slows, each against the trace without the load (the chain's
 * own edge is the bandwidth's to assert), at the spread `recordedSourceSpread` gives.
 */
export function loadMovesTrace(setup: ResolvedSetup): boolean {
  const { ratio, riseS } = loadedPictureAt(setup, 1);
  const { amplitudeSigma, riseTimeSigma } = recordedSourceSpread(setup);
  const unloadedRiseS = shownRiseTimeS(setup);
  const amplitudeTerm = Math.log(ratio) / amplitudeSigma;
  const riseTerm = setup.hasEdges && unloadedRiseS ? Math.log(riseS / unloadedRiseS) / riseTimeSigma : 0;
  return amplitudeTerm ** 2 > SIGNIFICANT_IMPROVEMENT || riseTerm ** 2 > SIGNIFICANT_IMPROVEMENT;
}

/**
 * How far the loaded picture moves when the recorded source impedance is off by its usual
 * tolerance (e^±0.5, `evidence.ts`): the spread of each predicted quantity, taken in
 * quadrature with a reading's. A recorded impedance is usually an estimate, so what the record
 * asserts through it is judged with that spread.
 */
function recordedSourceSpread(setup: ResolvedSetup): { amplitudeSigma: number; riseTimeSigma: number } {
  const tolerance = CONTRADICTION_TOLERANCE_LN['circuit.sourceResistanceOhm'];
  const middle = loadedPictureAt(setup, 1);
  const ends = [loadedPictureAt(setup, Math.exp(-tolerance)), loadedPictureAt(setup, Math.exp(tolerance))];
  const spread = (pick: (v: typeof middle) => number) => Math.max(...ends.map((end) => (pick(end) > 0 && pick(middle) > 0 ? Math.abs(Math.log(pick(end) / pick(middle))) : 0)));
  return {
    amplitudeSigma: Math.hypot(SIGMA.amplitude, spread((v) => v.ratio)),
    riseTimeSigma: Math.hypot(SIGMA.riseTime, spread((v) => v.riseS)),
  };
}

/** The level kept and the edge shown with the recorded source impedance scaled by `factor`. */
function loadedPictureAt(setup: ResolvedSetup, factor: number): { ratio: number; riseS: number } {
  const p = loadingParamsOf(setup, setup.sourceResistanceOhm * factor);
  return { ratio: loadedAmplitudeRatio(setup, p), riseS: cascadeRiseTimeS([shownRiseTimeS(setup) ?? 0, loadedRiseTimeS(p)]) };
}

function loadingCandidate(setup: ResolvedSetup, p: LoadingParams, basis: Candidate['basis']): Candidate {
  const ratio = loadedAmplitudeRatio(setup, p);
  const dc = dcLoadingRatio(p);
  const corner = loadingCornerHz(p);
  const loadRise = loadedRiseTimeS(p);
  const reference = shownRiseTimeS(setup);
  const loadedEdgeS = setup.hasEdges ? cascadeRiseTimeS([reference ?? 0, loadRise]) : undefined;
  // a load that barely slows what the chain shows leaves the edge to the chain (the bandwidth's
  // picture): predicting the chain's edge here would let loading stand in for bandwidth
  const riseTimeS = loadedEdgeS !== undefined && reference && Math.log(loadedEdgeS / reference) <= SIGNIFICANT_DEVIATION ? undefined : loadedEdgeS;
  const riseDeviation = edgeDeviation(setup, loadedEdgeS, reference);
  const expected = setup.expectedAmplitudeV;
  const oneX = isOneXPassive(setup);

  const cornerText = Number.isFinite(corner) ? `the RC corner is ${eng(corner, 'Hz')}` : 'an ideal source has no RC corner';
  let text = `The probe loads the ${eng(p.sourceResistanceOhm, 'Ω')} source with ${eng(p.inputResistanceOhm, 'Ω')} ∥ ${eng(p.inputCapacitanceF, 'F')}: the DC divider keeps ${percent(dc * 100)} of the signal and ${cornerText}.`;
  if (setup.frequencyHz !== undefined && setup.signalKind !== 'dc') {
    text += ` At ${eng(setup.frequencyHz, 'Hz')} ${percent(ratio * 100)} of the amplitude reaches the scope.`;
  }
  if (setup.hasEdges) text += ` The load alone slows edges to about ${eng(loadRise, 's')} (2.2·RC).`;

  const tags: string[] = [];
  if (oneX) tags.push('1x-probe-loading');
  if (p.sourceResistanceOhm >= 10e3) tags.push('high-impedance-node');
  if (setup.frequencyHz !== undefined && setup.frequencyHz > corner) tags.push('rc-loading');

  return {
    cause: 'loading',
    basis,
    deviation: Math.hypot(Math.log(ratio), riseDeviation),
    predicted: { amplitudeV: expected === undefined ? undefined : expected * ratio, riseTimeS },
    explanation: text,
    confirm: CONFIRM,
    fix: oneX
      ? 'Use a 10x probe (about 10 MΩ and 12 pF) or an active probe on this node; a 1x probe puts its cable capacitance on the circuit.'
      : setup.probeKind === 'active'
        ? 'Probe a lower-impedance point such as a buffered test point, or an active probe with less input capacitance; for DC levels, allow for the divider R_in/(R_s + R_in).'
        : 'Probe a lower-impedance point such as a buffered test point, or use an active probe with less capacitance; for DC levels, allow for the divider R_in/(R_s + R_in).',
    estimates: {
      dcRatio: dc,
      ...(Number.isFinite(corner) ? { cornerFrequencyHz: corner } : {}),
      loadedRiseTimeS: loadRise,
      amplitudeRatio: ratio,
    },
    detailTags: tags,
  };
}

/**
 * How much slower the load makes edges, in log units: against the signal's own edge when it
 * is recorded; otherwise as a share of the half period (an unrecorded edge is not ideal, so
 * it is not compared with zero); 0 when neither is known.
 */
function edgeDeviation(setup: ResolvedSetup, loadedS: number | undefined, referenceS: number | undefined): number {
  if (loadedS === undefined) return 0;
  if (setup.signalRiseTimeS !== undefined && referenceS) return Math.log(loadedS / referenceS);
  if (setup.frequencyHz !== undefined) return Math.log(1 + 2 * (loadedS - (referenceS ?? 0)) * setup.frequencyHz);
  return 0;
}
