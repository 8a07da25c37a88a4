import type { StoredAnalysis } from '../stored-analysis';
import type { PlotCursor } from './CaptureCanvas';

type Row = [quantity: string, value: number | string | null, unit: string];

const SCALARS: [keyof StoredAnalysis, string, string][] = [
  ['points', 'Samples', ''],
  ['sampleIntervalS', 'Sample interval', 's'],
  ['baseV', 'Base level', 'V'],
  ['topV', 'Top level', 'V'],
  ['amplitudeV', 'Amplitude', 'V'],
  ['riseTimeS', 'Rise time (10–90 %)', 's'],
  ['fallTimeS', 'Fall time (90–10 %)', 's'],
  ['overshootPct', 'Overshoot', '%'],
  ['undershootPct', 'Undershoot', '%'],
  ['ringingFrequencyHz', 'Ringing frequency', 'Hz'],
  ['periodS', 'Period', 's'],
  ['frequencyHz', 'Frequency', 'Hz'],
  ['edgeCount', 'Edges found', ''],
  ['tiltPct', 'Tilt', '%'],
  ['cornerPct', 'Corner', '%'],
  ['settleTimeConstantS', 'Settling time constant', 's'],
  ['noiseRmsV', 'Noise (RMS)', 'V'],
  ['humFrequencyHz', 'Hum frequency', 'Hz'],
];

/**
 * The capture's readings as CSV rows (quantity, value in SI units, unit): what the analysis
 * measured, each edge, the window on screen and the cursors, so the numbers can be checked
 * or plotted elsewhere. A reading the analysis could not make is left out, not written as 0.
 */
export function captureReadingRows(a: StoredAnalysis, view: { fromS: number; toS: number }, cursors: { a?: PlotCursor; b?: PlotCursor }): Row[] {
  const rows: Row[] = [['quantity', 'value', 'unit']];
  const channel = a.channels.find((c) => c.index === a.channel);
  if (channel) rows.push(['Analysed channel', channel.name, '']);
  for (const [key, label, unit] of SCALARS) {
    const v = a[key];
    if (typeof v === 'number' && Number.isFinite(v)) rows.push([label, v, unit]);
  }
  if (a.referenceLevels) {
    rows.push(['Reference level 10 %', a.referenceLevels.lowV, 'V'], ['Reference level 50 %', a.referenceLevels.midV, 'V'], ['Reference level 90 %', a.referenceLevels.highV, 'V']);
  }
  a.edges.forEach((e, i) => {
    const n = `Edge ${i + 1} (${e.kind})`;
    rows.push([`${n} t10`, e.t10S, 's'], [`${n} t50`, e.t50S, 's'], [`${n} t90`, e.t90S, 's'], [`${n} duration`, e.durationS, 's']);
  });
  rows.push(['Window shown from', view.fromS, 's'], ['Window shown to', view.toS, 's']);
  for (const [name, c] of [['A', cursors.a], ['B', cursors.b]] as const) {
    if (c) rows.push([`Cursor ${name} time`, c.tS, 's'], [`Cursor ${name} voltage`, c.v, 'V']);
  }
  if (cursors.a && cursors.b) rows.push(['Cursor Δt (B − A)', cursors.b.tS - cursors.a.tS, 's'], ['Cursor ΔV (B − A)', cursors.b.v - cursors.a.v, 'V']);
  return rows;
}
