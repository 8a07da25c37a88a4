import type { DiagnosisInput, Hypothesis, HypothesisCause } from '../schemas/diagnosis';
import type { ResolvedSetup } from './types';
import { observedOf, resolveSetup } from './defaults';
import { balancedDividerOf, compensationStepResponse, dividerLevels } from './compensation';
import { groundLeadResonance, groundLeadStepResponse, straightWireInductanceH } from './ground-lead';
import { dcLoadingRatio, loadingCornerHz, loadingFrequencyResponse, loadingParamsOf } from './loading';
import { chainMagnitudeAt, systemRiseTimeS } from './bandwidth';
import { bandwidthFromRiseTimeHz } from './single-pole';
import { shownAmplitudeV } from './attenuation-mismatch';
import { LOW_IMPEDANCE_INPUT_OHM, terminationShownRatio } from './termination-mismatch';
import { geometricGrid, rampResponse, stepGrid } from './curve-grids';
import { eng, factor, percent } from './wording';
import { acCouplingPlot, aliasingPlot, clippingPlot, commonModePlot, generatorLoadPlot } from './curves-acquisition';

/** What a curve stands for: a measurement, the model's prediction, or the error-free picture. */
export type CurveRole = 'observed' | 'model' | 'reference';

export interface CurveSeries {
  label: string;
  role: CurveRole;
  values: number[];
}

/** A curve plot: a time axis (s) for step responses, a log-frequency axis (Hz) for magnitudes. */
export interface LinePlot {
  kind: 'line';
  title: string;
  x: number[];
  xUnit: 's' | 'Hz' | 'Ω';
  /** 'V' for volts shown at the scope; '' for a plain ratio (shown/true); 'Hz' or 'dB' for the acquisition plots. */
  yUnit: 'V' | '' | 'Hz' | 'dB';
  xLabel: string;
  yLabel: string;
  logX: boolean;
  series: CurveSeries[];
  /** One or two sentences saying what the plot shows, for readers who cannot see it. */
  summary: string;
}

/** Amplitudes side by side, for causes that only scale the trace. */
export interface AmplitudeBars {
  kind: 'bars';
  title: string;
  bars: { label: string; role: CurveRole; valueV: number }[];
  summary: string;
}

export type DiagnosisPlot = LinePlot | AmplitudeBars;

/** The parts of a hypothesis that say which parameters it was fitted with. */
export type HypothesisFit = Pick<Hypothesis, 'predicted' | 'estimates'>;

/**
 * The picture behind a hypothesis: the predicted step response for compensation and ground
 * lead, the magnitude response for loading and bandwidth, amplitude bars for attenuation and
 * termination; null when the setup gives nothing to draw. When `hypothesis` is the engine's
 * fitted candidate (a trimmer setting, lead inductance or source impedance inferred from the
 * observation), the curve uses the fitted value, so it matches the numbers on the card.
 */
export function diagnosisPlot(input: DiagnosisInput, cause: HypothesisCause, hypothesis?: HypothesisFit): DiagnosisPlot | null {
  const { setup } = resolveSetup(input);
  const est = hypothesis?.estimates ?? {};
  switch (cause) {
    case 'compensation':
      return compensationPlot(setup, 'jumpRatio' in est ? num(est.tipCapacitanceF) : undefined);
    case 'ground-lead':
      return groundLeadPlot(setup, 'inductanceH' in est ? undefined : num(est.impliedInductanceH));
    case 'loading':
      return loadingPlot(setup, fittedSource(setup, est));
    case 'bandwidth':
      return bandwidthPlot(setup, fittedBandwidth(input, hypothesis));
    case 'attenuation-mismatch':
    case 'termination-mismatch':
      return amplitudeBars(input, setup, cause, hypothesis?.predicted.amplitudeV);
    case 'aliasing':
      return aliasingPlot(input, setup, hypothesis);
    case 'clipping':
      return clippingPlot(setup, hypothesis);
    case 'ac-coupling':
      return acCouplingPlot(setup, hypothesis);
    case 'common-mode':
      return commonModePlot(setup, hypothesis);
    case 'generator-load':
      return generatorLoadPlot(input, setup, hypothesis);
    default:
      return null;
  }
}

