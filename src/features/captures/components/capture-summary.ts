import type { CaptureOverlayResult } from '../../../../shared/diagnosis/capture-overlay';
import type { Trace } from '../../../../shared/schemas/trace';
import { formatEngineering as eng } from '../../../../shared/units/engineering';
import type { StoredAnalysis } from '../stored-analysis';

const count = (n: number) => n.toLocaleString('en');
const pct = (v: number) => `${Number(v.toPrecision(3))} %`;

/** What the plot shows, in sentences, for the figure's description and screen readers. */
export function captureSummary(a: StoredAnalysis, overlay: CaptureOverlayResult | null): string {
  const parts: string[] = [];
  parts.push(`${count(a.points)} samples${a.sampleIntervalS === null ? '' : ` every ${eng(a.sampleIntervalS, 's')}`}.`);
  if (a.baseV !== null && a.topV !== null && a.amplitudeV) {
    parts.push(`Base ${eng(a.baseV, 'V')}, top ${eng(a.topV, 'V')} (amplitude ${eng(a.amplitudeV, 'V')}), by the histogram method.`);
    const rises = a.edges.filter((e) => e.kind === 'rise').length;
    const falls = a.edges.length - rises;
    const edges = [rises && `${rises} rising`, falls && `${falls} falling`].filter(Boolean).join(' and ');
    const figures = [
      a.riseTimeS !== null && `rise time ${eng(a.riseTimeS, 's')}`,
      a.fallTimeS !== null && `fall time ${eng(a.fallTimeS, 's')}`,
      a.overshootPct !== null && `overshoot ${pct(a.overshootPct)}`,
      a.ringingFrequencyHz !== null && `ringing at ${eng(a.ringingFrequencyHz, 'Hz')}`,
      a.periodS !== null && `period ${eng(a.periodS, 's')}`,
    ].filter(Boolean);
    if (edges) parts.push(`${edges[0].toUpperCase()}${edges.slice(1)} edge${a.edgeCount === 1 ? '' : 's'} marked at 10, 50 and 90 %${figures.length ? `: ${figures.join(', ')}` : ''}.`);
  } else {
    parts.push('The capture shows no two distinct levels, so no edges are measured.');
  }
  if (overlay?.ok) parts.push(`Dashed: ${overlay.overlay.summary}`);
  else if (overlay) parts.push(`No model overlay: ${overlay.reason}.`);
  return parts.join(' ');
}

/** The window on screen and how faithfully it is drawn; `trace` is the one fetched for exactly this window. */
export function viewSummary(window: { fromS: number; toS: number }, zoomed: boolean, trace?: Trace): string {
  const span = `${zoomed ? 'Zoomed' : 'Whole capture'}: ${eng(window.fromS, 's', 4)} to ${eng(window.toS, 's', 4)}`;
  if (!trace) return `${span}, loading the samples…`;
  const drawn = trace.timesS.length;
  const detail =
    trace.windowPoints <= drawn
      ? `all ${count(trace.windowPoints)} samples`
      : `${count(trace.windowPoints)} samples as ${count(drawn)} (min and max per pixel column)`;
  return `${span}, ${detail}`;
}
