import type { Candidate, ModelContext, ResolvedSetup } from './types';
import {
  bandwidthFromRiseTimeHz,
  cascadeRiseTimeS,
  flatResponseSpread,
  riseTimeFromBandwidthS,
  singlePoleMagnitude,
  squareWaveAmplitudeRatio,
} from './single-pole';
import { eng, percent } from './wording';
import { clampPlausible } from './plausibility';
import { SIGMA } from './scoring';
import { isOneXPassive } from './defaults';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  'Measure the same edge with the bandwidth limit off and a faster probe or channel: a true slow edge keeps its rise time, a bandwidth-limited one gets faster.';

export interface Stage {
  name: 'probe' | 'scope' | 'bandwidth limit';
  bandwidthHz: number;
  riseTimeS: number;
}

/**
 * Measurement-chain stages with a known bandwidth, each taken as a single pole: the probe only
 * when its bandwidth is recorded (or it is a 1x probe; an unrecorded 10x probe is matched to
 * the scope, whose figure is then the system's), the scope (its data-sheet rise time when
 * recorded, else 0.35/BW), and a bandwidth-limit filter when one is on.
 */
export function measurementStages(setup: ResolvedSetup): Stage[] {
  const stages: Stage[] = [];
  const add = (name: Stage['name'], bandwidthHz: number | undefined) => {
    if (bandwidthHz !== undefined) stages.push({ name, bandwidthHz, riseTimeS: riseTimeFromBandwidthS(bandwidthHz) });
  };
  add('probe', setup.probeBandwidthHz);
  if (setup.scopeRiseTimeS !== undefined) {
    stages.push({ name: 'scope', riseTimeS: setup.scopeRiseTimeS, bandwidthHz: setup.scopeBandwidthHz ?? bandwidthFromRiseTimeHz(setup.scopeRiseTimeS) });
  } else add('scope', setup.scopeBandwidthHz);
  add('bandwidth limit', setup.bandwidthLimitHz);
  return stages;
}

/** Rise time of the probe, scope and limit filter in quadrature, in s; undefined when none is known. */
export function systemRiseTimeS(setup: ResolvedSetup): number | undefined {
  const stages = measurementStages(setup);
  return stages.length === 0 ? undefined : cascadeRiseTimeS(stages.map((s) => s.riseTimeS));
}

/**
 * Rise time the scope shows for the signal's edge: √(t_signal² + t_probe² + t_scope² + t_limit²),
 * with t = 0.3497/BW per stage, in s. An unrecorded signal edge counts as ideal.
 * source: root-sum-square rise-time rule; t_r·BW = ln 9/2π for a single pole.
 */
export function shownRiseTimeS(setup: ResolvedSetup): number | undefined {
  const system = systemRiseTimeS(setup);
  if (system === undefined) return setup.signalRiseTimeS;
  return cascadeRiseTimeS([system, setup.signalRiseTimeS ?? 0]);
}

/** Product of the stages' single-pole magnitudes at a frequency (1 when none is known). */
export function chainMagnitudeAt(setup: ResolvedSetup, frequencyHz: number): number {
  return measurementStages(setup).reduce((m, s) => m * singlePoleMagnitude(frequencyHz, s.bandwidthHz), 1);
}

/**
 * Amplitude the chain passes, as a fraction: a sine at f through each pole, 1/√(1+(f/f_c)²);
 * a square wave through the chain's equivalent pole, tanh(T/4τ); DC and single edges, 1.
 */
export function chainAmplitudeRatio(setup: ResolvedSetup, systemRiseS = systemRiseTimeS(setup)): number {
  const f = setup.frequencyHz;
  if (f === undefined || systemRiseS === undefined) return 1;
  if (setup.signalKind === 'sine' || setup.signalKind === 'other') return chainMagnitudeAt(setup, f);
  if (setup.signalKind === 'square') return squareWaveAmplitudeRatio(systemRiseS / Math.log(9), f);
  return 1;
}

/** An observed edge this much slower than the chain predicts calls for a fitted bandwidth. */
const SLOW_EDGE_FACTOR = 1.3; // our threshold
const HIDDEN_BANDWIDTH_PRIOR = 0.25; // our estimate: limit filters and wrong probe models are common
const UNKNOWN_CHAIN_PRIOR = 0.1;