const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** The amplitude the curves are scaled to, and how it is labelled. */
function levelOf(setup: ResolvedSetup): { amplitude: number; yUnit: 'V' | ''; yLabel: string } {
  return setup.expectedAmplitudeV === undefined
    ? { amplitude: 1, yUnit: '', yLabel: 'Shown ÷ true step' }
    : { amplitude: setup.expectedAmplitudeV, yUnit: 'V', yLabel: 'Shown at the scope' };
}

const show = (value: number, yUnit: 'V' | '') => (yUnit === 'V' ? eng(value, 'V') : factor(value));

function compensationPlot(setup: ResolvedSetup, fittedTipCapacitanceF: number | undefined): LinePlot | null {
  if (setup.tipResistanceOhm <= 0 || setup.scopeInputResistanceOhm < LOW_IMPEDANCE_INPUT_OHM) return null;
  const balanced = balancedDividerOf(setup);
  const divider = { ...balanced, tipCapacitanceF: fittedTipCapacitanceF ?? balanced.tipCapacitanceF };
  const { jump, settle, timeConstantS } = dividerLevels(divider);
  const { amplitude, yUnit, yLabel } = levelOf(setup);
  const x = stepGrid(5 * timeConstantS);
  // The channel multiplies back by its setting, so a matched probe shows the true level.
  const model = compensationStepResponse(divider, x).map((v) => v * setup.channelSetting * amplitude);
  const state = jump > settle ? 'over-compensated' : jump < settle ? 'under-compensated' : 'adjusted';
  return {
    kind: 'line',
    title: `Predicted step, probe ${state}`,
    x,
    xUnit: 's',
    yUnit,
    xLabel: 'Time after the edge',
    yLabel,
    logX: false,
    series: [
      { label: 'Ideal step at the tip', role: 'reference', values: x.map((t) => (t < 0 ? 0 : amplitude)) },
      { label: `Model: C1 = ${eng(divider.tipCapacitanceF, 'F')}`, role: 'model', values: model },
    ],
    summary:
      state === 'adjusted'
        ? `With R1·C1 = R2·C2 the edge goes straight to ${show(settle * setup.channelSetting * amplitude, yUnit)} and the top stays flat.`
        : `The edge jumps to ${show(jump * setup.channelSetting * amplitude, yUnit)} and ${jump > settle ? 'sinks' : 'creeps up'} to ${show(settle * setup.channelSetting * amplitude, yUnit)} with τ ≈ ${eng(timeConstantS, 's')}.`,
  };
}

function groundLeadPlot(setup: ResolvedSetup, fittedInductanceH: number | undefined): LinePlot | null {
  const recordedH = setup.groundLeadM === undefined ? 0 : straightWireInductanceH(setup.groundLeadM, setup.groundWireRadiusM);
  const inductanceH = fittedInductanceH ?? recordedH;
  if (!(inductanceH > 0)) return null;
  const p = { sourceResistanceOhm: setup.sourceResistanceOhm, inductanceH, capacitanceF: setup.tipCapacitanceF };
  const resonance = groundLeadResonance(p);
  const wn = 2 * Math.PI * resonance.naturalFrequencyHz;
  const zeta = resonance.dampingRatio;
  const periodS = 1 / resonance.naturalFrequencyHz;
  // Long enough to see the ringing die down, short enough that the first cycles stay legible.
  const settleS = zeta < 1 ? 5 / (zeta * wn) : 5 / (wn * (zeta - Math.sqrt(zeta * zeta - 1)));
  const rampS = setup.signalRiseTimeS === undefined ? 0 : setup.signalRiseTimeS / 0.8;
  const spanS = (zeta < 1 ? Math.min(Math.max(settleS, 5 * periodS), 20 * periodS) : settleS) + rampS;
  const x = stepGrid(spanS);
  const { amplitude, yUnit, yLabel } = levelOf(setup);
  const gain = (amplitude * setup.channelSetting) / setup.probeAttenuation;
  const unit = groundLeadStepResponse(p, x);
  const edge = rampS > 0 ? rampResponse(x, unit, rampS) : unit;
  const model = edge.map((v) => v * gain);
  const reference = x.map((t) => (t < 0 ? 0 : rampS > 0 ? Math.min(1, t / rampS) : 1) * amplitude);
  const peak = Math.max(...model);
  const overshoot = gain > 0 ? (peak / gain - 1) * 100 : 0;
  const zetaText = zeta < 10 ? `ζ = ${zeta.toFixed(2)}` : 'ζ ≫ 1';
  const what = fittedInductanceH === undefined ? `${eng(setup.groundLeadM ?? 0, 'm')} lead` : `${eng(inductanceH, 'H')} fitted to the ringing`;
  const edgeText = rampS > 0 ? `a ${eng(setup.signalRiseTimeS ?? 0, 's')} edge` : 'an ideal edge';
  return {
    kind: 'line',
    title: `Predicted step through the ground lead (${what})`,
    x,
    xUnit: 's',
    yUnit,
    xLabel: 'Time after the edge',
    yLabel,
    logX: false,
    series: [
      { label: rampS > 0 ? `Edge at the tip (${eng(setup.signalRiseTimeS ?? 0, 's')})` : 'Ideal step at the tip', role: 'reference', values: reference },
      { label: `Model: ${eng(inductanceH, 'H')} with ${eng(setup.tipCapacitanceF, 'F')}`, role: 'model', values: model },
    ],
    summary:
      resonance.ringingFrequencyHz === undefined
        ? `Overdamped (${zetaText}): ${edgeText} settles to ${show(gain, yUnit)} without ringing.`
        : `For ${edgeText} the trace peaks at ${show(peak, yUnit)} (${percent(Math.max(0, overshoot))} over ${show(gain, yUnit)}) and rings at ${eng(resonance.ringingFrequencyHz, 'Hz')}, ${zetaText}; before the scope's own bandwidth.`,
  };
}

