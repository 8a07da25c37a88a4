import { describe, expect, it } from 'vitest';
import { analyzeCapture } from '../../shared/capture/analyze';
import { sampleUniformly, secondOrderStep, squareWaveform, stepWaveform } from '../../shared/capture/synthetic';
import { captureOverlay } from '../../shared/diagnosis/capture-overlay';
import { diagnose } from '../../shared/diagnosis/ranker';
import { inSentence } from '../../shared/diagnosis/wording';
import type { DiagnosisInput, Hypothesis } from '../../shared/schemas/diagnosis';

const groundLeadInput: DiagnosisInput = {
  probe: { attenuation: 10, tipCapacitanceF: 10e-12, groundLeadM: 0.15, groundWireRadiusM: 0.25e-3 },
  scope: { attenuationSetting: 10, inputResistanceOhm: 1e6 },
  circuit: { sourceResistanceOhm: 25 },
  signal: { expectedAmplitudeV: 1 },
};

const hypothesisFor = (input: DiagnosisInput, cause: Hypothesis['cause']) => diagnose(input).hypotheses.find((h) => h.cause === cause)!;

/** Linear interpolation of the overlay at t. */
function at(timesS: number[], volts: number[], t: number): number {
  const i = timesS.findIndex((x) => x >= t);
  if (i <= 0) return volts[Math.max(0, i)];
  return volts[i - 1] + ((t - timesS[i - 1]) / (timesS[i] - timesS[i - 1])) * (volts[i] - volts[i - 1]);
}

describe('the model overlay on a capture', () => {
  // a 0.1 V → 1.1 V ringing step at 200 ns, sampled every 0.1 ns for 1 µs
  const samples = sampleUniformly(stepWaveform(secondOrderStep(120e6, 0.15), 0.1, 1.1, 200e-9), { sampleIntervalS: 0.1e-9, points: 10_000 });
  const analysis = analyzeCapture(samples);
  const extent = { startS: 0, endS: samples.timesS[samples.timesS.length - 1] };

  it('should scale the ground-lead step to the capture levels and put its 50 % point on the edge', () => {
    const result = captureOverlay(groundLeadInput, hypothesisFor(groundLeadInput, 'ground-lead'), analysis, extent);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { timesS, volts, label } = result.overlay;
    expect(label).toMatch(/^Model \(ground-lead ringing\)/);
    const edge = analysis.edges[0];
    const baseV = analysis.baseV!;
    const topV = analysis.topV!;
    expect(at(timesS, volts, edge.t50S)).toBeCloseTo((baseV + topV) / 2, 4);
    expect(volts[0]).toBe(baseV);
    expect(volts[volts.length - 1]).toBeCloseTo(topV, 12);
    // the histogram levels of this capture are its 0.1 V and 1.1 V. source: IEEE Std 181-2011, 5.2.1
    expect(baseV).toBeCloseTo(0.1, 2);
    expect(topV).toBeCloseTo(1.1, 2);
    expect(timesS[timesS.length - 1]).toBe(extent.endS);
  });

  it('should ring at the series-RLC frequency of the lead and tip capacitance', () => {
    const result = captureOverlay(groundLeadInput, hypothesisFor(groundLeadInput, 'ground-lead'), analysis, extent);
    if (!result.ok) throw new Error(result.reason);
    const { timesS, volts } = result.overlay;
    const upward: number[] = [];
    for (let i = 1; i < timesS.length; i++) {
      if (volts[i - 1] < 1.1 && volts[i] >= 1.1) upward.push(timesS[i - 1] + ((1.1 - volts[i - 1]) / (volts[i] - volts[i - 1])) * (timesS[i] - timesS[i - 1]));
    }
    expect(upward.length).toBeGreaterThan(3);
    const measuredHz = (upward.length - 1) / (upward[upward.length - 1] - upward[0]);
    // source: series RLC step response, f_d = f_n·√(1 − ζ²), f_n = 1/(2π√(LC)), ζ = (R/2)·√(C/L);
    // L of 15 cm of 0.5 mm wire by Rosa's straight-wire formula, (μ0·l/2π)(ln(2l/r) − 3/4)
    const inductanceH = ((4e-7 * Math.PI * 0.15) / (2 * Math.PI)) * (Math.log((2 * 0.15) / 0.25e-3) - 0.75);
    const fnHz = 1 / (2 * Math.PI * Math.sqrt(inductanceH * 10e-12));
    const zeta = (25 / 2) * Math.sqrt(10e-12 / inductanceH);
    expect(measuredHz / (fnHz * Math.sqrt(1 - zeta * zeta))).toBeCloseTo(1, 2);
  });

  it('should stop a shape model at the next edge of a square wave', () => {
    const square = sampleUniformly(squareWaveform(secondOrderStep(120e6, 0.3), { periodS: 400e-9, baseV: 0, topV: 3.3 }), { sampleIntervalS: 0.2e-9, points: 5000 });
    const squareAnalysis = analyzeCapture(square);
    const result = captureOverlay(groundLeadInput, hypothesisFor(groundLeadInput, 'ground-lead'), squareAnalysis, { startS: 0, endS: 999.8e-9 });
    if (!result.ok) throw new Error(result.reason);
    expect(result.overlay.timesS[result.overlay.timesS.length - 1]).toBeCloseTo(squareAnalysis.edges[1].t10S, 15);
  });

  it('should draw an amplitude hypothesis as the predicted top level', () => {
    // a 10x probe read on a channel set to 1x shows a tenth. common practice, no source
    const input: DiagnosisInput = { probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, signal: { expectedAmplitudeV: 10 }, observed: { amplitudeV: 1 } };
    const result = captureOverlay(input, hypothesisFor(input, 'attenuation-mismatch'), analysis, extent);
    if (!result.ok) throw new Error(result.reason);
    expect(result.overlay.volts).toEqual([0.1 + 1, 0.1 + 1].map((v) => expect.closeTo(v, 9)));
    expect(result.overlay.timesS).toEqual([extent.startS, extent.endS]);
  });

  it('should say why there is nothing to draw for a flat capture', () => {
    const flat = analyzeCapture(sampleUniformly(() => 0.5, { sampleIntervalS: 1e-9, points: 100 }));
    const result = captureOverlay(groundLeadInput, hypothesisFor(groundLeadInput, 'ground-lead'), flat, { startS: 0, endS: 99e-9 });
    expect(result).toEqual({ ok: false, reason: 'the capture has no two levels to scale a model to' });
  });
});

