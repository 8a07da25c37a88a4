import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CAUSES, type DiagnosisInput } from '../../shared/schemas/diagnosis';
import { diagnose } from '../../shared/diagnosis/ranker';
import { diagnosisPlot, type DiagnosisPlot, type LinePlot } from '../../shared/diagnosis/curves';
import { geometricGrid, rampResponse, stepGrid } from '../../shared/diagnosis/curve-grids';

const linePlot = (plot: DiagnosisPlot | null): LinePlot => {
  if (!plot || plot.kind !== 'line') throw new Error(`expected a line plot, got ${plot?.kind ?? 'null'}`);
  return plot;
};
const model = (plot: LinePlot) => plot.series.find((s) => s.role === 'model')!.values;

/** x where a falling curve first crosses `level`, interpolated in log x. */
function crossing(x: number[], y: number[], level: number): number {
  const i = y.findIndex((v) => v < level);
  const f = (y[i - 1] - level) / (y[i - 1] - y[i]);
  return Math.exp(Math.log(x[i - 1]) + f * (Math.log(x[i]) - Math.log(x[i - 1])));
}

const probe10x: DiagnosisInput = {
  probe: { attenuation: 10, tipCapacitanceF: 12e-12, groundLeadM: 0.15 },
  scope: { attenuationSetting: 10, inputResistanceOhm: 1e6, inputCapacitanceF: 15e-12, bandwidthHz: 200e6 },
  circuit: { sourceResistanceOhm: 33 },
  signal: { expectedAmplitudeV: 5, frequencyHz: 1e3, kind: 'square' },
};

describe('compensation step curve', () => {
  it('should stay flat at the true level when R1·C1 = R2·C2', () => {
    // source: compensated attenuator, flat when R1·C1 = R2·C2 (DESIGN.md, Compensation)
    const plot = linePlot(diagnosisPlot(probe10x, 'compensation'));
    const after = model(plot).filter((_, i) => plot.x[i] >= 0);
    for (const v of after) expect(v).toBeCloseTo(5, 9);
  });

  it('should jump by the fitted overshoot and settle to the DC divider ratio', () => {
    const input = { ...probe10x, observed: { amplitudeV: 5, overshootPct: 15 } };
    const h = diagnose(input).hypotheses.find((x) => x.cause === 'compensation')!;
    const plot = linePlot(diagnosisPlot(input, 'compensation', h));
    const y = model(plot);
    const at0 = y[plot.x.indexOf(0)];
    // source: charge sharing sets the edge: 15 % corner overshoot over the settled level
    expect(at0).toBeCloseTo(5 * 1.15, 6);
    // source: voltage-divider rule, R2/(R1 + R2) = 1 MΩ/(9 MΩ + 1 MΩ), times the 10x setting
    const settled = 5 * (1e6 / (9e6 + 1e6)) * 10;
    const tau = h.estimates!.timeConstantS as number;
    const last = plot.x.length - 1;
    // source: single-time-constant decay, excess × e^(−t/τ)
    expect(y[last]).toBeCloseTo(settled + (at0 - settled) * Math.exp(-plot.x[last] / tau), 9);
    expect(Math.abs(y[last] - settled)).toBeLessThan(0.01 * settled);
  });

  it('should not draw a divider for a 1x probe', () => {
    // common practice: a 1x probe is a plain conductor, with no trimmer
    expect(diagnosisPlot({ probe: { attenuation: 1 } }, 'compensation')).toBeNull();
  });
});

