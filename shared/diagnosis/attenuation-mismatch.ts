import type { Cause, Predicted } from '../schemas/diagnosis';
import { SIGMA } from './scoring';
import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { withSwitchPosition } from './defaults';
import { isPlausible } from './plausibility';
import { loadedAmplitudeRatio, loadedRiseTimeS, loadingParamsOf } from './loading';
import { chainAmplitudeRatio, shownRiseTimeS } from './bandwidth';
import { cascadeRiseTimeS } from './single-pole';
import { eng, factor } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  "Read the probe's switch or marking and the channel's attenuation menu side by side, or measure a known DC rail: a round factor of 10 off points here.";

/**
 * Amplitude the scope displays when the channel multiplies by one ratio and the probe
 * divides by another: shown = true × setting ÷ actual.
 * source: definition of probe attenuation; common practice.
 *
 * @param trueAmplitudeV amplitude at the probe tip, V
 * @param channelSetting ratio the channel assumes (10 for "10x")
 * @param probeAttenuation ratio the probe actually divides by
 * @returns displayed amplitude, V
 */
export function shownAmplitudeV(
  trueAmplitudeV: number,
  channelSetting: number,
  probeAttenuation: number,
): number {
  return (trueAmplitudeV * channelSetting) / probeAttenuation;
}

/**
 * Inverse: the probe ratio implied by an observation, actual = setting × expected ÷ observed.
 *
 * @param expectedAmplitudeV amplitude the circuit should have, V
 * @param observedAmplitudeV amplitude the scope displayed, V
 * @param channelSetting ratio the channel assumed
 */
export function impliedProbeAttenuation(
  expectedAmplitudeV: number,
  observedAmplitudeV: number,
  channelSetting: number,
): number {
  return (channelSetting * expectedAmplitudeV) / observedAmplitudeV;
}

/** Within ±15 % of a power of ten counts as a "round factor" (common practice, our threshold). */
const ROUND_FACTOR_TOLERANCE = Math.log10(1.15);
/** How often an unrecorded switch or menu position explains a round-factor error (our estimate). */
const HIDDEN_SWITCH_PRIOR = 0.35;

const ratioTag = (actual: number, setting: number) => `${factor(actual)}x-at-${factor(setting)}x`;

/** Attenuation-mismatch candidates: the setup as recorded, and a hidden switch position. */
export function assessAttenuation({ setup, observed }: ModelContext): Candidate[] {
  const { channelSetting: setting, probeAttenuation: actual, expectedAmplitudeV: expected } = setup;
  const scale = setting / actual;
  const estimates: Record<string, number | string> = { shownToTrueRatio: scale };
  if (expected !== undefined && observed.amplitudeV !== undefined) {
    estimates.impliedProbeAttenuation = impliedProbeAttenuation(expected, observed.amplitudeV, setting);
  }
  const candidates: Candidate[] = [recorded(setting, actual, expected, estimates)];
  const hidden = hiddenSwitch(setup, observed.amplitudeV, estimates);
  if (hidden) candidates.push(hidden);
  return candidates;
}

function recorded(
  setting: number,
  actual: number,
  expected: number | undefined,
  estimates: Record<string, number | string>,
): Candidate {
  const scale = setting / actual;
  const amplitudeV = expected === undefined ? undefined : shownAmplitudeV(expected, setting, actual);
  if (setting === actual) {
    return {
      cause: 'attenuation-mismatch',
      basis: 'recorded',
      deviation: 0,
      predicted: { amplitudeV },
      explanation: `The channel setting (${factor(setting)}x) matches the probe (${factor(actual)}x), so the vertical scale is right as recorded.`,
      confirm: CONFIRM,
      fix: `Nothing to change; on a switchable probe, confirm the switch really is at ${factor(actual)}x.`,
      estimates,
      detailTags: [],
    };
  }
  const direction =
    scale < 1 ? `1/${factor(1 / scale)} of the true signal` : `${factor(scale)} times the true signal`;
  const numbers = expected === undefined ? '' : `: ${eng(amplitudeV as number, 'V')} instead of ${eng(expected, 'V')}`;
  return {
    cause: 'attenuation-mismatch',
    basis: 'recorded',
    deviation: Math.abs(Math.log(scale)),
    predicted: { amplitudeV },
    explanation: `The channel assumes ${factor(setting)}x but the probe divides by ${factor(actual)}, so the scope shows ${direction}${numbers}.`,
    confirm: CONFIRM,
    fix: `Set the channel attenuation to ${factor(actual)}x to match the probe (most scopes cannot sense a switchable probe's position), or move the probe switch to ${factor(setting)}x.`,
    estimates,
    detailTags: [ratioTag(actual, setting)],
  };
}

