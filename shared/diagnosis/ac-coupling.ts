import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng, percent } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  'Switch the channel to DC coupling and look again: tops that stop drooping and a level that comes back came from the coupling capacitor.';

/**
 * AC-coupling corner with a low-impedance source when the case does not record one, Hz.
 * common practice: general-purpose 1 MΩ inputs state a few Hz to about 10 Hz; the upper
 * figure is used so the droop is not understated.
 */
export const TYPICAL_AC_CORNER_HZ = 10;

/**
 * Corner of the coupling capacitor C with everything in series with the input resistor:
 * f = 1/(2π·(R_s + R_tip + R_in)·C) = f_c·R_in/(R_s + R_tip + R_in), with f_c = 1/(2π·R_in·C)
 * the data-sheet corner for a low-impedance source. A 10x probe's 9 MΩ lowers it tenfold.
 * source: first-order RC high-pass, f_c = 1/(2πRC); at these frequencies the probe's
 * compensation capacitor is an open circuit, so its tip resistor is in series.
 *
 * @param cornerHz data-sheet corner with a low-impedance source, Hz
 * @param inputResistanceOhm scope input resistance, Ω
 * @param seriesResistanceOhm probe tip resistor plus source resistance, Ω
 */
export function effectiveAcCornerHz(cornerHz: number, inputResistanceOhm: number, seriesResistanceOhm: number): number {
  return (cornerHz * inputResistanceOhm) / (seriesResistanceOhm + inputResistanceOhm);
}

/**
 * Magnitude of a first-order high-pass, |H| = f/√(f² + f_c²); 0 at DC.
 * source: H(jω) = jωτ/(1 + jωτ), τ = 1/(2π f_c).
 */
export function highPassMagnitude(frequencyHz: number, cornerHz: number): number {
  return frequencyHz / Math.sqrt(frequencyHz ** 2 + cornerHz ** 2);
}

/**
 * Droop across each flat top of a symmetric square wave through a first-order high-pass, in
 * steady state, as a fraction of the step: tanh(T/(4τ)) with T = 1/f and τ = 1/(2π f_c),
 * i.e. tanh(π·f_c/(2f)). Each edge passes whole (a jump of A); over the half period T/2 the
 * level decays by e^(−T/2τ) toward 0; symmetry makes the top start at A/(1 + e^(−T/2τ)), so
 * the droop is A·(1 − e^(−T/2τ))/(1 + e^(−T/2τ)) = A·tanh(T/4τ). For small T/τ this is the
 * handbook tilt π·f_c/f of the half amplitude.
 * source: steady-state response of a single-pole RC high-pass to a square wave (derived
 * above; checked against an ngspice transient in tests).
 */
export function squareWaveTiltFraction(frequencyHz: number, cornerHz: number): number {
  return Math.tanh((Math.PI * cornerHz) / (2 * frequencyHz));
}

/** Inverse of `squareWaveTiltFraction`: the corner that droops a square of f by `tilt` (0–1), f_c = 2f·atanh(tilt)/π. */
export function cornerForTiltHz(tiltFraction: number, frequencyHz: number): number {
  return (2 * frequencyHz * Math.atanh(tiltFraction)) / Math.PI;
}

/** Inverse of `highPassMagnitude`: the corner that leaves `ratio` of a sine, f_c = f·√(1/ratio² − 1). */
export function cornerForSineRatioHz(ratio: number, frequencyHz: number): number {
  return frequencyHz * Math.sqrt(1 / ratio ** 2 - 1);
}

/**
 * Resistance in series with the scope input below a few kHz: source plus tip resistor for a
 * passive probe; an active, differential or current probe drives the input from its own
 * low-impedance output, taken as 0 Ω.
 */
export const acSeriesResistanceOhm = (setup: ResolvedSetup): number =>
  setup.probeKind === 'passive' ? setup.sourceResistanceOhm + setup.tipResistanceOhm : 0;
const seriesOhm = acSeriesResistanceOhm;

/** A scope's own AC-coupling corner fitted outside this range is not plausible (our bounds, Hz). */
const PLAUSIBLE_CORNER_HZ = { low: 0.05, high: 2e3 } as const;
/** Tilt below this (%) is within the reading of a flat top (our threshold). */
const VISIBLE_TILT_PCT = 0.5;
// our estimates: how often an unrecorded coupling or corner explains droop
const HIDDEN_COUPLING_PRIOR = { acCornerUnrecorded: 0.5, acCornerRecorded: 0.2, dcRecordedOrUnsaid: 0.15 } as const;

