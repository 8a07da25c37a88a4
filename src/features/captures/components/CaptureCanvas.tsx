import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { formatAxisValue, readChartTheme, SERIES_DRAW, useThemeVersion, withAlpha } from '../../../components/charts/chart-theme';
import { attachZoomGestures } from '../../../components/charts/zoom-gestures';
import type { CapturePlotData } from './plot-data';

export interface LevelLine {
  label: string;
  v: number;
  /** Base and top: a solid faint line; the 10/50/90 % levels: dotted. */
  state: boolean;
}

export interface EdgeMark {
  t10S: number;
  t50S: number;
  t90S: number;
  v10: number;
  v50: number;
  v90: number;
}

export interface PlotCursor {
  tS: number;
  v: number;
}

export interface CaptureCanvasProps {
  data: CapturePlotData;
  /** Colours (CSS variables' values are read at draw time) and names of `data.others`. */
  otherSeries?: { label: string; color: string }[];
  xRange: [number, number];
  yRange: [number, number];
  levels: LevelLine[];
  edges: EdgeMark[];
  cursors: { a?: PlotCursor; b?: PlotCursor };
  width: number;
  height: number;
  /** A drag across the plot: the time span selected, s. */
  onSelectRange: (fromS: number, toS: number) => void;
  /** A click on the plot, snapped to the nearest capture sample drawn. */
  onPick: (cursor: PlotCursor) => void;
  /** Wheel or pinch: scale the window by `factor` about the instant `anchorS`. */
  onZoom?: (factor: number, anchorS: number) => void;
  /** A double-click: the whole capture again. */
  onShowAll?: () => void;
}

// a press that moves less than this is a click (a cursor), more is a drag (a zoom)
const CLICK_SLOP_PX = 5;

/** The sample drawn nearest a click: among those within a few pixels in time, the nearest in voltage. */
function snap(u: uPlot, data: CapturePlotData, xPx: number, yPx: number): PlotCursor | null {
  let best = -1;
  let bestDy = Infinity;
  let nearestX = -1;
  let nearestDx = Infinity;
  for (let i = 0; i < data.x.length; i++) {
    const v = data.capture[i];
    if (v === null) continue;
    const dx = Math.abs(u.valToPos(data.x[i], 'x') - xPx);
    if (dx < nearestDx) {
      nearestDx = dx;
      nearestX = i;
    }
    if (dx <= 4) {
      const dy = Math.abs(u.valToPos(v, 'y') - yPx);
      if (dy < bestDy) {
        bestDy = dy;
        best = i;
      }
    }
  }
  const i = best >= 0 ? best : nearestX;
  return i >= 0 ? { tS: data.x[i], v: data.capture[i] as number } : null;
}

/** The series uPlot draws: time, the analysed trace, the model, then each further trace (empty when missing). */
function aligned(d: CapturePlotData, otherCount: number): uPlot.AlignedData {
  const others = Array.from({ length: otherCount }, (_, k) => d.others[k] ?? d.x.map(() => null));
  return [d.x, d.capture, d.model, ...others] as uPlot.AlignedData;
}

/** A colour given as `var(--name)` read from the page, since the canvas cannot. */
function resolveColor(color: string): string {
  const m = /^var\((--[\w-]+)\)$/.exec(color);
  if (!m) return color;
  return getComputedStyle(document.documentElement).getPropertyValue(m[1]).trim() || '#888';
}

// room right of the plot for the level names
const GUTTER_PX = 40;

/** Level names in the right-hand gutter, nudged apart where two levels lie close. */
function drawLevelLabels(u: uPlot, levels: LevelLine[], color: string) {
  const ctx = u.ctx;
  const ratio = uPlot.pxRatio;
  const { left, top, width, height } = u.bbox;
  const lineH = 11 * ratio;
  const placed = levels.map((l) => ({ text: l.label, y: u.valToPos(l.v, 'y', true) })).filter((l) => l.y >= top - lineH && l.y <= top + height + lineH);
  placed.sort((a, b) => a.y - b.y);
  for (let i = 1; i < placed.length; i++) placed[i].y = Math.max(placed[i].y, placed[i - 1].y + lineH);
  ctx.save();
  ctx.font = `${10 * ratio}px "IBM Plex Mono", ui-monospace, monospace`;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'middle';
  ctx.fillStyle = color;
  for (const l of placed) ctx.fillText(l.text, left + width + 5 * ratio, l.y);
  ctx.restore();
}

