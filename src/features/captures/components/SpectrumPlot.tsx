import { useEffect, useRef, useState } from 'react';
import { formatEngineering as eng } from '../../../../shared/units/engineering';
import { PlotDownloads } from '../../../components/charts/PlotDownloads';
import { attachZoomGestures, clampSpan, zoomSpan } from '../../../components/charts/zoom-gestures';
import type { StoredAnalysis } from '../stored-analysis';

const W = 320;
const H = 180;
const PAD = { left: 8, right: 8, top: 10, bottom: 28 };
const PLOT_W = W - PAD.left - PAD.right;

/** Tick frequencies in [lo, hi]: 1, 2 and 5 per decade when zoomed in, decades alone when those would crowd. */
function ticksBetween(lo: number, hi: number): number[] {
  const all: number[] = [];
  for (let d = Math.floor(Math.log10(lo)); d <= Math.ceil(Math.log10(hi)); d++) {
    for (const m of [1, 2, 5]) {
      const f = m * 10 ** d;
      if (f >= lo && f <= hi) all.push(f);
    }
  }
  return all.length > 6 ? all.filter((f) => Math.abs(Math.log10(f) - Math.round(Math.log10(f))) < 1e-9) : all;
}

/**
 * The capture's amplitude spectrum (from the stored analysis, FFT by fft.js on the server):
 * a log-frequency axis, amplitude in V, the strongest lines labelled and a hum line in amber.
 * Scroll or pinch zooms the frequency axis, a double-click shows it all again.
 */
export function SpectrumPlot({ analysis, name = 'capture' }: { analysis: StoredAnalysis; name?: string }) {
  const spectrum = analysis.spectrum;
  const svgRef = useRef<SVGSVGElement>(null);
  const figureRef = useRef<HTMLElement>(null);
  const [span, setSpan] = useState<[number, number] | null>(null);
  const usable = Boolean(spectrum && spectrum.plot.frequenciesHz.length >= 2);
  const fMin = spectrum ? Math.max(spectrum.plot.frequenciesHz[0] ?? 0, spectrum.binHz) : 1;
  const fMax = spectrum?.nyquistHz ?? 10;
  const [lo, hi] = span ?? [fMin, fMax];
  const latest = useRef({ lo, hi, fMin, fMax });
  latest.current = { lo, hi, fMin, fMax };

  useEffect(() => {
    const svg = svgRef.current;
    if (!svg) return;
    return attachZoomGestures(svg as unknown as HTMLElement, {
      onZoom: (factor, anchor) => {
        const v = latest.current;
        const inPlot = (anchor * W - PAD.left) / PLOT_W;
        const next = zoomSpan(v.lo, v.hi, factor, inPlot, true);
        // closer than a fortieth of a decade shows no more than the bins already do
        if (Math.log10(next[1] / next[0]) < 0.025) return;
        setSpan(clampSpan(next, v.fMin, v.fMax, true));
      },
      onReset: () => setSpan(null),
    });
  }, [usable]);

  if (!spectrum || !usable) return <p className="text-sm text-muted">No spectrum: the capture is too short.</p>;
  const { frequenciesHz, amplitudesV } = spectrum.plot;
  const shown = frequenciesHz.map((f, i) => [f, amplitudesV[i]] as const).filter(([f]) => f >= lo && f <= hi);
  const aMax = Math.max(...(shown.length > 0 ? shown : frequenciesHz.map((f, i) => [f, amplitudesV[i]] as const)).map(([, a]) => a)) || 1;
  const x = (f: number) => PAD.left + ((Math.log10(Math.max(f, fMin)) - Math.log10(lo)) / (Math.log10(hi) - Math.log10(lo))) * PLOT_W;
  const y = (a: number) => PAD.top + (1 - a / aMax) * (H - PAD.top - PAD.bottom);
  const path = frequenciesHz.map((f, i) => `${i === 0 ? 'M' : 'L'}${x(f).toFixed(1)},${y(amplitudesV[i]).toFixed(1)}`).join(' ');
  const ticks = ticksBetween(lo, hi);
  const hum = analysis.humFrequencyHz;
  const top = spectrum.lines.slice(0, 3);
  const clipId = `spectrum-clip-${name.replace(/\W/g, '')}`;
  const csvRows = () => [['frequency (Hz)', 'amplitude (V)'], ...shown.map(([f, a]) => [f, a])];
  return (
    <figure ref={figureRef} className="flex min-w-0 flex-col gap-1" aria-label="Spectrum of the analysed channel">
      <svg
        ref={svgRef}
        viewBox={`0 0 ${W} ${H}`}
        className="w-full touch-pan-y select-none"
        role="img"
        data-testid="spectrum"
        data-f-min={lo}
        data-f-max={hi}
        aria-label={`Spectrum: strongest lines ${top.map((l) => `${eng(l.frequencyHz, 'Hz')} (${eng(l.amplitudeV, 'V')})`).join(', ')}${hum ? `; hum at ${eng(hum, 'Hz')}` : ''}.`}
      >
        <defs>
          <clipPath id={clipId}>
            <rect x={PAD.left} y={0} width={PLOT_W} height={H - PAD.bottom} />
          </clipPath>
        </defs>
        {ticks.map((f) => (
          <g key={f}>
            <line x1={x(f)} x2={x(f)} y1={PAD.top} y2={H - PAD.bottom} stroke="var(--ft-rule)" strokeWidth="1" />
            <text x={x(f)} y={H - 10} textAnchor="middle" fontSize="10" fill="var(--ft-muted)" fontFamily="IBM Plex Mono, monospace">
              {eng(f, 'Hz', 1)}
            </text>
          </g>
        ))}
        <line x1={PAD.left} x2={W - PAD.right} y1={H - PAD.bottom} y2={H - PAD.bottom} stroke="var(--ft-muted)" strokeWidth="1" />
        <g clipPath={`url(#${clipId})`}>
          {hum !== null && <line x1={x(hum)} x2={x(hum)} y1={PAD.top} y2={H - PAD.bottom} stroke="var(--ft-caution)" strokeWidth="1.5" strokeDasharray="4 3" />}
          <path d={path} fill="none" stroke="var(--ft-ink)" strokeWidth="1.25" />
        </g>
      </svg>
      <figcaption className="text-xs text-muted">
        Strongest lines:{' '}
        <span className="font-mono">{top.map((l) => `${eng(l.frequencyHz, 'Hz', 3)} ${eng(l.amplitudeV, 'V', 2)}`).join(' · ')}</span>
        {hum !== null ? (
          <>
            {' '}
            · <span className="text-caution">hum at <span className="font-mono">{eng(hum, 'Hz', 3)}</span></span>
          </>
        ) : (
          ' · no mains hum stands out'
        )}
        .{span && ' Zoomed: double-click the spectrum to see it all.'}
      </figcaption>
      <PlotDownloads plot={figureRef} name={`${name} spectrum`} rows={csvRows} csvLabel="Download CSV (spectrum)" />
    </figure>
  );
}
