import FFT from 'fft.js';
import type { Series } from './series';

/** One spectral line: its frequency and its amplitude (peak volts of the sinusoid). */
export interface SpectralLine {
  frequencyHz: number;
  amplitudeV: number;
}

export interface CaptureSpectrum {
  /** Spacing of the FFT bins, Hz (the record's length sets the true resolution, 1/T). */
  binHz: number;
  /** Highest frequency the spectrum covers, Hz (half the rate after averaging). */
  nyquistHz: number;
  /** Samples averaged into each point the FFT saw (1: none). */
  averagedSamples: number;
  /** Strongest lines, strongest first. */
  lines: SpectralLine[];
  /** The amplitude spectrum reduced to at most `PLOT_POINTS` points (max per group of bins), for a plot. */
  plot: { frequenciesHz: number[]; amplitudesV: number[] };
}

// The FFT sees at most this many points: 65,536 keep it a few milliseconds on a million samples.
const MAX_FFT_POINTS = 1 << 16;
const PLOT_POINTS = 400;
const MAX_LINES = 12;

/**
 * Amplitude spectrum of a uniformly sampled trace (FFT by fft.js). The mean is removed and a
 * Hann window applied; amplitudes are corrected for the window's coherent gain (Σw), so a
 * sinusoid of peak A reads A at its bin. Records longer than 65,536 samples are first averaged
 * in groups of m consecutive samples (a boxcar low-pass that also keeps what is folded back
 * small), which keeps the resolution 1/T and lowers the top frequency to fs/(2m).
 *
 * @param volts samples, V
 * @param sampleIntervalS the (median) sample interval, s
 */
export function amplitudeSpectrum(volts: Series, sampleIntervalS: number): { spectrum: CaptureSpectrum; amplitudesV: Float64Array } | null {
  const n = volts.length;
  if (n < 16 || !(sampleIntervalS > 0)) return null;
  const m = Math.ceil(n / MAX_FFT_POINTS);
  const length = Math.floor(n / m);
  const size = nextPowerOfTwo(length);
  const input = new Float64Array(size);
  // groups of m consecutive samples, summed in order across the blocks the series hands out
  const groups = new Float64Array(4);
  volts.scan(0, length * m, (values) => groupMeans(values, m, input, groups));
  const mean = groups[3] / length;
  let windowSum = 0;
  for (let k = 0; k < length; k++) {
    const w = 0.5 * (1 - Math.cos((2 * Math.PI * k) / (length - 1)));
    input[k] = (input[k] - mean) * w;
    windowSum += w;
  }
  const fft = fftOfSize(size);
  // a typed array, not fft.js's plain one: no boxing, no change of element kind as it fills
  const out = new Float64Array(2 * size);
  fft.realTransform(out, input);
  const bins = size / 2;
  const amplitudesV = new Float64Array(bins + 1);
  for (let k = 0; k <= bins; k++) {
    const re = out[2 * k];
    const im = out[2 * k + 1];
    amplitudesV[k] = ((k === 0 || k === bins ? 1 : 2) * Math.sqrt(re * re + im * im)) / windowSum;
  }
  const fs = 1 / (sampleIntervalS * m);
  const binHz = fs / size;
  return {
    amplitudesV,
    spectrum: { binHz, nyquistHz: fs / 2, averagedSamples: m, lines: strongestLines(amplitudesV, binHz), plot: plotPoints(amplitudesV, binHz) },
  };
}

/** Frequency of a peak at bin k, refined by a parabola through the log amplitudes of k−1, k, k+1. */
export function peakFrequencyHz(amplitudesV: Float64Array, k: number, binHz: number): number {
  if (k <= 0 || k >= amplitudesV.length - 1) return k * binHz;
  const a = Math.log(amplitudesV[k - 1] + 1e-300);
  const b = Math.log(amplitudesV[k] + 1e-300);
  const c = Math.log(amplitudesV[k + 1] + 1e-300);
  const denominator = a - 2 * b + c;
  const shift = denominator !== 0 ? (0.5 * (a - c)) / denominator : 0;
  return (k + Math.max(-0.5, Math.min(0.5, shift))) * binHz;
}

function strongestLines(amplitudesV: Float64Array, binHz: number): SpectralLine[] {
  const peaks: number[] = [];
  for (let k = 1; k < amplitudesV.length - 1; k++) {
    if (amplitudesV[k] > amplitudesV[k - 1] && amplitudesV[k] >= amplitudesV[k + 1]) peaks.push(k);
  }
  peaks.sort((a, b) => amplitudesV[b] - amplitudesV[a]);
  const kept: number[] = [];
  for (const k of peaks) {
    // the Hann window's main lobe is 4 bins wide: a peak that close to a stronger one is its shoulder
    if (kept.some((other) => Math.abs(other - k) <= 2)) continue;
    kept.push(k);
    if (kept.length === MAX_LINES) break;
  }
  return kept.map((k) => ({ frequencyHz: peakFrequencyHz(amplitudesV, k, binHz), amplitudeV: amplitudesV[k] }));
}

