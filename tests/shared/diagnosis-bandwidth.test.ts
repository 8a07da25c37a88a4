import { describe, expect, it } from 'vitest';
import {
  RISE_TIME_BANDWIDTH_PRODUCT,
  bandwidthFromRiseTimeHz,
  cascadeRiseTimeS,
  riseTimeFromBandwidthS,
  riseTimeFromTimeConstantS,
  flatResponseSpread,
  singlePoleMagnitude,
  squareWaveAmplitudeRatio,
} from '../../shared/diagnosis/single-pole';
import { shownRiseTimeS, systemRiseTimeS } from '../../shared/diagnosis/bandwidth';
import { resolveSetup } from '../../shared/diagnosis/defaults';
import { diagnose } from '../../shared/diagnosis/ranker';

/** Time at which 1 − e^(−t/τ) reaches a level, by bisection (no closed form used). */
function crossing(level: number, tauS: number): number {
  let low = 0;
  let high = 100 * tauS;
  for (let i = 0; i < 200; i++) {
    const mid = (low + high) / 2;
    if (1 - Math.exp(-mid / tauS) < level) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}

describe('single-pole rules', () => {
  it('should use ln 9 / 2π ≈ 0.3497 as the rise-time–bandwidth product', () => {
    // source: single-pole step response; the "0.35" rule of thumb
    expect(RISE_TIME_BANDWIDTH_PRODUCT).toBeCloseTo(0.3497, 4);
    expect(riseTimeFromBandwidthS(100e6)).toBeCloseTo(3.497e-9, 12);
    expect(bandwidthFromRiseTimeHz(3.497e-9)).toBeCloseTo(100e6, -3);
  });

  it('should give a 10–90 % rise of τ·ln 9 for a single pole', () => {
    // source: step response 1 − e^(−t/τ), solved numerically for the 10 % and 90 % points
    const tau = 1e-6;
    expect(crossing(0.9, tau) - crossing(0.1, tau)).toBeCloseTo(riseTimeFromTimeConstantS(tau), 12);
    expect(riseTimeFromTimeConstantS(1)).toBeCloseTo(2.1972, 4);
  });

  it('should add stage rise times in quadrature', () => {
    // source: root-sum-square rise-time rule; a 3-4-5 triangle as the check
    expect(cascadeRiseTimeS([3e-9, 4e-9])).toBeCloseTo(5e-9, 18);
    expect(cascadeRiseTimeS([])).toBe(0);
  });

  it('should pass 1/√2 at the corner and 1/√(1+(f/fc)²) elsewhere', () => {
    // source: first-order low-pass |H| = 1/√(1 + (f/fc)²); −3 dB at fc
    expect(singlePoleMagnitude(10e6, 10e6)).toBeCloseTo(Math.SQRT1_2, 15);
    expect(singlePoleMagnitude(30e6, 10e6)).toBeCloseTo(1 / Math.sqrt(10), 15);
  });

  it('should match a square wave iterated through the RC to steady state', () => {
    // independent check: apply v ← target + (v − target)·e^(−T/2τ) each half period
    const tau = 1e-6;
    for (const f of [50e3, 200e3, 1e6]) {
      const decay = Math.exp(-1 / (2 * f * tau));
      let v = 0;
      let high = 0;
      let low = 0;
      for (let half = 0; half < 2000; half++) {
        const target = half % 2 === 0 ? 1 : 0;
        v = target + (v - target) * decay;
        if (target === 1) high = v;
        else low = v;
      }
      expect(squareWaveAmplitudeRatio(tau, f)).toBeCloseTo(high - low, 10);
    }
  });
});

describe('bandwidth model', () => {
  it('should combine probe, scope and limit filter into one rise time', () => {
    const { setup } = resolveSetup({
      probe: { attenuation: 10, bandwidthHz: 200e6 },
      scope: { bandwidthHz: 200e6, bandwidthLimitHz: 20e6 },
      signal: { riseTimeS: 5e-9 },
    });
    const t = (bw: number) => 0.3497 / bw;
    const system = Math.sqrt(t(200e6) ** 2 + t(200e6) ** 2 + t(20e6) ** 2);
    expect(systemRiseTimeS(setup)).toBeCloseTo(system, 12);
    expect(shownRiseTimeS(setup)).toBeCloseTo(Math.sqrt(system ** 2 + 25e-18), 12);
  });

  it('should assume a 1x probe reaches about 6 MHz', () => {
    // common practice: 1x passive probes have a few MHz of bandwidth
    const { setup, assumptions } = resolveSetup({ probe: { attenuation: 1 } });
    expect(setup.probeBandwidthHz).toBe(6e6);
    expect(assumptions.find((a) => a.field === 'probe.bandwidthHz')?.value).toBe(6e6);
  });

  it('should read the effective bandwidth off a slow edge', () => {
    const result = diagnose({
      probe: { attenuation: 10, bandwidthHz: 200e6 },
      scope: { bandwidthHz: 200e6 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, riseTimeS: 1e-9 },
      observed: { amplitudeV: 1, riseTimeS: 17.5e-9 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('bandwidth');
    expect(top.estimates?.effectiveBandwidthHz).toBeCloseTo(0.3497 / Math.sqrt(17.5e-9 ** 2 - 1e-18), -3);
    expect(top.explanation).toMatch(/bandwidth-limit filter/);
  });

  it('should blame a 1x probe for a 20 MHz sine shown small', () => {
    const result = diagnose({
      probe: { attenuation: 1 },
      scope: { attenuationSetting: 1, bandwidthHz: 200e6 },
      circuit: { sourceResistanceOhm: 0 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 20e6, kind: 'sine' },
      observed: { amplitudeV: 0.29 },
    });
    const top = result.hypotheses[0];
    expect(top.cause).toBe('bandwidth');
    // product of the two poles' magnitudes at 20 MHz
    expect(top.predicted.amplitudeV).toBeCloseTo(singlePoleMagnitude(20e6, 6e6) * singlePoleMagnitude(20e6, 200e6), 12);
    expect(result.tags).toContain('1x-probe-bandwidth');
  });
});

describe('a sine below the bandwidth: scopes are flatter than one pole', () => {
  const sine = (amplitudeV: number, more: { sampleRateHz?: number; frequencyHz?: number } = {}) => ({
    probe: { attenuation: 10 },
    scope: { attenuationSetting: 10, bandwidthHz: 200e6, ...(more.sampleRateHz ? { sampleRateHz: more.sampleRateHz } : {}) },
    circuit: { sourceResistanceOhm: 50 },
    signal: { expectedAmplitudeV: 1, frequencyHz: 100e6, kind: 'sine' as const },
    observed: { amplitudeV: amplitudeV, frequencyHz: more.frequencyHz ?? 100e6 },
  });

  it('bounds the spread by a fourth-order maximally flat response, nothing at and above the bandwidth', () => {
    // source: Butterworth magnitude 1/√(1 + x^2n), n = 4, against the single pole 1/√(1 + x²)
    expect(flatResponseSpread(100e6, 200e6)).toBeCloseTo(Math.log(1 / Math.sqrt(1 + 0.5 ** 8)) - Math.log(singlePoleMagnitude(100e6, 200e6)), 12);
    expect(flatResponseSpread(100e6, 200e6)).toBeCloseTo(0.1096, 4);
    expect(flatResponseSpread(200e6, 200e6)).toBe(0);
    expect(flatResponseSpread(400e6, 200e6)).toBe(0);
  });

  it('calls a 100 MHz sine read at full amplitude on a 200 MHz scope a true trace, not loading', () => {
    // one pole would pass 89 %, a flat front end nearly all of it: a full reading is no error
    const result = diagnose(sine(0.99));
    expect(result.verdict).toBe('faithful');
  });

  it('still puts a reading at the single pole\'s 89 % down to the bandwidth', () => {
    const result = diagnose(sine(0.894));
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses.find((h) => h.causes.join('+') === 'bandwidth')?.fits).toBe(true);
  });

  it('finds aliasing when 100 MHz sampled at 120 MSa/s shows at 20 MHz and full amplitude', () => {
    // source: a sampled sine folds to |f − k·f_s| (sampling theorem): |100 − 120| MHz = 20 MHz.
    // Before, the single pole's 89 % taken as certain made the full reading contradict the record: "nothing fits"
    const result = diagnose(sine(1.0, { sampleRateHz: 120e6, frequencyHz: 20e6 }));
    expect(result.verdict).toBe('measurement-error');
    expect(result.hypotheses[0].causes).toContain('aliasing');
    expect(result.hypotheses[0].fits).toBe(true);
  });
});

describe('the 1x-probe bandwidth advice', () => {
  it('is not given for an active probe at 1:1 whose own bandwidth slows the edge', () => {
    // common practice: a 1x passive probe reaches a few MHz; a buffered probe at 1:1 has its own rated bandwidth
    const result = diagnose({
      probe: { attenuation: 1, kind: 'active', bandwidthHz: 20e6 },
      scope: { attenuationSetting: 1, bandwidthHz: 1e9 },
      circuit: { sourceResistanceOhm: 50 },
      signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, riseTimeS: 1e-9, kind: 'square' },
      observed: { amplitudeV: 1, riseTimeS: 17.5e-9 },
    });
    const bandwidth = result.hypotheses.find((h) => h.causes.join('+') === 'bandwidth')!;
    expect(bandwidth.fits).toBe(true);
    expect(result.tags).not.toContain('1x-probe-bandwidth');
    expect(bandwidth.fix).not.toMatch(/10x probe/);
  });
});