/** The source impedance a loading hypothesis used: the recorded one, or the one fitted to the amplitude. */
function fittedSource(setup: ResolvedSetup, est: Record<string, number | string>): number | undefined {
  const implied = num(est.impliedSourceResistanceOhm);
  const dcRatio = num(est.dcRatio);
  if (implied === undefined || dcRatio === undefined) return undefined;
  // Both candidates carry the implied value; the one whose own divider matches is the fitted one.
  const recordedError = Math.abs(dcLoadingRatio(loadingParamsOf(setup)) - dcRatio);
  const fittedError = Math.abs(dcLoadingRatio(loadingParamsOf(setup, implied)) - dcRatio);
  return fittedError < recordedError ? implied : undefined;
}

function loadingPlot(setup: ResolvedSetup, fittedSourceOhm: number | undefined): LinePlot | null {
  const params = loadingParamsOf(setup, fittedSourceOhm ?? setup.sourceResistanceOhm);
  const cornerHz = loadingCornerHz(params);
  // An (almost) ideal source puts the corner beyond anything a probe passes: nothing to draw.
  if (!(cornerHz < 1e12)) return null;
  const x = frequencyAxis(cornerHz, setup.frequencyHz, 1e-3, 100);
  const model = loadingFrequencyResponse(params, x);
  const dc = dcLoadingRatio(params);
  const at = setup.frequencyHz === undefined ? '' : ` At the signal's ${eng(setup.frequencyHz, 'Hz')}, ${percent(loadingFrequencyResponse(params, [setup.frequencyHz])[0] * 100)} reaches the scope.`;
  return {
    kind: 'line',
    title: `Loading of the ${eng(params.sourceResistanceOhm, 'Ω')} source${fittedSourceOhm === undefined ? '' : ' (fitted)'}`,
    x,
    xUnit: 'Hz',
    yUnit: '',
    xLabel: 'Frequency',
    yLabel: 'Shown ÷ true amplitude',
    logX: true,
    series: [
      { label: 'Unloaded', role: 'reference', values: x.map(() => 1) },
      { label: `Model: ${eng(params.inputResistanceOhm, 'Ω')} ∥ ${eng(params.inputCapacitanceF, 'F')}`, role: 'model', values: model },
    ],
    summary: `At DC the divider keeps ${percent(dc * 100)}; the response is 3 dB below that at ${eng(cornerHz, 'Hz')} and falls 20 dB per decade beyond.${at}`,
  };
}