function plotPoints(amplitudesV: Float64Array, binHz: number): CaptureSpectrum['plot'] {
  const frequenciesHz: number[] = [];
  const values: number[] = [];
  const group = Math.max(1, Math.ceil((amplitudesV.length - 1) / PLOT_POINTS));
  for (let start = 1; start < amplitudesV.length; start += group) {
    let best = start;
    for (let k = start; k < Math.min(amplitudesV.length, start + group); k++) if (amplitudesV[k] > amplitudesV[best]) best = k;
    frequenciesHz.push(best * binHz);
    values.push(amplitudesV[best]);
  }
  return { frequenciesHz, amplitudesV: values };
}

// An FFT's tables of sines and cosines (1 MB at 65,536 points) are built once per size and kept:
// at most 13 sizes, one capture at a time per thread.
const ffts = new Map<number, FFT>();
function fftOfSize(size: number): FFT {
  let fft = ffts.get(size);
  if (!fft) ffts.set(size, (fft = new FFT(size)));
  return fft;
}

function nextPowerOfTwo(value: number): number {
  let size = 16;
  while (size < value) size *= 2;
  return size;
}

const MAINS_HZ = [50, 60];
const MAX_HARMONIC = 6;
// A hum line must stand this many times above the median amplitude of the bins around it.
const HUM_PROMINENCE = 8;

/**
 * Hum: the strongest line at 50 or 60 Hz or one of their first harmonics that stands clear of
 * the spectrum around it (8× the median amplitude of the bins from half its frequency to twice it, or 24 bins above it) and is
 * not a harmonic of the signal's own period. Needs at least three mains cycles in the record
 * (else the line cannot be resolved) and returns null when no such line stands out.
 *
 * @param durationS length of the record, s
 * @param signalPeriodS the signal's period, s, or null
 */
export function humFrequencyHz(
  amplitudesV: Float64Array,
  binHz: number,
  durationS: number,
  signalPeriodS: number | null,
): { frequencyHz: number; amplitudeV: number } | null {
  if (!(durationS >= 3 / 50)) return null;
  let best: { frequencyHz: number; amplitudeV: number } | null = null;
  const last = amplitudesV.length - 1;
  for (const mains of MAINS_HZ) {
    for (let h = 1; h <= MAX_HARMONIC; h++) {
      const f = mains * h;
      const center = Math.round(f / binHz);
      if (center < 2 || center >= last - 1) continue;
      const reach = Math.max(1, Math.round((0.02 * f) / binHz));
      let k = center;
      for (let j = Math.max(1, center - reach); j <= Math.min(last - 1, center + reach); j++) if (amplitudesV[j] > amplitudesV[k]) k = j;
      if (!(amplitudesV[k] > amplitudesV[k - 1] && amplitudesV[k] >= amplitudesV[k + 1])) continue;
      const peakHz = peakFrequencyHz(amplitudesV, k, binHz);
      if (signalPeriodS !== null && signalPeriodS > 0) {
        const harmonic = peakHz * signalPeriodS;
        if (Math.round(harmonic) >= 1 && Math.abs(harmonic - Math.round(harmonic)) < 0.03 * Math.max(1, Math.round(harmonic))) continue;
      }
      const floor = medianAmplitude(amplitudesV, Math.max(1, Math.floor(k / 2)), Math.min(last, Math.max(2 * k, k + 24)), k, 3);
      if (floor === null || amplitudesV[k] < HUM_PROMINENCE * floor) continue;
      if (best === null || amplitudesV[k] > best.amplitudeV) best = { frequencyHz: peakHz, amplitudeV: amplitudesV[k] };
    }
  }
  return best;
}

function medianAmplitude(amplitudesV: Float64Array, from: number, to: number, skipCenter: number, skipReach: number): number | null {
  const values: number[] = [];
  for (let k = from; k <= to; k++) if (Math.abs(k - skipCenter) > skipReach) values.push(amplitudesV[k]);
  if (values.length < 8) return null;
  values.sort((a, b) => a - b);
  return values[values.length >> 1];
}

/**
 * The means of consecutive groups of m samples into `input`, one block at a time (a module-level
 * pass, as `scan` asks). state: [sum of the group so far, its samples, next index in `input`, sum of the means]
 */
function groupMeans(values: Float64Array, m: number, input: Float64Array, state: Float64Array): void {
  let groupSum = state[0];
  let inGroup = state[1];
  let k = state[2] | 0;
  let total = state[3];
  for (let j = 0; j < values.length; j++) {
    groupSum += values[j];
    if (++inGroup === m) {
      input[k] = groupSum / m;
      total += input[k];
      k++;
      groupSum = 0;
      inGroup = 0;
    }
  }
  state[0] = groupSum;
  state[1] = inGroup;
  state[2] = k;
  state[3] = total;
}

/** Share of the AC power in the strongest line (±3 bins: the Hann window's main lobe). */
export function strongestLineShare(amplitudesV: Float64Array): number | null {
  let total = 0;
  let peak = 1;
  for (let k = 1; k < amplitudesV.length; k++) {
    total += amplitudesV[k] * amplitudesV[k];
    if (amplitudesV[k] > amplitudesV[peak]) peak = k;
  }
  if (!(total > 0)) return null;
  let line = 0;
  for (let k = Math.max(1, peak - 3); k <= Math.min(amplitudesV.length - 1, peak + 3); k++) line += amplitudesV[k] * amplitudesV[k];
  return line / total;
}
