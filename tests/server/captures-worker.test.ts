import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Piscina } from 'piscina';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { analyzeCaptureFile } from '../../server/captures/analyze-file';
import { captureWorkers } from '../../server/captures/capture-pool';
import { warmUpCaptureAnalysis } from '../../server/captures/warm-up';
import { stepCsv } from './helpers/fixtures';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

/** A 1 ns-sampled square wave, 20 µs a period, with times precise enough to stay increasing. */
function squareCsv(samples: number): Buffer {
  const rows = ['time_s,voltage_v'];
  for (let i = 0; i < samples; i++) rows.push(`${(i * 1e-9).toExponential(6)},${Math.floor(i / 10_000) % 2 ? '3.300' : '0.000'}`);
  return Buffer.from(rows.join('\n'));
}

describe('capture analysis on the worker pool', () => {
  let ctx: TestContext;
  let eng: Awaited<ReturnType<typeof signedIn>>;
  const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-capworker-'));
  beforeAll(async () => {
    ctx = await createTestContext();
    eng = await signedIn(ctx, 'engineer');
  });
  afterAll(async () => {
    await captureWorkers.close();
    await ctx.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('should answer GET /api/health while a capture of a few MB is being analysed', async () => {
    const csv = squareCsv(300_000);
    expect(csv.length).toBeGreaterThan(4_000_000);
    const original = captureWorkers.analyze;
    const order: string[] = [];
    let health: PromiseLike<void> | undefined;
    // the health request leaves once the analysis has been handed to the pool, and must come back first
    const analyze = vi.spyOn(captureWorkers, 'analyze').mockImplementation((...args) => {
      health = eng.get('/api/health').then((res) => void order.push(`health ${res.status}`));
      return original(...args).then((result) => {
        order.push('analysis');
        return result;
      });
    });
    const pooled = vi.spyOn(Piscina.prototype, 'run');
    try {
      const res = await eng.upload('/api/captures/analyze', csv, 'long-edge.csv', 'text/csv').expect(200);
      await health;
      expect(res.body.points).toBe(300_000);
      expect(order).toEqual(['health 200', 'analysis']);
      // and the parse and analysis ran on the pool's thread, not between this thread's requests
      expect(pooled).toHaveBeenCalledWith(expect.objectContaining({ op: 'analyze' }));
    } finally {
      analyze.mockRestore();
      pooled.mockRestore();
    }
  });

  it('should give exactly what the same analysis gives in this thread', async () => {
    const csv = stepCsv(5000);
    const file = path.join(dir, 'edge.csv');
    writeFileSync(file, csv);
    const here = await analyzeCaptureFile(file);
    expect(here.ok).toBe(true);
    const res = await eng.upload('/api/captures/analyze', csv, 'edge.csv', 'text/csv').expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(here.ok && here.analysis)));
  });

  it('should keep one worker, warmed up before its first capture, and analyse on it exactly as before', async () => {
    const warmUps = () => readdirSync(tmpdir()).filter((name) => name.startsWith('falsetrace-warm-up-')).length;
    const before = warmUps();
    const warmUpMs = await captureWorkers.keepWarm();
    expect(warmUpMs).toBeGreaterThan(0);
    // the same worker answers again: a new one would have run (and timed) a warm-up of its own
    expect(await captureWorkers.keepWarm()).toBe(warmUpMs);
    expect(warmUps()).toBe(before);
    const csv = stepCsv(5000);
    const file = path.join(dir, 'warm-edge.csv');
    writeFileSync(file, csv);
    const here = await analyzeCaptureFile(file);
    const res = await eng.upload('/api/captures/analyze', csv, 'edge.csv', 'text/csv').expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(here.ok && here.analysis)));
    expect(await captureWorkers.keepWarm()).toBe(warmUpMs);
  });

  it('should run the warm-up through parse, analysis and plot store, and leave nothing behind', async () => {
    const before = readdirSync(tmpdir()).filter((name) => name.startsWith('falsetrace-warm-up-')).length;
    expect(await warmUpCaptureAnalysis(2000, 1)).toBeGreaterThan(0);
    expect(readdirSync(tmpdir()).filter((name) => name.startsWith('falsetrace-warm-up-')).length).toBe(before);
  });

  it('should refuse with a 503 and say so when the queue of captures is full', async () => {
    const run = vi.spyOn(Piscina.prototype, 'run').mockRejectedValueOnce(new Error('Task queue is at limit'));
    try {
      const res = await eng.upload('/api/captures/analyze', stepCsv(1000), 'edge.csv', 'text/csv').expect(503);
      expect(res.body.error).toMatch(/busy analysing .* other captures; try again/);
    } finally {
      run.mockRestore();
    }
  });
});