/** The uPlot canvas of `CapturePlot`: the capture, the model, reference levels, edges and cursors. */
export default function CaptureCanvas(props: CaptureCanvasProps) {
  const { data, xRange, yRange, width, height } = props;
  const host = useRef<HTMLDivElement>(null);
  const chart = useRef<uPlot | null>(null);
  const latest = useRef(props);
  latest.current = props;
  const themeVersion = useThemeVersion();
  // on a phone the axis title costs more width than it explains
  const narrow = width < 480;

  useEffect(() => {
    const el = host.current;
    if (!el) return;
    const theme = readChartTheme();
    const faint = withAlpha(theme.stroke.reference, 0.55);
    const ticks = (unit: string, key: 'x' | 'y') => (u: uPlot, splits: number[]) => {
      const sc = u.scales[key];
      const span = (sc.max ?? 0) - (sc.min ?? 0);
      return splits.map((v) => formatAxisValue(v, unit, span));
    };
    const axis = (label: string | undefined, unit: string, key: 'x' | 'y'): uPlot.Axis => ({
      stroke: theme.axis,
      font: theme.tickFont,
      labelFont: theme.labelFont,
      label,
      grid: { stroke: theme.grid, width: 1 },
      ticks: { stroke: theme.grid, width: 1, size: 4 },
      values: ticks(unit, key),
    });

    const drawMarks = (u: uPlot) => {
      const { levels, edges, cursors } = latest.current;
      const ctx = u.ctx;
      const ratio = uPlot.pxRatio;
      const { left, top, width: w, height: h } = u.bbox;
      ctx.save();
      ctx.beginPath();
      ctx.rect(left, top, w, h);
      ctx.clip();
      for (const level of levels) {
        const y = Math.round(u.valToPos(level.v, 'y', true)) + 0.5;
        ctx.strokeStyle = faint;
        ctx.lineWidth = ratio;
        ctx.setLineDash(level.state ? [] : [2 * ratio, 4 * ratio]);
        ctx.beginPath();
        ctx.moveTo(left, y);
        ctx.lineTo(left + w, y);
        ctx.stroke();
      }
      ctx.setLineDash([]);
      const [fromS, toS] = latest.current.xRange;
      for (const edge of edges) {
        if (edge.t90S < fromS && edge.t10S < fromS) continue;
        if (edge.t90S > toS && edge.t10S > toS) continue;
        ctx.lineWidth = 1.25 * ratio;
        ctx.strokeStyle = theme.axis;
        ctx.fillStyle = theme.stroke.ink;
        for (const [t, v, filled] of [
          [edge.t10S, edge.v10, false],
          [edge.t90S, edge.v90, false],
          [edge.t50S, edge.v50, true],
        ] as const) {
          ctx.beginPath();
          ctx.arc(u.valToPos(t, 'x', true), u.valToPos(v, 'y', true), (filled ? 2.5 : 3.5) * ratio, 0, 2 * Math.PI);
          if (filled) ctx.fill();
          else ctx.stroke();
        }
      }
      ctx.textAlign = 'center';
      ctx.textBaseline = 'top';
      ctx.font = `600 ${11 * ratio}px "Source Sans 3", system-ui, sans-serif`;
      const xOf = (c: PlotCursor | undefined) => (c ? Math.round(u.valToPos(c.tS, 'x', true)) + 0.5 : NaN);
      // two cursors a few pixels apart would hide one label under the other
      const crowded = Math.abs(xOf(cursors.a) - xOf(cursors.b)) < 16 * ratio;
      for (const [name, cursor] of [
        ['A', cursors.a],
        ['B', cursors.b],
      ] as const) {
        if (!cursor) continue;
        const x = xOf(cursor);
        const labelTop = top + (name === 'B' && crowded ? 18 : 2) * ratio;
        const y = u.valToPos(cursor.v, 'y', true);
        ctx.strokeStyle = theme.stroke.ink;
        ctx.lineWidth = ratio;
        ctx.setLineDash([4 * ratio, 3 * ratio]);
        ctx.beginPath();
        ctx.moveTo(x, top);
        ctx.lineTo(x, top + h);
        ctx.stroke();
        ctx.setLineDash([]);
        ctx.beginPath();
        ctx.moveTo(x - 6 * ratio, y);
        ctx.lineTo(x + 6 * ratio, y);
        ctx.stroke();
        ctx.fillStyle = theme.stroke.ink;
        ctx.fillRect(x - 7 * ratio, labelTop, 14 * ratio, 14 * ratio);
        ctx.fillStyle = getComputedStyle(document.documentElement).getPropertyValue('--ft-paper').trim() || '#f6f1e6';
        ctx.fillText(name, x, labelTop + 1.5 * ratio);
      }
      ctx.restore();
      drawLevelLabels(u, levels, theme.axis);
    };

    const opts: uPlot.Options = {
      width: Math.max(200, latest.current.width),
      height: latest.current.height,
      legend: { show: false },
      padding: [14, GUTTER_PX, 0, 0],
      cursor: { y: false, points: { show: false }, drag: { x: true, y: false, setScale: false, dist: CLICK_SLOP_PX } },
      scales: {
        x: { time: false, range: () => latest.current.xRange },
        y: { range: () => latest.current.yRange },
      },
      axes: [axis('Time', 's', 'x'), { ...axis(narrow ? undefined : 'Voltage', 'V', 'y'), size: narrow ? 50 : 58 }],
      series: [
        {},
        { label: 'Capture', stroke: theme.stroke.ink, width: 1.5, points: { show: false }, spanGaps: true },
        { label: 'Model', stroke: theme.stroke.model, width: SERIES_DRAW.model.width, dash: SERIES_DRAW.model.dash, points: { show: false }, spanGaps: false },
        ...(latest.current.otherSeries ?? []).map((o) => ({ label: o.label, stroke: resolveColor(o.color), width: 1.25, points: { show: false }, spanGaps: true })),
      ],
      hooks: {
        draw: [drawMarks],
        setSelect: [
          (u) => {
            if (u.select.width < CLICK_SLOP_PX) return;
            const fromS = u.posToVal(u.select.left, 'x');
            const toS = u.posToVal(u.select.left + u.select.width, 'x');
            u.setSelect({ left: 0, top: 0, width: 0, height: 0 }, false);
            latest.current.onSelectRange(fromS, toS);
          },
        ],
      },
    };
    const d = latest.current.data;
    const u = new uPlot(opts, aligned(d, latest.current.otherSeries?.length ?? 0), el);
    chart.current = u;

    let down: { x: number; y: number } | null = null;
    const onDown = (e: PointerEvent) => {
      down = { x: e.clientX, y: e.clientY };
    };
    const onUp = (e: PointerEvent) => {
      if (!down) return;
      const moved = Math.hypot(e.clientX - down.x, e.clientY - down.y);
      down = null;
      if (moved >= CLICK_SLOP_PX) return;
      const rect = u.over.getBoundingClientRect();
      const picked = snap(u, latest.current.data, e.clientX - rect.left, e.clientY - rect.top);
      if (picked) latest.current.onPick(picked);
    };
    u.over.addEventListener('pointerdown', onDown);
    u.over.addEventListener('pointerup', onUp);
    const detachZoom = attachZoomGestures(u.over, {
      onZoom: (factor, anchor) => latest.current.onZoom?.(factor, u.posToVal(anchor * u.over.clientWidth, 'x')),
      onReset: () => latest.current.onShowAll?.(),
    });
    return () => {
      detachZoom();
      u.over.removeEventListener('pointerdown', onDown);
      u.over.removeEventListener('pointerup', onUp);
      u.destroy();
      chart.current = null;
    };
  }, [themeVersion, narrow, props.otherSeries?.map((o) => o.label + o.color).join()]);

  useEffect(() => {
    const u = chart.current;
    if (!u) return;
    if (u.width !== Math.max(200, width) || u.height !== height) u.setSize({ width: Math.max(200, width), height });
  }, [width, height]);

  useEffect(() => {
    // the range functions read the latest window, so new data or a new window both re-range here
    chart.current?.setData(aligned(data, latest.current.otherSeries?.length ?? 0));
  }, [data, xRange, yRange]);

  useEffect(() => {
    chart.current?.redraw(false);
  }, [props.levels, props.edges, props.cursors]);

  // the window on screen, readable from outside (tests, and anyone inspecting the page)
  return <div ref={host} className="ft-chart w-full touch-pan-y select-none" data-testid="capture-canvas" data-x-min={xRange[0]} data-x-max={xRange[1]} />;
}