describe('ground-lead step curve', () => {
  // source: Grover, Inductance Calculations (1946): L = 0.002·l·(ln(2l/ρ) − 3/4) µH, l and ρ in cm;
  // a 15 cm lead of 0.5 mm wire (ρ = 0.025 cm)
  const leadH = 0.002 * 15 * (Math.log((2 * 15) / 0.025) - 0.75) * 1e-6;
  const zeta = (33 / 2) * Math.sqrt(12e-12 / leadH);
  const ringHz = (1 / (2 * Math.PI * Math.sqrt(leadH * 12e-12))) * Math.sqrt(1 - zeta ** 2);

  it('should overshoot as a second-order step does and ring at the damped frequency', () => {
    const plot = linePlot(diagnosisPlot(probe10x, 'ground-lead'));
    const y = model(plot);
    // source: M_p = exp(−πζ/√(1−ζ²)), Ogata, Modern Control Engineering, ch. 5
    const overshootPct = 100 * Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta ** 2));
    expect((Math.max(...y) / 5 - 1) * 100).toBeCloseTo(overshootPct, 0);
    // source: peaks of an underdamped step are one damped period 1/f_d apart
    const peaks = y.map((v, i) => (i > 0 && i < y.length - 1 && v > y[i - 1] && v >= y[i + 1] && v > 5 ? plot.x[i] : NaN)).filter(Number.isFinite);
    expect((peaks[1] - peaks[0]) * ringHz).toBeCloseTo(1, 1);
    expect(y[y.length - 1]).toBeCloseTo(5, 1);
  });

  it('should lose its ringing when the edge lasts exactly one ringing period', () => {
    // source: averaging over a window T (a ramp edge) nulls a sinusoid of frequency 1/T
    const riseTimeS = (0.8 * 1) / ringHz;
    const plot = linePlot(diagnosisPlot({ ...probe10x, circuit: { sourceResistanceOhm: 2 }, signal: { ...probe10x.signal, riseTimeS } }, 'ground-lead'));
    const ideal = linePlot(diagnosisPlot({ ...probe10x, circuit: { sourceResistanceOhm: 2 } }, 'ground-lead'));
    expect(Math.max(...model(ideal)) / 5 - 1).toBeGreaterThan(0.9);
    expect(Math.max(...model(plot)) / 5 - 1).toBeLessThan(0.05);
  });

  it('should use the inductance fitted to an observed ringing', () => {
    const input = { ...probe10x, probe: { attenuation: 10, tipCapacitanceF: 12e-12 }, observed: { ringingFrequencyHz: 200e6 } };
    const fitted = diagnose(input).hypotheses.find((x) => x.cause === 'ground-lead')!;
    expect(fitted.estimates?.inductanceH).toBeUndefined();
    const plot = linePlot(diagnosisPlot(input, 'ground-lead', fitted));
    const y = model(plot);
    const peaks = y.map((v, i) => (i > 0 && i < y.length - 1 && v > y[i - 1] && v >= y[i + 1] && v > 5 ? plot.x[i] : NaN)).filter(Number.isFinite);
    // the fit reproduces the observation, so successive peaks sit 1/200 MHz apart
    expect((peaks[1] - peaks[0]) * 200e6).toBeCloseTo(1, 1);
  });

  it('should draw nothing without a ground lead', () => {
    expect(diagnosisPlot({ probe: { groundKind: 'none' } }, 'ground-lead')).toBeNull();
  });
});

describe('ramp response', () => {
  it('should match the closed-form ramp response of a first-order system', () => {
    // source: first-order ramp response, y(t) = (t − τ(1 − e^(−t/τ)))/T during the ramp (Ogata, ch. 5)
    const tau = 1e-6;
    const rampS = 3e-6;
    const t = stepGrid(10e-6, 4000);
    const step = t.map((s) => (s < 0 ? 0 : 1 - Math.exp(-s / tau)));
    const y = rampResponse(t, step, rampS);
    t.forEach((s, i) => {
      if (s < 0) expect(y[i]).toBe(0);
      else if (s <= rampS) expect(y[i]).toBeCloseTo((s - tau * (1 - Math.exp(-s / tau))) / rampS, 4);
    });
  });
});

describe('loading magnitude curve', () => {
  const oneXOnHighZ: DiagnosisInput = {
    probe: { attenuation: 1, tipCapacitanceF: 100e-12 },
    scope: { attenuationSetting: 1, inputResistanceOhm: 1e6 },
    circuit: { sourceResistanceOhm: 1e6 },
  };

  it('should be 3 dB below its DC level at 1/(2π (R_s∥R_in) C)', () => {
    const plot = linePlot(diagnosisPlot(oneXOnHighZ, 'loading'));
    const y = model(plot);
    // source: voltage-divider rule, 1 MΩ/(1 MΩ + 1 MΩ)
    expect(y[0]).toBeCloseTo(0.5, 4);
    // source: first-order RC low-pass, −3 dB at 1/(2πRC); R = 1 MΩ ∥ 1 MΩ = 500 kΩ, C = 100 pF → 3183.1 Hz
    const cornerHz = 1 / (2 * Math.PI * 500e3 * 100e-12);
    expect(crossing(plot.x, y, 0.5 / Math.SQRT2) / cornerHz).toBeCloseTo(1, 2);
    // source: first-order low-pass falls 20 dB per decade well above the corner
    const last = y.length - 1;
    expect(y[last] / (0.5 * (cornerHz / plot.x[last]))).toBeCloseTo(1, 3);
    expect(plot.logX).toBe(true);
  });
});

