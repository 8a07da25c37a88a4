import { describe, expect, it } from 'vitest';
import { at, hasNgspice, inCi, ngspiceRunner } from './helpers/ngspice';
import {
  compensationFrequencyResponse,
  dividerLevels,
  type DividerParams,
} from '../../shared/diagnosis/compensation';
import { groundLeadResonance, type GroundLeadParams } from '../../shared/diagnosis/ground-lead';
import { loadingFrequencyResponse, type LoadingParams } from '../../shared/diagnosis/loading';
import {
  spikeEdgeFactor,
  terminationEdge,
  terminationMagnitudeAt,
  type TerminationDivider,
} from '../../shared/diagnosis/termination-mismatch';
import { squareWavePicture } from '../../shared/diagnosis/compensation-picture';
import { balancedDividerOf } from '../../shared/diagnosis/compensation';
import { straightWireInductanceH } from '../../shared/diagnosis/ground-lead';
import { resolveSetup } from '../../shared/diagnosis/defaults';
import { diagnose } from '../../shared/diagnosis/ranker';

const simulate = ngspiceRunner('spice');


const spice = (x: number) => x.toExponential(9);

function dividerCircuit(p: DividerParams): string {
  // step at 10 µs with a 1 ns edge, far shorter than τ ≈ 120 µs
  return `V1 in 0 PULSE(0 1 10u 1n 1n 1 2) AC 1
R1 in out ${spice(p.tipResistanceOhm)}
C1 in out ${spice(p.tipCapacitanceF)}
R2 out 0 ${spice(p.inputResistanceOhm)}
C2 out 0 ${spice(p.inputCapacitanceF)}`;
}