function hiddenSwitch(setup: ResolvedSetup, observedV: number | undefined, estimates: Record<string, number | string>): Candidate | undefined {
  const { channelSetting: setting, probeAttenuation: actual, expectedAmplitudeV: expected } = setup;
  if (setting !== actual || expected === undefined || observedV === undefined) return undefined;
  const decades = Math.log10(expected / observedV);
  const k = Math.round(decades);
  if (k === 0 || Math.abs(decades - k) > ROUND_FACTOR_TOLERANCE) return undefined;
  const impliedActual = setting * 10 ** k;
  const [probeAt, channelAt] =
    impliedActual >= 1 ? [impliedActual, setting] : [1, setting / impliedActual];
  // a ratio no probe or channel offers is not a switch position
  if (!isPlausible('attenuation', probeAt) || !isPlausible('attenuation', channelAt)) return undefined;
  const scale = 10 ** -k;
  const size = k > 0 ? `${factor(10 ** k)} times smaller` : `${factor(10 ** -k)} times larger`;
  // A switch in another position is another probe: its own load and bandwidth come with it.
  const switched = probeAt !== actual ? withSwitchPosition(setup, probeAt) : undefined;
  const consequences = switched ? switchConsequences(switched, setup) : undefined;
  const predicted: Predicted = { amplitudeV: expected * scale * (consequences?.amplitudeRatio ?? 1) };
  if (consequences?.riseTimeS !== undefined) predicted.riseTimeS = consequences.riseTimeS;
  const alsoText = consequences
    ? ` A probe at ${factor(probeAt)}x also brings its own load (${eng(switched!.tipCapacitanceF, 'F')}${switched!.tipResistanceOhm > 0 ? ` and ${eng(switched!.tipResistanceOhm + switched!.scopeInputResistanceOhm, 'Ω')}` : ''})${switched!.probeBandwidthHz ? ` and bandwidth (about ${eng(switched!.probeBandwidthHz, 'Hz')})` : ''}${predicted.riseTimeS !== undefined ? `, so edges show at about ${eng(predicted.riseTimeS, 's')}` : ''}.`
    : '';
  return {
    cause: 'attenuation-mismatch',
    basis: 'fitted',
    hiddenPrior: HIDDEN_SWITCH_PRIOR,
    deviation: Math.abs(Math.log(scale)),
    predicted,
    explanation: `The trace is ${size} than expected (${eng(observedV, 'V')} against ${eng(expected, 'V')}), a round factor: the mark of a probe switch or channel menu that is not where the record says. It fits a ${factor(probeAt)}x probe read as ${factor(channelAt)}x.${alsoText}`,
    confirm: CONFIRM,
    fix: "Look at the probe's switch and the channel's attenuation menu, make them agree, and read the amplitude again.",
    estimates,
    ...(consequences?.alsoCauses.length ? { alsoCauses: consequences.alsoCauses } : {}),
    contradictions:
      probeAt !== actual && !setup.assumed.has('probe.attenuation')
        ? [{ field: 'probe.attenuation', recorded: actual, implied: probeAt }]
        : undefined,
    detailTags: [ratioTag(probeAt, channelAt)],
  };
}

/**
 * Loading and edges of the probe in its switched position: the amplitude the load leaves,
 * and the edge through that probe's chain and its RC load (stages in quadrature). Also which
 * other causes this one fault acts as, beyond the models' accuracy: bandwidth when the
 * switched probe's chain slows edges by more than 2σ of a rise-time reading, loading when its
 * load costs more than 2σ of an amplitude reading or dominates the edge.
 */
function switchConsequences(setup: ResolvedSetup, recorded: ResolvedSetup): { amplitudeRatio: number; riseTimeS?: number; alsoCauses: Cause[] } {
  const load = loadingParamsOf(setup);
  const loadRatio = loadedAmplitudeRatio(setup, load);
  const amplitudeRatio = loadRatio * chainAmplitudeRatio(setup);
  const alsoCauses: Cause[] = [];
  if (!setup.hasEdges) {
    if (Math.abs(Math.log(loadRatio)) > 2 * SIGMA.amplitude) alsoCauses.push('loading');
    return { amplitudeRatio, alsoCauses };
  }
  const chain = shownRiseTimeS(setup) ?? 0;
  const before = shownRiseTimeS(recorded) ?? 0;
  const loadRise = loadedRiseTimeS(load);
  if (chain > 0 && (before === 0 || Math.log(chain / before) > 2 * SIGMA.riseTime)) alsoCauses.push('bandwidth');
  if (Math.abs(Math.log(loadRatio)) > 2 * SIGMA.amplitude || loadRise > Math.max(chain, before)) alsoCauses.push('loading');
  return { amplitudeRatio, riseTimeS: cascadeRiseTimeS([chain, loadRise]), alsoCauses };
}
