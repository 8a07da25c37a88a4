import { describe, expect, it } from 'vitest';
import { clampSpan, wheelZoomFactor, zoomSpan } from '../../src/components/charts/zoom-gestures';
import { csvField, fileNameFor, toCsv } from '../../src/components/charts/plot-export';
import { zoomWindowAt } from '../../src/features/captures/components/view-window';
import { captureReadingRows } from '../../src/features/captures/components/capture-readings';
import { readStoredAnalysis } from '../../src/features/captures/stored-analysis';

describe('plot zoom', () => {
  it('should widen for a wheel turned towards the reader and narrow the other way, by the same ratio', () => {
    expect(wheelZoomFactor(100)).toBeGreaterThan(1);
    expect(wheelZoomFactor(-100)).toBeLessThan(1);
    expect(wheelZoomFactor(100) * wheelZoomFactor(-100)).toBeCloseTo(1, 12);
  });

  it('should count a line of wheel travel as many pixels, and cap one flick', () => {
    expect(wheelZoomFactor(3, 1)).toBeCloseTo(wheelZoomFactor(48, 0), 12);
    expect(wheelZoomFactor(1e6)).toBe(2);
  });

  it('should keep the point under the pointer where it is', () => {
    const [lo, hi] = zoomSpan(0, 10, 0.5, 0.2);
    expect(lo).toBeCloseTo(1, 12);
    expect(hi).toBeCloseTo(6, 12);
    // 2 sat a fifth of the way across before, and still does
    expect((2 - lo) / (hi - lo)).toBeCloseTo(0.2, 12);
  });

  it('should zoom a log axis in decades', () => {
    const [lo, hi] = zoomSpan(10, 1e5, 0.5, 0.5, true);
    expect(lo).toBeCloseTo(10 ** 2, 6);
    expect(hi).toBeCloseTo(10 ** 4, 6);
  });

  it('should slide a window back inside the extent and give up a window that covers it all', () => {
    expect(clampSpan([-2, 3], 0, 10)).toEqual([0, 5]);
    expect(clampSpan([8, 12], 0, 10)).toEqual([6, 10]);
    expect(clampSpan([-1, 11], 0, 10)).toBeNull();
  });

  it('should scale a capture window about the instant under the pointer', () => {
    const w = zoomWindowAt({ fromS: 0, toS: 1e-6 }, 0.5, 0.25e-6);
    expect(w.fromS).toBeCloseTo(0.125e-6, 15);
    expect(w.toS).toBeCloseTo(0.625e-6, 15);
  });
});

describe('plot CSV', () => {
  // source: RFC 4180, section 2 (fields with commas, quotes or line breaks are quoted; quotes doubled; CRLF)
  it('should quote only the fields that need it and double their quotes', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a, b')).toBe('"a, b"');
    expect(csvField('the "fast" edge')).toBe('"the ""fast"" edge"');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField(null)).toBe('');
    expect(csvField(Number.NaN)).toBe('');
    expect(csvField(1.5e-9)).toBe('1.5e-9');
  });

  it('should end every record with CRLF', () => {
    expect(toCsv([['quantity', 'value'], ['Rise time', 2e-9]])).toBe('quantity,value\r\nRise time,2e-9\r\n');
  });

  it('should name the file after the plot', () => {
    expect(fileNameFor('Magnitude response: probe + scope', 'png')).toBe('magnitude-response-probe-scope.png');
    expect(fileNameFor('***', 'csv')).toBe('plot.csv');
  });
});

describe('capture readings CSV', () => {
  it('should list what the analysis measured, leave out what it could not, and add the window and cursors', () => {
    const analysis = readStoredAnalysis({ points: 2500, sampleIntervalS: 1e-6, riseTimeS: 8.03e-7, topV: 3.3, baseV: null });
    const rows = captureReadingRows(analysis, { fromS: 0, toS: 2.5e-3 }, { a: { tS: 1e-4, v: 0 }, b: { tS: 3e-4, v: 3.3 } });
    expect(rows[0]).toEqual(['quantity', 'value', 'unit']);
    expect(rows).toContainEqual(['Samples', 2500, '']);
    expect(rows).toContainEqual(['Rise time (10–90 %)', 8.03e-7, 's']);
    expect(rows.some((r) => r[0] === 'Base level')).toBe(false);
    expect(rows).toContainEqual(['Window shown to', 2.5e-3, 's']);
    const dt = rows.find((r) => r[0] === 'Cursor Δt (B − A)');
    expect(dt?.[1]).toBeCloseTo(2e-4, 15);
  });
});