/** The termination hypothesis of a 10x probe on a 50 Ω input, over one rising edge. */
function terminationOverlay() {
  const input: DiagnosisInput = {
    probe: { attenuation: 10, tipCapacitanceF: 12e-12 },
    scope: { attenuationSetting: 10, inputResistanceOhm: 50 },
    circuit: { sourceResistanceOhm: 0 },
    signal: { expectedAmplitudeV: 2, frequencyHz: 100e3, kind: 'square' },
  };
  const h = diagnose(input).hypotheses.find((x) => x.causes.length === 1 && x.cause === 'termination-mismatch')!;
  const anchor = { baseV: 0, topV: 2.2e-4, edges: [{ kind: 'rise' as const, t10S: 1e-6, t50S: 1e-6, t90S: 1e-6 }] };
  const result = captureOverlay(input, h, anchor, { startS: 0, endS: 5e-6 });
  if (!result.ok) throw new Error(result.reason);
  return result;
}

describe('the termination overlay', () => {
  it('should draw the predicted spike in volts at each rising edge, not a stretched step', () => {
    const result = terminationOverlay();
    // source: charge sharing C1/(C1 + C2) = 1/10 of the 2 V step, × the 10x channel = 2 V
    expect(Math.max(...result.overlay.volts)).toBeCloseTo(2, 3);
    expect(result.overlay.label).toMatch(/spikes/);
  });
});

describe("cause names inside the overlay's sentences", () => {
  it('should keep unit symbols and acronyms as written, lowering only a first word that is no acronym', () => {
    // common practice, no source: the ohm sign is a capital omega; lower-cased it reads as the angular-frequency ω
    const cases: [string, string][] = [
      ['High-impedance probe on a 50 Ω input', 'high-impedance probe on a 50 Ω input'],
      ['AC coupling droop or lost DC level', 'AC coupling droop or lost DC level'],
      ['Ground-lead ringing', 'ground-lead ringing'],
      ['', ''],
    ];
    for (const [label, inASentence] of cases) expect(inSentence(label)).toBe(inASentence);
  });

  it('should name the termination hypothesis with its ohm sign in the plot legend', () => {
    const result = terminationOverlay();
    expect(result.overlay.label).toContain('50 Ω input');
  });
});
