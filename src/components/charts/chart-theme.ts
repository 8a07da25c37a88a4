import { useEffect, useState } from 'react';
import { formatEngineering } from '../../../shared/units/engineering';

/** How a series is drawn: a measurement in ink, a model overlay dashed in teal, a reference dashed and muted. */
export type SeriesStyle = 'ink' | 'model' | 'reference';

export interface ChartTheme {
  stroke: Record<SeriesStyle, string>;
  axis: string;
  grid: string;
  tickFont: string;
  labelFont: string;
}

const cssVar = (name: string, fallback: string) =>
  getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;

/** A #rrggbb colour at some opacity; other colour syntaxes are passed through unchanged. */
export function withAlpha(color: string, alpha: number): string {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(color);
  if (!m) return color;
  const [r, g, b] = m.slice(1).map((h) => parseInt(h, 16));
  return `rgba(${r}, ${g}, ${b}, ${alpha})`;
}

/** The canvas cannot read CSS variables, so the palette is read from the page each time a chart is drawn. */
export function readChartTheme(): ChartTheme {
  const ink = cssVar('--ft-ink', '#1c2a45');
  const muted = cssVar('--ft-muted', '#5d6478');
  return {
    stroke: { ink, model: cssVar('--ft-agree', '#0f766e'), reference: muted },
    axis: muted,
    grid: withAlpha(cssVar('--ft-rule', '#ddd3bf'), 0.7),
    tickFont: '11px "IBM Plex Mono", ui-monospace, monospace',
    labelFont: '600 12px "Source Sans 3", system-ui, sans-serif',
  };
}

export const SERIES_DRAW: Record<SeriesStyle, { width: number; dash?: number[] }> = {
  ink: { width: 2 },
  model: { width: 2.25, dash: [8, 5] },
  reference: { width: 1.5, dash: [3, 4] },
};

/** Changes whenever the light/dark theme flips (the `dark` class on <html> or the system preference). */
export function useThemeVersion(): number {
  const [version, setVersion] = useState(0);
  useEffect(() => {
    const bump = () => setVersion((v) => v + 1);
    const observer = new MutationObserver(bump);
    observer.observe(document.documentElement, { attributes: true, attributeFilter: ['class'] });
    const media = window.matchMedia('(prefers-color-scheme: dark)');
    media.addEventListener('change', bump);
    return () => {
      observer.disconnect();
      media.removeEventListener('change', bump);
    };
  }, []);
  return version;
}

/**
 * A tick or readout value in engineering notation ("20 ns", "1.5 MHz"); a unitless ratio is
 * written plainly ("0.5", not "500 m"). Values within a millionth of the axis span of zero
 * are zero, so floating-point dust does not print as "1.2 ys".
 */
export function formatAxisValue(value: number, unit: string, span = 0, digits = 3): string {
  const v = Math.abs(value) < Math.abs(span) * 1e-6 ? 0 : value;
  if (unit === '') return String(Number(v.toPrecision(digits)));
  return formatEngineering(v, unit, digits);
}
