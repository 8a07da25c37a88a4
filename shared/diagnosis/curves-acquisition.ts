import type { DiagnosisInput } from '../schemas/diagnosis';
import type { ResolvedSetup } from './types';
import type { CurveSeries, HypothesisFit, LinePlot } from './curves';
import { observedOf } from './defaults';
import { aliasFrequencyHz } from './aliasing';
import { clippedSpan, screenWindow, shownSpanV, type ScreenWindow } from './clipping';
import { TYPICAL_AC_CORNER_HZ, acSeriesResistanceOhm, effectiveAcCornerHz, highPassMagnitude, squareWaveTiltFraction } from './ac-coupling';
import { AT_EARTH_V, commonModeShare, typicalCmrrDb } from './common-mode';
import { generatorLoadOhm, generatorShownRatio } from './generator-load';
import type { GeneratorLoad } from '../schemas/diagnosis';
import { geometricGrid } from './curve-grids';
import { eng, factor, percent } from './wording';

const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
const linearGrid = (low: number, high: number, points: number) => Array.from({ length: points }, (_, i) => low + ((high - low) * i) / (points - 1));

/**
 * Where a sampled signal shows up against its true frequency: the folding of |f − k·f_s|
 * around multiples of f_s/2, with the signal (and the observation) marked. A fitted sample
 * rate (`impliedSampleRateHz`) is drawn when the hypothesis carries one.
 */
export function aliasingPlot(input: DiagnosisInput, setup: ResolvedSetup, hypothesis?: HypothesisFit): LinePlot | null {
  const signalHz = setup.frequencyHz;
  const fitted = num(hypothesis?.estimates?.impliedSampleRateHz);
  const rateHz = fitted ?? setup.sampleRateHz;
  if (signalHz === undefined || rateHz === undefined || setup.signalKind === 'dc') return null;
  const shownHz = aliasFrequencyHz(signalHz, rateHz);
  // Around the signal, two sample rates either side (from 0 when the signal is low): the folds stay legible.
  const low = Math.max(0, signalHz - 2 * rateHz);
  const high = Math.max(signalHz + 2 * rateHz, 1.25 * signalHz);
  const x = linearGrid(low, high, 801);
  const observedHz = observedOf(input).frequencyHz;
  const series: CurveSeries[] = [
    { label: 'Faithful: shown = true', role: 'reference', values: x },
    { label: `Model: sampled at ${eng(rateHz, 'Sa/s')}`, role: 'model', values: x.map((f) => aliasFrequencyHz(f, rateHz)) },
  ];
  if (observedHz !== undefined) series.push({ label: `Observed: ${eng(observedHz, 'Hz')}`, role: 'observed', values: x.map(() => observedHz) });
  return {
    kind: 'line',
    title: `Where the signal shows up at ${eng(rateHz, 'Sa/s')}${fitted === undefined ? '' : ' (fitted)'}`,
    x,
    xUnit: 'Hz',
    yUnit: 'Hz',
    xLabel: 'True frequency',
    yLabel: 'Frequency on screen',
    logX: false,
    series,
    summary:
      signalHz <= rateHz / 2
        ? `The ${eng(signalHz, 'Hz')} signal is below half the sample rate (${eng(rateHz / 2, 'Hz')}) and shows where it is.`
        : `Above half the sample rate (${eng(rateHz / 2, 'Hz')}) frequencies fold back: the ${eng(signalHz, 'Hz')} signal shows at ${eng(shownHz, 'Hz')}.`,
  };
}

/** One or two periods of the signal on the screen's scale, at `points` times (s). */
function traceOf(setup: ResolvedSetup, lowV: number, highV: number, points = 800): { x: number[]; values: number[]; periodic: boolean } {
  const f = setup.frequencyHz;
  if (f === undefined || setup.signalKind === 'dc') {
    const x = linearGrid(0, 1e-3, points);
    return { x, values: x.map(() => highV), periodic: false };
  }
  const periodS = 1 / f;
  const x = linearGrid(0, 2 * periodS, points);
  const mid = (lowV + highV) / 2;
  const half = (highV - lowV) / 2;
  const values = x.map((t) => {
    const phase = (t / periodS) % 1;
    if (setup.signalKind === 'sine' || setup.signalKind === 'other') return mid + half * Math.sin(2 * Math.PI * phase);
    return phase < 0.5 ? highV : lowV;
  });
  return { x, values, periodic: true };
}

/**
 * The screen window over the signal: the trace as it is at the tip (on the screen's scale),
 * the window's edges, and what the screen keeps. A fitted window (`impliedVoltsPerDiv`) is
 * centred on the signal.
 */
