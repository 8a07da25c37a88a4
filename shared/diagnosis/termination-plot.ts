import type { ResolvedSetup } from './types';
import type { LinePlot } from './curves';
import { LOW_IMPEDANCE_INPUT_OHM, terminationDividerOf, terminationEdge } from './termination-mismatch';
import { rampResponse, stepGrid } from './curve-grids';
import { eng, factor, percent } from './wording';

/**
 * The edge a passive probe brings through a low-impedance input, on the screen's scale (the
 * channel set for the probe): a spike to n·C1/(C1 + C2) of the step that decays with
 * τ = (R_tip ∥ R_in)(C1 + C2) to the tiny resistive level. A recorded source edge rounds the
 * spike (ramp response). Null when the setup has no edges or the input is not low-impedance.
 *
 * @param inputResistanceOhm the input the hypothesis puts the probe on (the recorded one, or a
 *   50 Ω input the record missed)
 */
export function terminationPlot(setup: ResolvedSetup, inputResistanceOhm: number): LinePlot | null {
  if (!setup.hasEdges || inputResistanceOhm >= LOW_IMPEDANCE_INPUT_OHM || setup.tipResistanceOhm <= 0) return null;
  const d = terminationDividerOf(setup, inputResistanceOhm);
  const { jump, settle, timeConstantS } = terminationEdge(d);
  if (!(timeConstantS > 0)) return null;
  const amplitude = setup.expectedAmplitudeV ?? 1;
  const yUnit = setup.expectedAmplitudeV === undefined ? '' : 'V';
  const gain = amplitude * setup.probeAttenuation;
  const rampS = setup.signalRiseTimeS === undefined ? 0 : setup.signalRiseTimeS / 0.8;
  const x = stepGrid(8 * timeConstantS + rampS);
  const unit = x.map((t) => (t < 0 ? 0 : settle + (jump - settle) * Math.exp(-t / timeConstantS)));
  const shaped = rampS > 0 ? rampResponse(x, unit, rampS) : unit;
  const model = shaped.map((v) => v * gain);
  const peak = Math.max(...model);
  const show = (v: number) => (yUnit === 'V' ? eng(v, 'V') : factor(v));
  return {
    kind: 'line',
    title: `Predicted edge through a ${eng(inputResistanceOhm, 'Ω')} input`,
    x,
    xUnit: 's',
    yUnit,
    xLabel: 'Time after the edge',
    yLabel: yUnit === 'V' ? 'Shown at the scope' : 'Shown ÷ true step',
    logX: false,
    series: [
      { label: rampS > 0 ? `Edge at the tip (${eng(setup.signalRiseTimeS ?? 0, 's')})` : 'Ideal step at the tip', role: 'reference', values: x.map((t) => (t < 0 ? 0 : rampS > 0 ? Math.min(1, t / rampS) : 1) * amplitude) },
      { label: `Model: spike decaying with τ = ${eng(timeConstantS, 's')}`, role: 'model', values: model },
    ],
    summary: `Each edge comes through as a spike of ${show(peak)} (${percent((peak / amplitude) * 100)} of the step) that decays with τ = ${eng(timeConstantS, 's')} to a flat top of ${show(settle * gain)}, 1/${factor(1 / (settle * setup.probeAttenuation))} of the signal.`,
  };
}