describe('bandwidth magnitude curve', () => {
  it('should put the −3 dB point of two equal 200 MHz poles at 200 MHz·√(√2 − 1)', () => {
    // source: n identical first-order stages in cascade reach −3 dB at f_c·√(2^(1/n) − 1)
    const input: DiagnosisInput = { probe: { attenuation: 10, bandwidthHz: 200e6 }, scope: { attenuationSetting: 10, bandwidthHz: 200e6 } };
    const plot = linePlot(diagnosisPlot(input, 'bandwidth'));
    expect(crossing(plot.x, model(plot), Math.SQRT1_2) / (200e6 * Math.sqrt(Math.SQRT2 - 1))).toBeCloseTo(1, 2);
  });

  it('should draw nothing when no bandwidth is known', () => {
    expect(diagnosisPlot({ probe: { attenuation: 10 } }, 'bandwidth')).toBeNull();
  });
});

describe('amplitude bars', () => {
  it('should show a tenth for a 10x probe read at 1x', () => {
    // source: definition of probe attenuation, shown = true × setting ÷ actual (common practice)
    const input: DiagnosisInput = { probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, signal: { expectedAmplitudeV: 3.3 }, observed: { amplitudeV: 0.33 } };
    const plot = diagnosisPlot(input, 'attenuation-mismatch');
    expect(plot?.kind).toBe('bars');
    if (plot?.kind !== 'bars') return;
    expect(plot.bars.map((b) => b.role)).toEqual(['reference', 'model', 'observed']);
    expect(plot.bars[1].valueV).toBeCloseTo(0.33, 12);
  });

  it('should divide by (R_tip + 50 Ω)/50 Ω for a 10x probe into 50 Ω', () => {
    // source: DESIGN.md, Termination mismatch: (9 MΩ + 50 Ω)/50 Ω ≈ 180,000 against the 10 the channel assumes
    const input: DiagnosisInput = { probe: { attenuation: 10 }, scope: { inputResistanceOhm: 50 }, circuit: { sourceResistanceOhm: 0 }, signal: { expectedAmplitudeV: 5 } };
    const plot = diagnosisPlot(input, 'termination-mismatch');
    if (plot?.kind !== 'bars') throw new Error('expected bars');
    expect(plot.bars[1].valueV / ((5 * 10 * 50) / (9e6 + 50))).toBeCloseTo(1, 9);
  });

  it('should draw nothing without an expected amplitude', () => {
    expect(diagnosisPlot({ scope: { attenuationSetting: 1 } }, 'attenuation-mismatch')).toBeNull();
  });
});

describe('every curve', () => {
  it('should have ascending x and finite values for any plausible setup', () => {
    // common practice, no source: the ranges span ordinary bench setups
    fc.assert(
      fc.property(
        fc.constantFrom(1, 10, 100),
        fc.constantFrom(1, 10, 100),
        fc.double({ min: 0, max: 1e7, noNaN: true }),
        fc.double({ min: 0.002, max: 0.3, noNaN: true }),
        fc.option(fc.double({ min: 1e-10, max: 1e-6, noNaN: true }), { nil: undefined }),
        fc.constantFrom(50, 1e6),
        (attenuation, setting, sourceOhm, leadM, riseTimeS, inputOhm) => {
          const input: DiagnosisInput = {
            probe: { attenuation, groundLeadM: leadM },
            scope: { attenuationSetting: setting, inputResistanceOhm: inputOhm, bandwidthHz: 100e6 },
            circuit: { sourceResistanceOhm: sourceOhm },
            signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e6, riseTimeS },
          };
          for (const h of diagnose(input).hypotheses) {
            const plot = diagnosisPlot(input, h.cause, h);
            if (!plot) continue;
            if (plot.kind === 'bars') {
              for (const b of plot.bars) expect(Number.isFinite(b.valueV)).toBe(true);
              continue;
            }
            for (let i = 1; i < plot.x.length; i++) expect(plot.x[i]).toBeGreaterThan(plot.x[i - 1]);
            for (const s of plot.series) for (const v of s.values) expect(Number.isFinite(v)).toBe(true);
          }
        },
      ),
      { numRuns: 20 },
    );
    expect(CAUSES.length).toBe(12);
  });

  it('should space a log axis in equal ratios', () => {
    const f = geometricGrid(10, 1e6, 6);
    f.forEach((v, i) => expect(v).toBeCloseTo(10 ** (i + 1), 6));
  });
});
