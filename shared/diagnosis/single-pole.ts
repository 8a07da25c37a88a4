/**
 * Rise-time–bandwidth product of a single-pole (RC) low-pass: t_r(10–90 %) × f_3dB = ln 9 / 2π
 * ≈ 0.3497, the "0.35" rule. source: single-pole step response 1 − e^(−t/τ), with
 * t_90 − t_10 = τ·ln 9 and f_3dB = 1/(2πτ).
 */
export const RISE_TIME_BANDWIDTH_PRODUCT = Math.log(9) / (2 * Math.PI);

/** 10–90 % rise time of a single pole, τ·ln 9 (≈ 2.2 τ), in s. */
export const riseTimeFromTimeConstantS = (timeConstantS: number): number => timeConstantS * Math.log(9);

/** 10–90 % rise time of a single pole with a −3 dB bandwidth, t_r = 0.3497 / BW, in s. */
export const riseTimeFromBandwidthS = (bandwidthHz: number): number =>
  RISE_TIME_BANDWIDTH_PRODUCT / bandwidthHz;

/** −3 dB bandwidth that gives a 10–90 % rise time, BW = 0.3497 / t_r, in Hz. */
export const bandwidthFromRiseTimeHz = (riseTimeS: number): number =>
  RISE_TIME_BANDWIDTH_PRODUCT / riseTimeS;

/**
 * Rise time of stages in cascade, root-sum-square: t = √(Σ tᵢ²), in s. Exact for Gaussian
 * stages and a close approximation for non-interacting single poles (common practice).
 */
export function cascadeRiseTimeS(riseTimesS: readonly number[]): number {
  return Math.sqrt(riseTimesS.reduce((sum, t) => sum + t * t, 0));
}

/**
 * Magnitude of a single-pole low-pass at a frequency, 1/√(1 + (f/f_c)²).
 * source: first-order low-pass transfer function H(jω) = 1/(1 + jω/ω_c).
 */
export function singlePoleMagnitude(frequencyHz: number, cornerHz: number): number {
  const x = frequencyHz / cornerHz;
  return 1 / Math.sqrt(1 + x * x);
}

/**
 * Peak-to-peak of a symmetric square wave after a single pole, as a fraction of the input's:
 * tanh(T / 4τ) with T = 1/f. source: steady-state RC response to a square wave; each half
 * period charges toward the new level, 1 − e^(−T/2τ), from the level the last one left.
 */
export function squareWaveAmplitudeRatio(timeConstantS: number, frequencyHz: number): number {
  if (timeConstantS <= 0) return 1;
  return Math.tanh(1 / (4 * frequencyHz * timeConstantS));
}

/**
 * How much more of a sine a measurement chain may pass than its single-pole model says, below
 * its −3 dB bandwidth, in log units: oscilloscopes are built flatter than one pole, from a
 * Gaussian response to a maximally flat one, all −3 dB at the bandwidth. Bounded by the
 * fourth-order maximally flat (Butterworth) response, |H| = 1/√(1 + x⁸), x = f/f_c:
 * ½·ln((1 + x²)/(1 + x⁸)). source: Butterworth magnitude response |H| = 1/√(1 + x^2n). Zero at
 * and above the bandwidth, where the single pole is not below the flatter responses.
 */
export function flatResponseSpread(frequencyHz: number, cornerHz: number): number {
  const x = frequencyHz / cornerHz;
  if (!(x > 0) || x >= 1) return 0;
  return 0.5 * Math.log((1 + x * x) / (1 + x ** 8));
}