/** An effective bandwidth, when the hypothesis is the one fitted to an observed slow edge. */
function fittedBandwidth(input: DiagnosisInput, hypothesis: HypothesisFit | undefined): number | undefined {
  const effective = num(hypothesis?.estimates?.effectiveBandwidthHz);
  const observedRise = observedOf(input).riseTimeS;
  const predictedRise = hypothesis?.predicted.riseTimeS;
  if (effective === undefined || observedRise === undefined || predictedRise === undefined) return undefined;
  // The fitted candidate predicts exactly the observed edge; the recorded chain predicts its own.
  return Math.abs(predictedRise / observedRise - 1) < 1e-9 ? effective : undefined;
}

function bandwidthPlot(recorded: ResolvedSetup, effectiveHz: number | undefined): LinePlot | null {
  const setup =
    effectiveHz === undefined
      ? recorded
      : { ...recorded, probeBandwidthHz: effectiveHz, scopeBandwidthHz: undefined, bandwidthLimitHz: undefined };
  const riseS = systemRiseTimeS(setup);
  if (riseS === undefined) return null;
  const chainHz = bandwidthFromRiseTimeHz(riseS);
  const x = frequencyAxis(chainHz, setup.frequencyHz, 1e-3, 10);
  const model = x.map((f) => chainMagnitudeAt(setup, f));
  return {
    kind: 'line',
    title: effectiveHz === undefined ? 'Magnitude response of the probe and scope' : 'Magnitude response fitted to the observed edge',
    x,
    xUnit: 'Hz',
    yUnit: '',
    xLabel: 'Frequency',
    yLabel: 'Shown ÷ true amplitude',
    logX: true,
    series: [
      { label: 'Flat response', role: 'reference', values: x.map(() => 1) },
      { label: effectiveHz === undefined ? 'Model: recorded chain' : `Model: ${eng(effectiveHz, 'Hz')} effective`, role: 'model', values: model },
    ],
    summary: `The chain behaves like about ${eng(chainHz, 'Hz')} of bandwidth (rise time ${eng(riseS, 's')}); sine components above that are shown smaller and edges slower.`,
  };
}

/** Log-spaced frequencies from lowFactor·corner to highFactor·corner, widened to show the signal's frequency. */
function frequencyAxis(cornerHz: number, signalHz: number | undefined, lowFactor: number, highFactor: number): number[] {
  let low = cornerHz * lowFactor;
  let high = cornerHz * highFactor;
  if (signalHz !== undefined && signalHz > 0) {
    low = Math.min(low, signalHz / 10);
    high = Math.max(high, signalHz * 10);
  }
  return geometricGrid(low, high, 240);
}

function amplitudeBars(
  input: DiagnosisInput,
  setup: ResolvedSetup,
  cause: 'attenuation-mismatch' | 'termination-mismatch',
  predictedV: number | undefined,
): AmplitudeBars | null {
  const expected = setup.expectedAmplitudeV;
  if (expected === undefined) return null;
  const shown =
    predictedV ??
    (cause === 'attenuation-mismatch'
      ? shownAmplitudeV(expected, setup.channelSetting, setup.probeAttenuation)
      : setup.scopeInputResistanceOhm < LOW_IMPEDANCE_INPUT_OHM
        ? expected * terminationShownRatio(setup)
        : expected);
  const observed = observedOf(input).amplitudeV;
  const bars: AmplitudeBars['bars'] = [
    { label: 'Expected at the tip', role: 'reference', valueV: expected },
    { label: 'Shown, if this is the cause', role: 'model', valueV: shown },
  ];
  if (observed !== undefined) bars.push({ label: 'Observed', role: 'observed', valueV: observed });
  const ratio = shown / expected;
  const scale = Math.abs(ratio - 1) < 1e-3 ? 'the true amplitude' : ratio < 1 ? `1/${factor(1 / ratio)} of it` : `${factor(ratio)} times it`;
  return {
    kind: 'bars',
    title: cause === 'attenuation-mismatch' ? 'Amplitude with this attenuation setting' : 'Amplitude with this input termination',
    bars,
    summary: `The scope would show ${eng(shown, 'V')} for ${eng(expected, 'V')} at the tip: ${scale}${observed === undefined ? '' : `; ${eng(observed, 'V')} was observed`}.`,
  };
}