describe('SPICE cross-check', () => {
  it.runIf(!hasNgspice && inCi)('should find ngspice on PATH when CI is set', () => {
    expect.fail('CI is set but ngspice is not on PATH: install ngspice so the SPICE cross-checks run');
  });

  const base = { tipResistanceOhm: 9e6, inputResistanceOhm: 1e6, inputCapacitanceF: 120e-12 };
  const dividers: [string, DividerParams][] = [
    ['compensated', { ...base, tipCapacitanceF: 120e-12 / 9 }],
    ['over-compensated', { ...base, tipCapacitanceF: 20e-12 }],
    ['under-compensated', { ...base, tipCapacitanceF: 9e-12 }],
  ];

  it.skipIf(!hasNgspice).each(dividers)('should match the %s divider step: jump, settle and τ', (_, p) => {
    const { jump, settle, timeConstantS } = dividerLevels(p);
    const rows = simulate(dividerCircuit(p), `tran 100n ${spice(10e-6 + 12 * timeConstantS)} 0 100n`, 'v(out)');
    const edge = 10e-6 + 1e-9;
    // tolerance 0.2 %: 50 ns after the edge the decay (τ ≈ 120 µs) has barely begun
    expect(Math.abs(at(rows, edge + 50e-9) / jump - 1)).toBeLessThan(2e-3);
    // tolerance 0.1 %: after 11 τ the remaining decay is e^-11 ≈ 2e-5 of the step
    expect(Math.abs(at(rows, edge + 11 * timeConstantS) / settle - 1)).toBeLessThan(1e-3);
    if (Math.abs(jump - settle) > 1e-3) {
      // τ from the log-slope of (v − settle) between 0.2 τ and 2 τ; tolerance 1 %
      const t1 = edge + 0.2 * timeConstantS;
      const t2 = edge + 2 * timeConstantS;
      const tauS = (t2 - t1) / Math.log((at(rows, t1) - settle) / (at(rows, t2) - settle));
      expect(Math.abs(tauS / timeConstantS - 1)).toBeLessThan(0.01);
    }
  });

  it.skipIf(!hasNgspice)('should match the divider frequency response from DC to the high-frequency limit', () => {
    const p = dividers[1][1];
    const rows = simulate(dividerCircuit(p), 'ac dec 5 10 100Meg', 'mag(v(out))');
    const ours = compensationFrequencyResponse(p, rows.map(([f]) => f));
    // tolerance 1e-6 relative: both solve the same linear circuit
    rows.forEach(([, magnitude], i) => expect(Math.abs(ours[i] / magnitude - 1)).toBeLessThan(1e-6));
  });

  const leads: [string, GroundLeadParams][] = [
    ['15 cm clip lead, 12 pF, 25 Ω', { sourceResistanceOhm: 25, inductanceH: 190e-9, capacitanceF: 12e-12 }],
    ['1x probe, 100 pF, 10 Ω', { sourceResistanceOhm: 10, inductanceH: 190e-9, capacitanceF: 100e-12 }],
    ['light damping, 2 Ω', { sourceResistanceOhm: 2, inductanceH: 50e-9, capacitanceF: 10e-12 }],
  ];

  it.skipIf(!hasNgspice).each(leads)('should match ground-lead ringing and overshoot (%s)', (_, p) => {
    const r = groundLeadResonance(p);
    const periodS = 1 / (r.ringingFrequencyHz as number);
    const stopS = 1e-9 + 12 * periodS;
    const stepS = periodS / 2000;
    const rows = simulate(
      `V1 in 0 PULSE(0 1 1n 1p 1p 1 2)\nRs in a ${spice(p.sourceResistanceOhm)}\nL1 a out ${spice(p.inductanceH)}\nC1 out 0 ${spice(p.capacitanceF)}`,
      `tran ${spice(stepS)} ${spice(stopS)} 0 ${spice(stepS)}`,
      'v(out)',
    );
    const peak = Math.max(...rows.map(([, v]) => v));
    // tolerance 0.5 percentage points: sampling near the peak and the 1 ps source edge
    expect(Math.abs((peak - 1) * 100 - r.overshootPct)).toBeLessThan(0.5);
    const downward = rows.filter((row, i) => i > 0 && rows[i - 1][1] >= 1 && row[1] < 1).map(([t]) => t);
    const measuredHz = (downward.length - 1) / (downward[downward.length - 1] - downward[0]);
    // tolerance 0.5 %: crossing times from a sampled waveform
    expect(Math.abs(measuredHz / (r.ringingFrequencyHz as number) - 1)).toBeLessThan(5e-3);
  });

  const loads: [string, LoadingParams][] = [
    ['1x probe on 10 kΩ', { sourceResistanceOhm: 10e3, inputResistanceOhm: 1e6, inputCapacitanceF: 100e-12 }],
    ['10x probe on 1 MΩ', { sourceResistanceOhm: 1e6, inputResistanceOhm: 10e6, inputCapacitanceF: 12e-12 }],
  ];

  it.skipIf(!hasNgspice).each(loads)('should match the AC loading divider |V| (%s)', (_, p) => {
    const rows = simulate(
      `V1 src 0 DC 0 AC 1\nRs src out ${spice(p.sourceResistanceOhm)}\nRin out 0 ${spice(p.inputResistanceOhm)}\nCin out 0 ${spice(p.inputCapacitanceF)}`,
      'ac dec 4 100 1G',
      'mag(v(out))',
    );
    const ours = loadingFrequencyResponse(p, rows.map(([f]) => f));
    // tolerance 1e-6 relative
    rows.forEach(([, magnitude], i) => expect(Math.abs(ours[i] / magnitude - 1)).toBeLessThan(1e-6));
    const at1MHz = simulate(
      `V1 src 0 DC 0 AC 1\nRs src out ${spice(p.sourceResistanceOhm)}\nRin out 0 ${spice(p.inputResistanceOhm)}\nCin out 0 ${spice(p.inputCapacitanceF)}`,
      'ac lin 1 1Meg 1Meg',
      'mag(v(out))',
    );
    expect(Math.abs(loadingFrequencyResponse(p, [1e6])[0] / at1MHz[0][1] - 1)).toBeLessThan(1e-6);
  });

  // 10x probe (9 MΩ, 12 pF at the tip) into 50 Ω: C1 = n·C_tip/(n−1), C2 = n·C_tip
  const terminated: TerminationDivider = {
    ratio: 10,
    tipResistanceOhm: 9e6,
    tipSideCapacitanceF: (10 * 12e-12) / 9,
    inputResistanceOhm: 50,
    inputSideCapacitanceF: 120e-12,
    sourceResistanceOhm: 0,
  };
  const terminatedCircuit = (d: TerminationDivider, source: string) => `V1 in 0 ${source}
R1 in out ${spice(d.tipResistanceOhm)}
C1 in out ${spice(d.tipSideCapacitanceF)}
R2 out 0 ${spice(d.inputResistanceOhm)}
C2 out 0 ${spice(d.inputSideCapacitanceF)}`;

  it.skipIf(!hasNgspice)('should match the terminated probe divider |Z2/(Z1+Z2)| from 1 Hz to 1 GHz', () => {
    const rows = simulate(terminatedCircuit(terminated, 'DC 0 AC 1'), 'ac dec 5 1 1G', 'mag(v(out))');
    // tolerance 1e-6 relative: both solve the same linear circuit
    rows.forEach(([f, magnitude]) => expect(Math.abs(terminationMagnitudeAt(terminated, f) / magnitude - 1)).toBeLessThan(1e-6));
    const at10MHz = simulate(terminatedCircuit(terminated, 'DC 0 AC 1'), 'ac lin 1 10Meg 10Meg', 'mag(v(out))');
    // ×10 on a 10x channel: about 0.386 V for 1 V
    expect(at10MHz[0][1] * 10).toBeCloseTo(0.386, 3);
  });

  it.skipIf(!hasNgspice)('should match the terminated edge: a spike of C1/(C1+C2) decaying with 50 Ω·(C1+C2)', () => {
    const { jump, settle, timeConstantS } = terminationEdge(terminated);
    const edgeS = 0.1e-9;
    const rows = simulate(
      terminatedCircuit(terminated, `PULSE(0 1 1n ${spice(edgeS)} ${spice(edgeS)} 1 2)`),
      `tran 1p ${spice(1e-9 + 12 * timeConstantS)} 0 1p`,
      'v(out)',
    );
    const peak = Math.max(...rows.map(([, v]) => v));
    // the ramp's share of the ideal spike, (τ/T)(1 − e^(−T/τ)); tolerance 0.5 %
    expect(Math.abs(peak / (jump * spikeEdgeFactor(timeConstantS, 0.8 * edgeS)) - 1)).toBeLessThan(5e-3);
    const start = 1e-9 + edgeS;
    const t1 = start + 0.5 * timeConstantS;
    const t2 = start + 3 * timeConstantS;
    const tauS = (t2 - t1) / Math.log((at(rows, t1) - settle) / (at(rows, t2) - settle));
    // tolerance 1 %: τ from the log-slope of the decay
    expect(Math.abs(tauS / timeConstantS - 1)).toBeLessThan(0.01);
  });

  it.skipIf(!hasNgspice)('should match the capacitive ratio of an over-compensated probe at 12 MHz', () => {
    // 8 % over-compensated: C1 chosen so C1/(C1+C2) = 1.08 × R2/(R1+R2)
    const settle = 0.1;
    const c2 = 120e-12;
    const c1 = (1.08 * settle * c2) / (1 - 1.08 * settle);
    const p: DividerParams = { tipResistanceOhm: 9e6, tipCapacitanceF: c1, inputResistanceOhm: 1e6, inputCapacitanceF: c2 };
    const rows = simulate(dividerCircuit(p), 'ac lin 1 12Meg 12Meg', 'mag(v(out))');
    expect(Math.abs(rows[0][1] / settle - 1.08)).toBeLessThan(1e-4);
    // a 12 MHz square wave in steady state, started from its mean so no 120 µs settling is needed
    const square = simulate(
      `V1 in 0 PULSE(0 1 0 0.1n 0.1n ${spice(1 / 24e6 - 0.1e-9)} ${spice(1 / 12e6)})
R1 in out ${spice(p.tipResistanceOhm)}
C1 in out ${spice(p.tipCapacitanceF)}
R2 out 0 ${spice(p.inputResistanceOhm)}
C2 out 0 ${spice(p.inputCapacitanceF)}
.ic v(out)=${spice((0.5 * settle * 1.08 * c2 - 0.5 * settle * 0.08 * c2) / c2)}`,
      'tran 0.1n 2u 0 0.1n uic',
      'v(out)',
    );
    const late = square.filter(([t]) => t > 1e-6);
    const pp = Math.max(...late.map(([, v]) => v)) - Math.min(...late.map(([, v]) => v));
    const ours = squareWavePicture(0.08, 1 / (2 * 12e6 * dividerLevels(p).timeConstantS));
    // the flat-topped square shows the capacitive ratio: ×1.08 within 0.5 %
    expect(Math.abs(pp / settle / ours.amplitudeRatio - 1)).toBeLessThan(5e-3);
    expect(Math.abs(ours.overshootPct)).toBeLessThan(0.1);
  });

  it.skipIf(!hasNgspice)('should match a two-cause chain: a 10x probe read at 1x ringing on a 15 cm lead', () => {
    const input = {
      probe: { attenuation: 10, groundLeadM: 0.15, groundKind: 'clip-lead' as const, tipCapacitanceF: 12e-12 },
      scope: { attenuationSetting: 1, bandwidthHz: 500e6 },
      circuit: { sourceResistanceOhm: 25 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' as const },
    };
    const inductanceH = straightWireInductanceH(0.15, 0.25e-3);
    const { tipCapacitanceF: c1, inputCapacitanceF: c2 } = balancedDividerOf({ ...resolveSetup(input).setup });
    // source 25 Ω, lead L in the return, compensated 9 MΩ ∥ C1 over 1 MΩ ∥ C2
    const rows = simulate(
      `V1 in 0 PULSE(0 1 1n 1p 1p 1 2)
Rs in a 25
L1 a tip ${spice(inductanceH)}
R1 tip out 9e6
C1 tip out ${spice(c1)}
R2 out 0 1e6
C2 out 0 ${spice(c2)}`,
      'tran 2p 80n 0 2p',
      'v(out)',
    );
    const settled = 0.1; // R2/(R1 + R2)
    const downward = rows.filter((row, i) => i > 0 && rows[i - 1][1] >= settled && row[1] < settled).map(([t]) => t);
    const measuredHz = (downward.length - 1) / (downward[downward.length - 1] - downward[0]);
    const observed = { amplitudeV: settled * 1 /* the 1x channel multiplies by 1 */, ringingFrequencyHz: measuredHz };
    const result = diagnose({ ...input, observed });
    const top = result.hypotheses[0];
    expect([...top.causes].sort()).toEqual(['attenuation-mismatch', 'ground-lead']);
    // the combined prediction against the simulated chain: amplitude exact, ringing within 1 %
    expect(top.predicted.amplitudeV).toBeCloseTo(0.1, 9);
    expect(Math.abs((top.predicted.ringingFrequencyHz as number) / measuredHz - 1)).toBeLessThan(0.01);
  });
});
