import { lazy, Suspense, useId, useRef } from 'react';
import { SERIES_DRAW, type SeriesStyle } from './chart-theme';
import { PlotDownloads } from './PlotDownloads';

export type { SeriesStyle } from './chart-theme';

export interface ChartSeries {
  label: string;
  /** One value per x; null leaves a gap. */
  values: readonly (number | null)[];
  style: SeriesStyle;
}

export interface LineChartProps {
  /** Ascending x values in SI units (s, Hz…). */
  x: readonly number[];
  series: readonly ChartSeries[];
  /** SI unit symbol for the axis ticks: 's', 'Hz', 'V'…; '' for a plain ratio. */
  xUnit: string;
  yUnit: string;
  xLabel?: string;
  yLabel?: string;
  logX?: boolean;
  /** Start the y axis at zero (magnitudes), instead of fitting it to the data. */
  yFromZero?: boolean;
  /** Plot height in CSS pixels, axes included. */
  height?: number;
  /** The chart's accessible name, also shown as its caption. */
  title: string;
  /** What the chart shows, in words: read by screen readers and printed under the chart. */
  summary: string;
}

const UplotChart = lazy(() => import('./UplotChart'));

const STROKE_VAR: Record<SeriesStyle, string> = {
  ink: 'var(--ft-ink)',
  model: 'var(--ft-agree)',
  reference: 'var(--ft-muted)',
};

function Swatch({ style }: { style: SeriesStyle }) {
  const draw = SERIES_DRAW[style];
  return (
    <svg width="28" height="8" aria-hidden="true" className="shrink-0">
      <line x1="0" y1="4" x2="28" y2="4" stroke={STROKE_VAR[style]} strokeWidth={draw.width} strokeDasharray={draw.dash?.join(' ')} />
    </svg>
  );
}

/**
 * A plain line chart in our look: engineering-unit axes, a faint grid, the measurement in
 * ink, the model dashed in teal, references dashed and muted. The uPlot code is fetched the
 * first time a chart is shown.
 */
export function LineChart({ height = 260, title, summary, series, ...plot }: LineChartProps) {
  const titleId = useId();
  const summaryId = useId();
  const plotRef = useRef<HTMLDivElement>(null);
  const csvRows = () => [
    [`${plot.xLabel ?? 'x'}${plot.xUnit ? ` (${plot.xUnit})` : ''}`, ...series.map((s) => `${s.label}${plot.yUnit ? ` (${plot.yUnit})` : ''}`)],
    ...plot.x.map((xv, i) => [xv, ...series.map((s) => s.values[i])]),
  ];
  return (
    <figure className="flex min-w-0 flex-col gap-2" aria-labelledby={titleId} aria-describedby={summaryId}>
      <figcaption id={titleId} className="text-sm font-semibold">
        {title}
      </figcaption>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-muted" aria-label="Legend">
        {series.map((s) => (
          <li key={s.label} className="flex items-center gap-1.5">
            <Swatch style={s.style} />
            {s.label}
          </li>
        ))}
      </ul>
      <div ref={plotRef} role="img" aria-label={`${title}. ${summary}`} className="min-w-0" style={{ minHeight: height }}>
        <Suspense
          fallback={
            <p className="flex items-center justify-center text-sm text-muted" style={{ height }}>
              Drawing the plot…
            </p>
          }
        >
          <UplotChart {...plot} series={series} height={height} />
        </Suspense>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-xs text-muted">Scroll or pinch over the plot to zoom; double-click to see it all.</p>
        <PlotDownloads plot={plotRef} name={title} rows={csvRows} csvLabel="Download CSV (curves)" />
      </div>
      <p id={summaryId} className="text-sm text-muted">
        {summary}
      </p>
    </figure>
  );
}