/** Bandwidth candidates: the recorded chain, and an effective bandwidth read off a slow edge. */
export function assessBandwidth({ setup, observed }: ModelContext): Candidate[] {
  const stages = measurementStages(setup);
  const system = systemRiseTimeS(setup);
  const shown = shownRiseTimeS(setup);
  const expected = setup.expectedAmplitudeV;
  const estimates: Record<string, number | string> = {};
  if (system !== undefined) {
    estimates.systemRiseTimeS = system;
    estimates.systemBandwidthHz = bandwidthFromRiseTimeHz(system);
  }
  const observedRise = observed.riseTimeS;
  const signalRise = setup.signalRiseTimeS ?? 0;
  // held to a plausible measurement bandwidth: a clamped fit predicts its own edge, which then fails to fit
  const effectiveHz =
    observedRise !== undefined && observedRise > signalRise
      ? clampPlausible('bandwidthHz', bandwidthFromRiseTimeHz(Math.sqrt(observedRise ** 2 - signalRise ** 2))).value
      : undefined;
  if (effectiveHz !== undefined) estimates.effectiveBandwidthHz = effectiveHz;

  const ratio = chainAmplitudeRatio(setup, system);
  const amplitudeDeviation = Math.abs(Math.log(ratio));
  let riseDeviation = 0;
  if (setup.hasEdges && system !== undefined) {
    if (setup.signalRiseTimeS !== undefined) riseDeviation = Math.log((shown as number) / setup.signalRiseTimeS);
    else if (setup.frequencyHz !== undefined) riseDeviation = Math.log(1 + 2 * system * setup.frequencyHz);
  }
  const dominant = stages.reduce<Stage | undefined>((a, s) => (a && a.riseTimeS >= s.riseTimeS ? a : s), undefined);
  // a sine's amplitude below the bandwidth: the chain may be as flat as a maximally flat response
  const shapeSpread =
    (setup.signalKind === 'sine' || setup.signalKind === 'other') && setup.frequencyHz !== undefined && system !== undefined
      ? flatResponseSpread(setup.frequencyHz, bandwidthFromRiseTimeHz(system))
      : 0;
  const recorded: Candidate = {
    cause: 'bandwidth',
    basis: 'recorded',
    ...(shapeSpread > 0 ? { amplitudeSigma: Math.hypot(SIGMA.amplitude, shapeSpread) } : {}),
    deviation: Math.hypot(amplitudeDeviation, riseDeviation),
    predicted: {
      amplitudeV: expected === undefined ? undefined : expected * ratio,
      riseTimeS: setup.hasEdges ? shown : undefined,
    },
    explanation: describeChain(setup, stages, system, shown, ratio),
    confirm: CONFIRM,
    fix: fixFor(setup, dominant),
    estimates,
    detailTags: tagsFor(setup, dominant),
  };
  const candidates = [recorded];

  const slow = observedRise !== undefined && (shown === undefined || observedRise > SLOW_EDGE_FACTOR * shown);
  if (slow && effectiveHz !== undefined && setup.hasEdges) {
    const fittedRatio = chainAmplitudeRatio(
      { ...setup, probeBandwidthHz: effectiveHz, scopeBandwidthHz: undefined, scopeRiseTimeS: undefined, bandwidthLimitHz: undefined },
    );
    const limitHint = setup.bandwidthLimitHz === undefined ? ' a bandwidth-limit filter left on,' : '';
    candidates.push({
      cause: 'bandwidth',
      basis: 'fitted',
      hiddenPrior: system === undefined ? UNKNOWN_CHAIN_PRIOR : HIDDEN_BANDWIDTH_PRIOR,
      deviation: shown === undefined ? Math.log(SLOW_EDGE_FACTOR) : Math.log((observedRise as number) / shown),
      predicted: {
        amplitudeV: expected === undefined ? undefined : expected * fittedRatio,
        riseTimeS: cascadeRiseTimeS([signalRise, riseTimeFromBandwidthS(effectiveHz)]),
      },
      explanation: `The observed ${eng(observedRise as number, 's')} edge implies an effective bandwidth of about ${eng(effectiveHz, 'Hz')} (BW ≈ 0.35/t_r${setup.signalRiseTimeS ? `, after removing the ${eng(signalRise, 's')} source edge in quadrature` : ''})${system === undefined ? '' : `, well below the ${eng(bandwidthFromRiseTimeHz(system), 'Hz')} the recorded probe and scope give`}. Look for${limitHint} a 1x probe or switch position, a slower probe than recorded, or a slow source edge.`,
      confirm: CONFIRM,
      fix: 'Check the channel for a bandwidth-limit filter, the probe switch for 1x, and the probe model; then measure the edge again.',
      estimates,
      detailTags: ['slow-edges'],
    });
  }
  return candidates;
}

function describeChain(
  setup: ResolvedSetup,
  stages: Stage[],
  system: number | undefined,
  shown: number | undefined,
  ratio: number,
): string {
  if (system === undefined) {
    return 'No bandwidth is recorded for the probe or the scope, so how much the edges are slowed cannot be predicted.';
  }
  const parts = stages.map((s) => `${s.name} ${eng(s.bandwidthHz, 'Hz')}`).join(', ');
  let text = `The chain (${parts}) adds up to about ${eng(bandwidthFromRiseTimeHz(system), 'Hz')}, a ${eng(system, 's')} rise time (stage rise times add in quadrature, t_r ≈ 0.35/BW).`;
  if (setup.hasEdges && setup.signalRiseTimeS !== undefined && shown !== undefined) {
    text += ` A ${eng(setup.signalRiseTimeS, 's')} edge shows as ${eng(shown, 's')}.`;
  }
  if (setup.frequencyHz !== undefined && ratio < 0.995) {
    text += ` At ${eng(setup.frequencyHz, 'Hz')} the ${setup.signalKind === 'square' ? 'square wave' : 'signal'} is shown at ${percent(ratio * 100)} of its amplitude.`;
  }
  return text;
}

function fixFor(setup: ResolvedSetup, dominant: Stage | undefined): string {
  if (dominant?.name === 'bandwidth limit') return 'Turn off the bandwidth-limit filter when measuring edges.';
  if (dominant?.name === 'probe' && isOneXPassive(setup)) {
    return "Use a 10x probe: a 1x probe's bandwidth is only a few MHz.";
  }
  return 'Use a probe and scope whose combined rise time is several times shorter than the edge: 3× keeps the error near 5 %, 5× near 2 %.';
}

function tagsFor(setup: ResolvedSetup, dominant: Stage | undefined): string[] {
  if (dominant?.name === 'bandwidth limit') return ['bandwidth-limit-filter'];
  if (dominant?.name === 'probe' && isOneXPassive(setup)) return ['1x-probe-bandwidth'];
  return dominant ? ['slow-edges'] : [];
}