/** AC-coupling candidates: the recorded coupling, and a corner implied by observed droop or sine loss. */
export function assessAcCoupling({ setup, observed }: ModelContext): Candidate[] {
  const candidates = [recordedCoupling(setup)];
  const fitted = fittedCorner(setup, observed.tiltPct, observed.amplitudeV);
  if (fitted) candidates.push(fitted);
  return candidates;
}

function fittedCorner(setup: ResolvedSetup, tiltPct: number | undefined, seenV: number | undefined): Candidate | undefined {
  const f = setup.frequencyHz;
  if (f === undefined || f <= 0 || setup.signalKind === 'dc') return undefined;
  let effectiveHz: number | undefined;
  let what = '';
  let predicted: Candidate['predicted'] = {};
  if (setup.signalKind === 'square' && tiltPct !== undefined && tiltPct > VISIBLE_TILT_PCT && tiltPct < 100) {
    effectiveHz = cornerForTiltHz(tiltPct / 100, f);
    what = `${percent(tiltPct)} droop on the tops of a ${eng(f, 'Hz')} square`;
    predicted = { tiltPct };
  } else if (setup.signalKind === 'sine' && seenV !== undefined && setup.expectedAmplitudeV !== undefined && seenV < 0.97 * setup.expectedAmplitudeV) {
    effectiveHz = cornerForSineRatioHz(seenV / setup.expectedAmplitudeV, f);
    what = `${percent((100 * seenV) / setup.expectedAmplitudeV)} of a ${eng(f, 'Hz')} sine`;
    predicted = { amplitudeV: seenV };
  }
  if (effectiveHz === undefined) return undefined;
  const scopeCornerHz = (effectiveHz * (seriesOhm(setup) + setup.scopeInputResistanceOhm)) / setup.scopeInputResistanceOhm;
  if (scopeCornerHz < PLAUSIBLE_CORNER_HZ.low || scopeCornerHz > PLAUSIBLE_CORNER_HZ.high) return undefined;
  const ac = setup.coupling === 'ac';
  const recordedCorner = setup.acCornerHz;
  const prior = !ac
    ? HIDDEN_COUPLING_PRIOR.dcRecordedOrUnsaid
    : recordedCorner === undefined
      ? HIDDEN_COUPLING_PRIOR.acCornerUnrecorded
      : HIDDEN_COUPLING_PRIOR.acCornerRecorded;
  const contradicts = ac && recordedCorner !== undefined && Math.abs(Math.log(recordedCorner / scopeCornerHz)) > Math.log(1.5);
  // DC coupling read off the channel menu is a corner of 0 Hz: a fit needing a corner of hertz
  // contradicts it as a recorded 1 MΩ input contradicts a hidden 50 Ω one
  const recordedDc = !ac && setup.couplingRecorded;
  return {
    cause: 'ac-coupling',
    basis: 'fitted',
    hiddenPrior: prior,
    deviation: predicted.tiltPct !== undefined ? -Math.log(1 - predicted.tiltPct / 100) : Math.log((setup.expectedAmplitudeV as number) / (seenV as number)),
    predicted,
    explanation:
      `${what[0].toUpperCase()}${what.slice(1)} fits a high-pass at ${eng(effectiveHz, 'Hz')}: an AC-coupled channel with a corner of about ${eng(scopeCornerHz, 'Hz')} for a low-impedance source` +
      (setup.probeKind === 'passive' && setup.tipResistanceOhm > 0 ? `, lowered by the probe's ${eng(setup.tipResistanceOhm, 'Ω')} tip resistor` : '') +
      (ac
        ? '.'
        : recordedDc
          ? ' — but the channel is recorded as DC-coupled, so only if that record is wrong. A coupling capacitor in the circuit itself droops the same way, and then the trace is true.'
          : ' — if the channel was in fact AC-coupled (the case does not say). A coupling capacitor in the circuit itself droops the same way.'),
    confirm: CONFIRM,
    fix: FIX,
    estimates: { impliedEffectiveCornerHz: effectiveHz, impliedAcCornerHz: scopeCornerHz },
    ...(contradicts ? { contradictions: [{ field: 'scope.acCornerHz', recorded: recordedCorner as number, implied: scopeCornerHz }] } : {}),
    ...(recordedDc ? { contradictions: [{ field: 'scope.coupling', recorded: 0, implied: scopeCornerHz }] } : {}),
    detailTags: predicted.tiltPct !== undefined ? ['ac-coupling-droop'] : ['ac-coupled'],
  };
}