export function clippingPlot(setup: ResolvedSetup, hypothesis?: HypothesisFit): LinePlot | null {
  const span = shownSpanV(setup);
  if (!span) return null;
  const fittedPerDiv = num(hypothesis?.estimates?.impliedVoltsPerDiv);
  let window: ScreenWindow;
  if (fittedPerDiv !== undefined) window = screenWindow(fittedPerDiv, (span.lowV + span.highV) / 2, setup.divisions);
  else if (setup.voltsPerDiv !== undefined) window = screenWindow(setup.voltsPerDiv, setup.offsetV ?? 0, setup.divisions);
  else return null;
  const trace = traceOf(setup, span.lowV, span.highV);
  const kept = trace.values.map((v) => clippedSpan(v, v, window).highV);
  const cut = kept.some((v, i) => v !== trace.values[i]);
  return {
    kind: 'line',
    title: `The screen window over the signal${fittedPerDiv === undefined ? '' : ' (fitted)'}`,
    x: trace.x,
    xUnit: 's',
    yUnit: 'V',
    xLabel: trace.periodic ? 'Time' : 'Time (a DC level: any span)',
    yLabel: 'On the screen’s scale',
    logX: false,
    series: [
      { label: 'Signal at the tip', role: 'reference', values: trace.values },
      { label: `Screen top ${eng(window.topV, 'V')}`, role: 'reference', values: trace.x.map(() => window.topV) },
      { label: `Screen bottom ${eng(window.bottomV, 'V')}`, role: 'reference', values: trace.x.map(() => window.bottomV) },
      { label: 'Model: what the screen shows', role: 'model', values: kept },
    ],
    summary: cut
      ? `The screen spans ${eng(window.bottomV, 'V')} to ${eng(window.topV, 'V')}; the signal runs from ${eng(span.lowV, 'V')} to ${eng(span.highV, 'V')}, so the part outside is cut flat at the edge.`
      : `The screen spans ${eng(window.bottomV, 'V')} to ${eng(window.topV, 'V')} and holds the whole signal (${eng(span.lowV, 'V')} to ${eng(span.highV, 'V')}).`,
  };
}

/**
 * AC coupling: two periods of a square in steady state through the high-pass (the tops droop,
 * the trace centres on zero), or the high-pass magnitude for other signals. A fitted corner
 * (`impliedEffectiveCornerHz`) is used when the hypothesis carries one.
 */
export function acCouplingPlot(setup: ResolvedSetup, hypothesis?: HypothesisFit): LinePlot | null {
  const fittedHz = num(hypothesis?.estimates?.impliedEffectiveCornerHz);
  if (fittedHz === undefined && setup.coupling !== 'ac') return null;
  const seriesOhm = acSeriesResistanceOhm(setup);
  const cornerHz = fittedHz ?? effectiveAcCornerHz(setup.acCornerHz ?? TYPICAL_AC_CORNER_HZ, setup.scopeInputResistanceOhm, seriesOhm);
  const f = setup.frequencyHz;
  const amplitude = setup.expectedAmplitudeV ?? 1;
  const yUnit = setup.expectedAmplitudeV === undefined ? ('' as const) : ('V' as const);
  const label = fittedHz === undefined ? `Model: corner ${eng(cornerHz, 'Hz')}` : `Model: corner ${eng(cornerHz, 'Hz')} (fitted)`;
  if (setup.signalKind === 'square' && f !== undefined) {
    const periodS = 1 / f;
    const tauS = 1 / (2 * Math.PI * cornerHz);
    const x = linearGrid(0, 2 * periodS, 800);
    // steady state: each top starts at A/(1 + e^(−T/2τ)) and decays with τ; the bottoms mirror it
    const startV = amplitude / (1 + Math.exp(-periodS / (2 * tauS)));
    const baseV = setup.baseV ?? 0;
    const model = x.map((t) => {
      const inHalf = t % (periodS / 2);
      const high = (t / periodS) % 1 < 0.5;
      return (high ? 1 : -1) * startV * Math.exp(-inHalf / tauS);
    });
    const tilt = squareWaveTiltFraction(f, cornerHz);
    return {
      kind: 'line',
      title: 'The square through the AC coupling',
      x,
      xUnit: 's',
      yUnit,
      xLabel: 'Time',
      yLabel: yUnit === 'V' ? 'Shown at the scope' : 'Shown ÷ true step',
      logX: false,
      series: [
        { label: 'Signal at the tip (DC-coupled)', role: 'reference', values: x.map((t) => ((t / periodS) % 1 < 0.5 ? baseV + amplitude : baseV)) },
        { label, role: 'model', values: model },
      ],
      summary: `Each top droops by ${percent(tilt * 100)} of the step (tanh(T/4τ), τ = ${eng(tauS, 's')}), and the trace centres on zero: its DC level is lost.`,
    };
  }
  const x = geometricGrid(cornerHz / 100, Math.max(cornerHz * 100, (f ?? 0) * 10), 240);
  return {
    kind: 'line',
    title: 'Magnitude response of the AC coupling',
    x,
    xUnit: 'Hz',
    yUnit: '',
    xLabel: 'Frequency',
    yLabel: 'Shown ÷ true amplitude',
    logX: true,
    series: [
      { label: 'DC-coupled', role: 'reference', values: x.map(() => 1) },
      { label, role: 'model', values: x.map((v) => highPassMagnitude(v, cornerHz)) },
    ],
    summary:
      `A high-pass at ${eng(cornerHz, 'Hz')}: a DC level reads zero, and a sine keeps f/√(f² + f_c²)` +
      (f === undefined || setup.signalKind === 'dc' ? '.' : `, ${percent(100 * highPassMagnitude(f, cornerHz))} at the signal's ${eng(f, 'Hz')}.`),
  };
}

