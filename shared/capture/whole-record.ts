import { findRails, isRail, type Rails } from './clipping';
import { noiseRmsV } from './noise';
import { medianSampleIntervalS } from './sample-interval';
import type { Series } from './series';
import { amplitudeSpectrum, type CaptureSpectrum } from './spectrum';

/**
 * The measurements of a capture that need only its samples, not its levels or edges: the
 * sample interval, the rails, the noise and the spectrum. Being independent of the rest, they
 * can be taken by a second thread while the first finds the levels and edges (the server does
 * so for large captures; see `analysisSteps`).
 */
export interface WholeRecordMeasures {
  sampleIntervalS: number | null;
  rails: Rails;
  topRail: boolean;
  bottomRail: boolean;
  /** Noise rms, V, with the samples on a rail left out. */
  noiseV: number;
  spectral: { spectrum: CaptureSpectrum; amplitudesV: Float64Array } | null;
}

/**
 * @param timesS sample instants, s, as many as `volts`
 * @param volts samples, V
 */
export function wholeRecordMeasures(timesS: Series, volts: Series): WholeRecordMeasures {
  const points = volts.length;
  const sampleIntervalS = medianSampleIntervalS(timesS);
  const rails = findRails(volts);
  const topRail = isRail(rails.atMax, rails.longestAtMax, rails.nearMax, points);
  const bottomRail = isRail(rails.atMin, rails.longestAtMin, rails.nearMin, points);
  const onRail = (i: number) => (topRail && volts.get(i) === rails.maxV) || (bottomRail && volts.get(i) === rails.minV);
  const noiseV = noiseRmsV(volts, topRail || bottomRail ? onRail : undefined);
  const spectral = sampleIntervalS !== null ? amplitudeSpectrum(volts, sampleIntervalS) : null;
  return { sampleIntervalS, rails, topRail, bottomRail, noiseV, spectral };
}
