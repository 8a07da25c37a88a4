import { useEffect, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { formatAxisValue, readChartTheme, SERIES_DRAW, useThemeVersion } from './chart-theme';
import type { LineChartProps } from './LineChart';
import { attachZoomGestures, clampSpan, zoomSpan } from './zoom-gestures';

type Props = Pick<LineChartProps, 'x' | 'series' | 'xUnit' | 'yUnit' | 'xLabel' | 'yLabel' | 'logX' | 'yFromZero'> & { height: number };

/** The uPlot canvas behind `LineChart`; loaded on demand so the charting code stays out of the first page. */
export default function UplotChart({ x, series, xUnit, yUnit, xLabel, yLabel, logX, yFromZero, height }: Props) {
  const host = useRef<HTMLDivElement>(null);
  const themeVersion = useThemeVersion();
  const [cursorIdx, setCursorIdx] = useState<number | null>(null);

  useEffect(() => {
    const el = host.current;
    if (!el) return;
    const theme = readChartTheme();
    const ticks = (unit: string) => (u: uPlot, splits: number[], axisIdx: number) => {
      const key = u.axes[axisIdx].scale ?? (axisIdx === 0 ? 'x' : 'y');
      const sc = u.scales[key];
      // a log axis never reaches zero, so nothing on it is rounding dust
      const span = sc.distr === 3 ? 0 : (sc.max ?? 0) - (sc.min ?? 0);
      return splits.map((v) => (v === null || v === undefined ? '' : formatAxisValue(v, unit, span)));
    };
    // On a log axis uPlot splits at 1…9 × each decade; a grid line on every one is a thicket.
    const decadesOnly = (_u: uPlot, splits: number[]) =>
      splits.map((v) => (Math.abs(Math.log10(v) - Math.round(Math.log10(v))) < 1e-9 ? v : null));
    const axis = (label: string | undefined, unit: string, log = false): uPlot.Axis => ({
      stroke: theme.axis,
      font: theme.tickFont,
      labelFont: theme.labelFont,
      label,
      grid: { stroke: theme.grid, width: 1, ...(log ? { filter: decadesOnly } : {}) },
      ticks: { stroke: theme.grid, width: 1, size: 4 },
      values: ticks(unit),
    });
    const opts: uPlot.Options = {
      width: Math.max(200, Math.floor(el.clientWidth)),
      height,
      legend: { show: false },
      cursor: { y: false, points: { show: false }, drag: { x: false, y: false } },
      scales: {
        // The data's own extent: a log scale would otherwise round out to whole decades.
        x: { time: false, distr: logX ? 3 : 1, log: 10, range: (_u, min, max) => [min, max] },
        y: yFromZero ? { range: (_u, _min, max) => [0, max > 0 ? max * 1.08 : 1] } : {},
      },
      axes: [axis(xLabel, xUnit, logX), { ...axis(yLabel, yUnit), size: 64 }],
      series: [
        {},
        ...series.map((s) => ({
          label: s.label,
          stroke: theme.stroke[s.style],
          width: SERIES_DRAW[s.style].width,
          dash: SERIES_DRAW[s.style].dash,
          points: { show: false },
          spanGaps: false,
        })),
      ],
      hooks: {
        setCursor: [(u) => setCursorIdx(u.cursor.idx ?? null)],
        // the span on screen, readable from outside (tests, and anyone inspecting the page)
        setScale: [
          (u, key) => {
            if (key !== 'x') return;
            el.dataset.xMin = String(u.scales.x.min);
            el.dataset.xMax = String(u.scales.x.max);
          },
        ],
      },
    };
    const data: uPlot.AlignedData = [Array.from(x), ...series.map((s) => Array.from(s.values))];
    const chart = new uPlot(opts, data, el);
    const full: [number, number] = [x[0], x[x.length - 1]];
    const showAll = () => chart.setScale('x', { min: full[0], max: full[1] });
    const detachZoom = attachZoomGestures(chart.over, {
      onZoom: (factor, anchor) => {
        const { min, max } = chart.scales.x;
        if (min === undefined || max === undefined) return;
        const next = zoomSpan(min, max, factor, anchor, logX);
        // a ten-thousandth of the whole is as close as a computed curve is worth looking
        const tooNarrow = logX ? Math.log10(next[1] / next[0]) < Math.log10(full[1] / full[0]) * 1e-4 : next[1] - next[0] < (full[1] - full[0]) * 1e-4;
        if (tooNarrow) return;
        const kept = clampSpan(next, full[0], full[1], logX);
        if (kept) chart.setScale('x', { min: kept[0], max: kept[1] });
        else showAll();
      },
      onReset: showAll,
    });
    const resize = new ResizeObserver(([entry]) => {
      const width = Math.floor(entry.contentRect.width);
      if (width > 0 && width !== chart.width) chart.setSize({ width, height });
    });
    resize.observe(el);
    return () => {
      detachZoom();
      resize.disconnect();
      chart.destroy();
    };
  }, [x, series, xUnit, yUnit, xLabel, yLabel, logX, yFromZero, height, themeVersion]);

  const readout =
    cursorIdx === null || cursorIdx >= x.length
      ? null
      : [
          formatAxisValue(x[cursorIdx], xUnit, 0, 4),
          ...series.map((s) => {
            const v = s.values[cursorIdx];
            return `${s.label}: ${v === null || v === undefined ? '—' : formatAxisValue(v, yUnit, 0, 4)}`;
          }),
        ].join(' · ');

  return (
    <>
      <div ref={host} className="ft-chart w-full touch-pan-y" aria-hidden="true" data-testid="line-chart" />
      <p className="min-h-[1.25rem] font-mono text-[11px] text-muted" aria-hidden="true">
        {readout ?? '\u00a0'}
      </p>
    </>
  );
}