/**
 * The share of the reference node's swing a differential probe passes, in dB, against
 * frequency: a typical rejection curve shifted through the recorded (or fitted) CMRR at the
 * signal frequency, beside the share at which the leak equals the signal.
 */
export function commonModePlot(setup: ResolvedSetup, hypothesis?: HypothesisFit): LinePlot | null {
  const referenceV = setup.referenceV;
  if (setup.probeKind !== 'differential' || referenceV === undefined || Math.abs(referenceV) < AT_EARTH_V) return null;
  const atHz = setup.frequencyHz;
  const cmrrDb = num(hypothesis?.estimates?.impliedCmrrDb) ?? setup.probeCmrrDb ?? typicalCmrrDb(atHz);
  const shiftDb = cmrrDb - typicalCmrrDb(atHz);
  const x = geometricGrid(10, Math.max(100e6, (atHz ?? 0) * 10), 240);
  const shareDb = x.map((f) => -(typicalCmrrDb(f) + shiftDb));
  const series: CurveSeries[] = [{ label: `Model: ${cmrrDb.toFixed(0)} dB at ${atHz === undefined ? 'low frequency' : eng(atHz, 'Hz')}`, role: 'model', values: shareDb }];
  const expected = setup.expectedAmplitudeV;
  if (expected !== undefined) {
    const equalDb = 20 * Math.log10(expected / Math.abs(referenceV));
    series.unshift({ label: 'Leak as large as the signal', role: 'reference', values: x.map(() => equalDb) });
  }
  return {
    kind: 'line',
    title: 'Common-mode share the probe passes',
    x,
    xUnit: 'Hz',
    yUnit: 'dB',
    xLabel: 'Frequency',
    yLabel: 'Passed ÷ common mode (dB)',
    logX: true,
    series,
    summary:
      `With ${cmrrDb.toFixed(0)} dB of rejection, ${percent(100 * commonModeShare(cmrrDb))} of the ${eng(Math.abs(referenceV), 'V')} swing reaches the trace; ` +
      'rejection falls with frequency (a typical curve, shifted through that figure), so fast common-mode edges leak more.',
  };
}

/**
 * The generator divider: shown ÷ set amplitude against the load, for the setting in question
 * and the other one, with the load it drives (recorded or fitted) named in the summary.
 */
export function generatorLoadPlot(input: DiagnosisInput, setup: ResolvedSetup, hypothesis?: HypothesisFit): LinePlot | null {
  const impliedSetting = hypothesis?.estimates?.impliedGeneratorLoad;
  const setting: GeneratorLoad | undefined =
    impliedSetting === '50-ohm' || impliedSetting === 'high-z' ? impliedSetting : setup.generatorLoad;
  if (!setting) return null;
  const loadOhm = num(hypothesis?.estimates?.impliedLoadResistanceOhm) ?? generatorLoadOhm(setup);
  const outOhm = setup.sourceResistanceOhm;
  const other: GeneratorLoad = setting === '50-ohm' ? 'high-z' : '50-ohm';
  const x = geometricGrid(1, Math.max(1e7, loadOhm * 10), 240);
  const names: Record<GeneratorLoad, string> = { '50-ohm': 'set for 50 Ω', 'high-z': 'set for high-Z' };
  const series: CurveSeries[] = [
    { label: `Generator ${names[other]}`, role: 'reference', values: x.map((r) => generatorShownRatio(other, outOhm, r)) },
    { label: `Model: generator ${names[setting]}`, role: 'model', values: x.map((r) => generatorShownRatio(setting, outOhm, r)) },
  ];
  const seen = observedOf(input).amplitudeV;
  const set = setup.expectedAmplitudeV;
  if (seen !== undefined && set !== undefined) series.push({ label: 'Observed', role: 'observed', values: x.map(() => seen / set) });
  const ratio = generatorShownRatio(setting, outOhm, loadOhm);
  return {
    kind: 'line',
    title: `Generator ${names[setting]}, ${eng(outOhm, 'Ω')} output`,
    x,
    xUnit: 'Ω',
    yUnit: '',
    xLabel: 'Load resistance',
    yLabel: 'Shown ÷ set amplitude',
    logX: true,
    series,
    summary: `Into ${eng(loadOhm, 'Ω')} the load sees ${factor(ratio)} times the set amplitude. Each setting is right only into the load it assumes: set for 50 Ω, a high impedance sees double; set for high-Z, 50 Ω sees half.`,
  };
}