const FIX =
  'Use DC coupling, and take a large DC level out with the offset control instead; if AC coupling must stay, keep its corner far below the signal (a 10x probe lowers it tenfold).';

function recordedCoupling(setup: ResolvedSetup): Candidate {
  const common = { cause: 'ac-coupling' as const, basis: 'recorded' as const, confirm: CONFIRM };
  if (setup.coupling !== 'ac') {
    return {
      ...common,
      deviation: 0,
      predicted: {},
      explanation: 'The channel is DC-coupled (as recorded, or by default), so nothing blocks low frequencies.',
      fix: 'Nothing to change.',
      detailTags: [],
    };
  }
  const assumedCorner = setup.acCornerHz === undefined;
  const cornerHz = setup.acCornerHz ?? TYPICAL_AC_CORNER_HZ;
  const effectiveHz = effectiveAcCornerHz(cornerHz, setup.scopeInputResistanceOhm, seriesOhm(setup));
  const cornerText =
    `The channel is AC-coupled: a high-pass at ${eng(cornerHz, 'Hz')}${assumedCorner ? ' (not recorded: a typical data-sheet figure)' : ''}` +
    (effectiveHz < cornerHz * 0.99 ? `, lowered to ${eng(effectiveHz, 'Hz')} by the ${eng(seriesOhm(setup), 'Ω')} in series with the ${eng(setup.scopeInputResistanceOhm, 'Ω')} input` : '');
  const estimates: Record<string, number | string> = { acCornerHz: cornerHz, effectiveCornerHz: effectiveHz, ...(assumedCorner ? { assumedAcCornerHz: cornerHz } : {}) };
  const expected = setup.expectedAmplitudeV;
  const f = setup.frequencyHz;
  if (setup.signalKind === 'dc' || f === undefined) {
    const single = setup.signalKind === 'pulse' || setup.signalKind === 'other';
    return {
      ...common,
      deviation: single ? Math.log(2) : Math.log(100),
      predicted: single || expected === undefined ? {} : { amplitudeV: 0 },
      explanation: single
        ? `${cornerText}. A single step passes at its edge, then decays toward zero with τ = ${eng(1 / (2 * Math.PI * effectiveHz), 's')}.`
        : `${cornerText}. A DC level is blocked entirely: the trace sits at 0 V whatever the level is.`,
      fix: FIX,
      estimates,
      detailTags: single ? ['ac-coupled'] : ['ac-coupled', 'dc-level-lost'],
    };
  }
  if (setup.signalKind === 'square') {
    const tiltPct = 100 * squareWaveTiltFraction(f, effectiveHz);
    return {
      ...common,
      deviation: -Math.log(Math.max(1e-3, 1 - tiltPct / 100)),
      predicted: { tiltPct, ...(expected === undefined ? {} : { amplitudeV: expected }) },
      explanation: `${cornerText}. Each edge of the ${eng(f, 'Hz')} square passes whole, then the top droops by $\\tanh(T/4\\tau)$ = ${percent(tiltPct)} of the step before the next edge; the trace centres on its average, so its DC level is lost.`,
      fix: FIX,
      estimates: { ...estimates, tiltPct },
      detailTags: tiltPct >= 1 ? ['ac-coupled', 'ac-coupling-droop'] : ['ac-coupled'],
    };
  }
  const ratio = highPassMagnitude(f, effectiveHz);
  return {
    ...common,
    deviation: -Math.log(ratio),
    predicted: expected === undefined ? {} : { amplitudeV: expected * ratio },
    explanation: `${cornerText}. At ${eng(f, 'Hz')} it passes ${percent(ratio * 100)} of a sine ($f/\\sqrt{f^2 + f_c^2}$); the trace centres on its average, so its DC level is lost.`,
    fix: ratio < 0.99 ? FIX : 'The coupling costs nothing at this frequency; only the DC level is lost.',
    estimates: { ...estimates, amplitudeRatio: ratio },
    detailTags: ['ac-coupled'],
  };
}
