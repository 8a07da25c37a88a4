import { closeSync, mkdtempSync, openSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { FileSeries } from '../../server/captures/sample-store';

// A store column read back: `scan` hands out blocks, served for a short range (the samples after
// one edge) from the pages `get` keeps rather than a read of its own.

const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-series-'));
const ROWS = 300_000;
const file = path.join(dir, 'ch1.f64');
writeFileSync(file, new Uint8Array(Float64Array.from({ length: ROWS }, (_, i) => i * 0.5).buffer));
const fd = openSync(file, 'r');
afterAll(() => {
  closeSync(fd);
  rmSync(dir, { recursive: true, force: true });
});

const series = () => new FileSeries([{ fd, rows: ROWS }], ROWS, 'f64', 0);
const scanned = (s: FileSeries, from: number, to: number) => {
  const out: number[] = [];
  const firsts: number[] = [];
  s.scan(from, to, (values, first) => {
    firsts.push(first);
    out.push(...values);
  });
  return { out, firsts };
};
const expected = (from: number, to: number) => Array.from({ length: to - from }, (_, k) => (from + k) * 0.5);

describe('a store column', () => {
  it('scans a short range across a page boundary in one block', () => {
    const s = series();
    s.get(65_000); // the page before the boundary is already kept
    const { out, firsts } = scanned(s, 65_400, 65_700);
    expect(out).toEqual(expected(65_400, 65_700));
    expect(firsts).toEqual([65_400]);
  });

  it('keeps a short block as it was while the visit reads far pages with get', () => {
    const s = series();
    let seen: number[] = [];
    s.scan(1_000, 1_010, (values) => {
      // five other pages: more than the four kept, so the block's page is read over
      for (const i of [70_000, 140_000, 200_000, 260_000, 290_000]) expect(s.get(i)).toBe(i * 0.5);
      seen = [...values];
    });
    expect(seen).toEqual(expected(1_000, 1_010));
  });

  it('scans a long range in blocks, and stops at its end', () => {
    const { out, firsts } = scanned(series(), 10, ROWS + 50);
    expect(out.length).toBe(ROWS - 10);
    expect(out[0]).toBe(5);
    expect(out[out.length - 1]).toBe((ROWS - 1) * 0.5);
    expect(firsts[0]).toBe(10);
    expect(firsts.length).toBeGreaterThan(1);
  });
});
