import { describe, expect, it } from 'vitest';
import { at, hasNgspice, inCi, ngspiceRunner } from './helpers/ngspice';
import { effectiveAcCornerHz, squareWaveTiltFraction } from '../../shared/diagnosis/ac-coupling';
import { generatorShownRatio } from '../../shared/diagnosis/generator-load';

const simulate = ngspiceRunner('spice-acq');


const spice = (x: number) => x.toExponential(9);

describe('SPICE cross-check: acquisition causes', () => {
  it.runIf(!hasNgspice && inCi)('should find ngspice on PATH when CI is set', () => {
    expect.fail('CI is set but ngspice is not on PATH: install ngspice so the SPICE cross-checks run');
  });

  // 1 MΩ input with a coupling capacitor for a 10 Hz corner; a 1x lead (0 Ω) and a 10x probe's 9 MΩ.
  const inputOhm = 1e6;
  const couplingF = 1 / (2 * Math.PI * inputOhm * 10);
  const cases: [string, number, number][] = [
    ['1x, 100 Hz square', 0, 100],
    ['1x, 40 Hz square', 0, 40],
    ['10x probe, 20 Hz square', 9e6, 20],
  ];

  it.skipIf(!hasNgspice).each(cases)('should droop the square as tanh(T/4τ) predicts (%s)', (_, tipOhm, frequencyHz) => {
    const periodS = 1 / frequencyHz;
    const effectiveHz = effectiveAcCornerHz(10, inputOhm, tipOhm);
    const tauS = 1 / (2 * Math.PI * effectiveHz);
    // run past 12 τ so the start-up transient (e^-12 ≈ 6e-6) is gone, then read one whole period
    const cycles = Math.ceil((12 * tauS) / periodS) + 1;
    const stopS = cycles * periodS;
    const edgeS = periodS * 1e-6;
    const stepS = periodS / 4000;
    const rows = simulate(
      `V1 in 0 PULSE(0 1 0 ${spice(edgeS)} ${spice(edgeS)} ${spice(periodS / 2 - edgeS)} ${spice(periodS)})
${tipOhm > 0 ? `Rtip in a ${spice(tipOhm)}` : 'Rtip in a 1e-3'}
Cac a out ${spice(couplingF)}
Rin out 0 ${spice(inputOhm)}`,
      `tran ${spice(stepS)} ${spice(stopS)} 0 ${spice(stepS)}`,
      'v(out)',
    );
    const riseS = (cycles - 1) * periodS;
    const topStart = at(rows, riseS + 2 * edgeS + stepS);
    const topEnd = at(rows, riseS + periodS / 2 - stepS);
    const before = at(rows, riseS - stepS);
    const step = topStart - before;
    // tolerance 2 % of the tilt: sampling one step away from each edge
    const tilt = (topStart - topEnd) / step;
    expect(Math.abs(tilt / squareWaveTiltFraction(frequencyHz, effectiveHz) - 1)).toBeLessThan(0.02);
  });

  it.skipIf(!hasNgspice).each([
    ['50 Ω setting into 1 MΩ', '50-ohm', 1e6],
    ['50 Ω setting into 50 Ω', '50-ohm', 50],
    ['high-Z setting into 50 Ω', 'high-z', 50],
    ['50 Ω setting into 150 Ω', '50-ohm', 150],
  ] as const)('should match the generator divider (%s)', (_, setting, loadOhm) => {
    const setV = 1;
    const emfV = setting === '50-ohm' ? 2 * setV : setV;
    const rows = simulate(`V1 src 0 DC 0 AC ${emfV}\nRout src out 50\nRload out 0 ${spice(loadOhm)}`, 'ac lin 1 1k 1k', 'mag(v(out))');
    // tolerance 1e-6 relative: the same linear circuit
    expect(Math.abs(rows[0][1] / (setV * generatorShownRatio(setting, 50, loadOhm)) - 1)).toBeLessThan(1e-6);
  });
});
