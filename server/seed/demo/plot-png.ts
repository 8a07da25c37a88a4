import { Jimp, loadFont } from 'jimp';
import { SANS_14_BLACK } from 'jimp/fonts';
import { formatEngineering } from '../../../shared/units/engineering';
import type { DemoTrace } from './capture-files';

/** Our plot style (DESIGN.md, Look): warm paper, faint grid, the capture in ink. */
const COLORS = { paper: 0xf6f1e6ff, grid: 0xe3d9c4ff, axis: 0x8a8577ff, ink: 0x1c2a45ff, label: [0x5d, 0x64, 0x78] };
const SIZE = { width: 880, height: 480, left: 84, right: 24, top: 40, bottom: 52 };

type Image = InstanceType<typeof Jimp>;
type Font = Awaited<ReturnType<typeof loadFont>>;

let font: Promise<Font> | undefined;

/** 1, 2 or 5 × 10ⁿ: tick steps people read easily. */
function niceStep(span: number, ticks: number): number {
  const raw = span / ticks;
  const power = 10 ** Math.floor(Math.log10(raw));
  return [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
}

// the bitmap font is ASCII, so micro becomes "u" as on many instruments' file names
const label = (value: number, unit: string) =>
  formatEngineering(Math.abs(value) < 1e-15 ? 0 : value, unit, 3)
    .replace('µ', 'u')
    .replace(/(\.\d*?)0+(?=\s)/, '$1')
    .replace(/\.(?=\s)/, '');

// straight into the RGBA buffer: setPixelColor validates every call and is the slow part
function plotPoint(img: Image, x: number, y: number, color: number, thick: number) {
  const data = img.bitmap.data;
  for (let dx = 0; dx < thick; dx++) {
    for (let dy = 0; dy < thick; dy++) {
      const px = Math.round(x) + dx;
      const py = Math.round(y) + dy;
      if (px < 0 || py < 0 || px >= SIZE.width || py >= SIZE.height) continue;
      const i = (py * SIZE.width + px) * 4;
      data[i] = color >>> 24;
      data[i + 1] = (color >>> 16) & 0xff;
      data[i + 2] = (color >>> 8) & 0xff;
      data[i + 3] = 0xff;
    }
  }
}

/** A straight segment; `dash.at` is the distance drawn so far (px), so dashes run on across segments. */
function line(img: Image, x0: number, y0: number, x1: number, y1: number, color: number, thick: number, dash?: { on: number; off: number; at: number }) {
  const length = Math.hypot(x1 - x0, y1 - y0);
  const steps = Math.max(1, Math.ceil(length));
  for (let i = 0; i <= steps; i++) {
    if (dash) {
      if (i > 0) dash.at += length / steps;
      if (dash.at % (dash.on + dash.off) >= dash.on) continue;
    }
    plotPoint(img, x0 + ((x1 - x0) * i) / steps, y0 + ((y1 - y0) * i) / steps, color, thick);
  }
}

/** Prints text in the muted label colour (the bitmap font is black). */
function text(img: Image, f: Font, x: number, y: number, s: string) {
  const layer = new Jimp({ width: 8 * s.length + 16, height: 22, color: 0x00000000 });
  layer.print({ font: f, x: 0, y: 0, text: s });
  layer.scan((_x, _y, idx) => {
    const d = layer.bitmap.data;
    [d[idx], d[idx + 1], d[idx + 2]] = COLORS.label;
  });
  img.composite(layer, Math.round(x), Math.round(y));
}

/** Min/max per pixel column, so the plot keeps the noise band and spikes of a long capture. */
function columns(trace: DemoTrace, values: Float64Array, x: (t: number) => number) {
  const cols = new Map<number, { min: number; max: number }>();
  for (let i = 0; i < values.length; i++) {
    const c = Math.round(x(trace.timesS[i]));
    const v = values[i];
    const col = cols.get(c);
    if (!col) cols.set(c, { min: v, max: v });
    else {
      col.min = Math.min(col.min, v);
      col.max = Math.max(col.max, v);
    }
  }
  return [...cols.entries()].sort((a, b) => a[0] - b[0]);
}

/** A PNG of a demo capture with labelled axes, in Falsetrace's own style. */
export async function renderTracePng(trace: DemoTrace): Promise<Buffer> {
  const f = await (font ??= loadFont(SANS_14_BLACK));
  const img = new Jimp({ width: SIZE.width, height: SIZE.height, color: COLORS.paper });
  const plotW = SIZE.width - SIZE.left - SIZE.right;
  const plotH = SIZE.height - SIZE.top - SIZE.bottom;
  const t1 = trace.timesS[trace.timesS.length - 1];
  let lo = Math.min(...trace.volts);
  let hi = Math.max(...trace.volts);
  if (hi - lo < 1e-12) [lo, hi] = [lo - 1, hi + 1];
  const pad = (hi - lo) * 0.08;
  [lo, hi] = [lo - pad, hi + pad];
  const x = (t: number) => SIZE.left + (t / t1) * plotW;
  const y = (v: number) => SIZE.top + ((hi - v) / (hi - lo)) * plotH;

  const tStep = niceStep(t1, 8);
  for (let t = 0; t <= t1 + 1e-15; t += tStep) {
    line(img, x(t), SIZE.top, x(t), SIZE.top + plotH, COLORS.grid, 1);
    const s = label(t, 's');
    text(img, f, Math.min(x(t) - 18, SIZE.width - 8 * s.length), SIZE.top + plotH + 8, s);
  }
  const vStep = niceStep(hi - lo, 6);
  for (let v = Math.ceil(lo / vStep) * vStep; v <= hi; v += vStep) {
    line(img, SIZE.left, y(v), SIZE.left + plotW, y(v), COLORS.grid, 1);
    text(img, f, 8, y(v) - 9, label(v, 'V'));
  }
  line(img, SIZE.left, SIZE.top + plotH, SIZE.left + plotW, SIZE.top + plotH, COLORS.axis, 1);
  line(img, SIZE.left, SIZE.top, SIZE.left, SIZE.top + plotH, COLORS.axis, 1);

  let prev: { c: number; min: number; max: number } | undefined;
  for (const [c, { min, max }] of columns(trace, trace.volts, x)) {
    line(img, c, y(max), c, y(min), COLORS.ink, 2);
    if (prev) line(img, prev.c, y((prev.min + prev.max) / 2), c, y((min + max) / 2), COLORS.ink, 2);
    prev = { c, min, max };
  }
  // a screenshot is what the scope showed: the capture alone, no model over it
  line(img, SIZE.left + plotW - 120, 20, SIZE.left + plotW - 96, 20, COLORS.ink, 2);
  text(img, f, SIZE.left + plotW - 90, 11, 'capture');
  return img.getBuffer('image/png');
}
