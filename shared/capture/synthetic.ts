import type { CaptureSamples } from './types';

/**
 * Waveforms with known answers, for tests, the benchmark and demo captures. Each is the
 * textbook response of a simple system, sampled uniformly; none comes from a real scope.
 */

/** A unit step response: 0 before t = 0, tending to 1. */
export type StepResponse = (tS: number) => number;

/**
 * Single-pole (RC) step response, 1 − e^(−t/τ). Its 10–90 % rise time is τ·ln 9.
 * Source: the standard first-order step response (any circuits handbook).
 */
export function firstOrderStep(tauS: number): StepResponse {
  return (tS) => (tS <= 0 ? 0 : -Math.expm1(-tS / tauS));
}

/**
 * Underdamped second-order step response,
 * 1 − e^(−ζω_n·t)·sin(ω_d·t + φ)/√(1 − ζ²), ω_d = ω_n·√(1 − ζ²), φ = arccos ζ.
 * Its peak overshoot is e^(−πζ/√(1 − ζ²)) and it rings at f_n·√(1 − ζ²).
 * Source: the standard second-order system step response (control and circuits texts).
 *
 * @param naturalFrequencyHz f_n = ω_n/2π, Hz
 * @param dampingRatio ζ, 0 < ζ < 1
 */
export function secondOrderStep(naturalFrequencyHz: number, dampingRatio: number): StepResponse {
  const omegaN = 2 * Math.PI * naturalFrequencyHz;
  const root = Math.sqrt(1 - dampingRatio * dampingRatio);
  const omegaD = omegaN * root;
  const phase = Math.acos(dampingRatio);
  return (tS) => (tS <= 0 ? 0 : 1 - (Math.exp(-dampingRatio * omegaN * tS) * Math.sin(omegaD * tS + phase)) / root);
}

export interface UniformSampling {
  sampleIntervalS: number;
  points: number;
  /** Time of the first sample, s (default 0). */
  startS?: number;
}

/** Samples v(t) at t = start + k·interval. */
export function sampleUniformly(waveform: (tS: number) => number, sampling: UniformSampling): CaptureSamples {
  const timesS = new Float64Array(sampling.points);
  const volts = new Float64Array(sampling.points);
  const startS = sampling.startS ?? 0;
  for (let k = 0; k < sampling.points; k++) {
    timesS[k] = startS + k * sampling.sampleIntervalS;
    volts[k] = waveform(timesS[k]);
  }
  return { timesS, volts };
}

/** One step from `baseV` to `topV` at `stepAtS`, shaped by `response`. */
export function stepWaveform(response: StepResponse, baseV: number, topV: number, stepAtS: number) {
  return (tS: number) => baseV + (topV - baseV) * response(tS - stepAtS);
}

export interface SquareWave {
  periodS: number;
  baseV: number;
  topV: number;
  /** Share of the period spent high, default 0.5. */
  dutyCycle?: number;
  /** Time of the first rising edge, s (default a quarter period). */
  firstRiseS?: number;
}

/**
 * A square wave whose every edge has the shape of `response`. Each sample is the settled level
 * before the latest edge plus that edge's step response, so the wave is exact as long as each
 * edge has settled before the next one (keep the half-period several settling times long).
 */
export function squareWaveform(response: StepResponse, wave: SquareWave) {
  const duty = wave.dutyCycle ?? 0.5;
  const firstRiseS = wave.firstRiseS ?? wave.periodS / 4;
  const amplitudeV = wave.topV - wave.baseV;
  return (tS: number) => {
    const sinceRiseS = tS - firstRiseS;
    if (sinceRiseS < 0) return wave.baseV;
    const inCycleS = sinceRiseS - Math.floor(sinceRiseS / wave.periodS) * wave.periodS;
    const highS = duty * wave.periodS;
    return inCycleS < highS
      ? wave.baseV + amplitudeV * response(inCycleS)
      : wave.topV - amplitudeV * response(inCycleS - highS);
  };
}

/** mulberry32: a small, fast 32-bit seeded generator of uniform numbers in [0, 1). */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates from a uniform generator (Box–Muller transform). */
export function gaussian(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const value = spare;
      spare = null;
      return value;
    }
    const u = 1 - uniform();
    const angle = 2 * Math.PI * uniform();
    const radius = Math.sqrt(-2 * Math.log(u));
    spare = radius * Math.sin(angle);
    return radius * Math.cos(angle);
  };
}

/** Adds white Gaussian noise of standard deviation `sigmaV` in place, repeatably from `seed`. */
export function addNoise(volts: Float64Array, sigmaV: number, seed: number): Float64Array {
  const normal = gaussian(mulberry32(seed));
  for (let i = 0; i < volts.length; i++) volts[i] += sigmaV * normal();
  return volts;
}
