import { createReadStream, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleUniformly, secondOrderStep, stepWaveform } from '../../shared/capture/synthetic';
import { createPlotStores } from '../../server/captures/plot-stores';
import { readCaptureStream } from '../../server/captures/read-capture-stream';
import { pngBytes, stepCsv } from './helpers/fixtures';
import { client, createTestContext, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

const NATURAL_HZ = 50e6;
const ZETA = 0.2;
const SAMPLE_S = 0.5e-9;
const POINTS = 20_000;

/** An underdamped second-order step from 0 V to 2 V at 1 µs, sampled every 0.5 ns for 10 µs. */
function ringingCsv(): { csv: Buffer; volts: Float64Array; timesS: Float64Array } {
  const { timesS, volts } = sampleUniformly(stepWaveform(secondOrderStep(NATURAL_HZ, ZETA), 0, 2, 1e-6), { sampleIntervalS: SAMPLE_S, points: POINTS });
  const rows = ['time (s),voltage (V)'];
  for (let i = 0; i < POINTS; i++) {
    const [t, v] = [timesS[i].toExponential(9), volts[i].toFixed(6)];
    rows.push(`${t},${v}`);
    // compare with what the file says, not with the unrounded waveform
    [timesS[i], volts[i]] = [Number(t), Number(v)];
  }
  return { csv: Buffer.from(rows.join('\n')), volts, timesS };
}

const min = (values: ArrayLike<number>) => Math.min(...Array.from(values));
const max = (values: ArrayLike<number>) => Math.max(...Array.from(values));

describe('capture traces for plotting', () => {
  let ctx: TestContext;
  let author: Client;
  let other: Client;
  let mod: Client;
  let captureId: number;
  let screenshotId: number;
  const capture = ringingCsv();

  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
    mod = await signedIn(ctx, 'moderator');
    const admin = await signedIn(ctx, 'admin');
    await admin.post('/api/admin/people/invitations', { email: 'trace.reader@falsetrace.test', role: 'engineer' }).expect(201);
    await ctx.mail.flush();
    const mail = (await ctx.db.selectFrom('outbox_messages').selectAll().execute()).find((m) => m.to_addr.includes('trace.reader'))!;
    const token = mail.text.match(/accept-invitation\/(\S+)/)![1];
    other = await client(ctx);
    await other.post('/api/auth/invitations/accept', { token, name: 'Trace Reader', password: 'trace-reader-pw' }).expect(201);

    const caseId = (await author.post('/api/cases', { title: 'Ringing on the clock edge', summary: 'a draft with a capture' }).expect(201)).body.case.id;
    captureId = (await author.upload(`/api/cases/${caseId}/attachments`, capture.csv, 'ring.csv', 'text/csv').expect(201)).body.attachment.id;
    screenshotId = (await author.upload(`/api/cases/${caseId}/attachments`, await pngBytes(80, 60), 'shot.png', 'image/png').expect(201)).body.attachment.id;
  });
  afterAll(() => ctx.close());

  it('should decimate the whole capture to at most two samples per column and keep its extremes', async () => {
    const { body } = await author.get(`/api/attachments/${captureId}/trace?columns=300`).expect(200);
    expect(body.totalPoints).toBe(POINTS);
    expect(body.windowPoints).toBe(POINTS);
    expect(body.timesS.length).toBe(body.volts.length);
    expect(body.timesS.length).toBeLessThanOrEqual(600);
    expect(body.timesS.length).toBeGreaterThan(300);
    expect(body.fromS).toBe(0);
    expect(body.toS).toBeCloseTo((POINTS - 1) * SAMPLE_S, 15);
    // min/max decimation: no excursion is lost however many samples share a column
    expect(min(body.volts)).toBe(min(capture.volts));
    expect(max(body.volts)).toBe(max(capture.volts));
    // the kept peak is the textbook one: 1 + exp(−πζ/√(1−ζ²)) of the 2 V step
    // source: standard second-order step response (peak overshoot formula)
    const peakV = 2 * (1 + Math.exp((-Math.PI * ZETA) / Math.sqrt(1 - ZETA * ZETA)));
    expect(max(body.volts)).toBeCloseTo(peakV, 2);
    for (let i = 1; i < body.timesS.length; i++) expect(body.timesS[i]).toBeGreaterThan(body.timesS[i - 1]);
  });

  it('should serve a zoomed window at full resolution, with one sample either side of it', async () => {
    const fromS = 1.00025e-6; // between samples, so rounding in the CSV cannot move a sample across
    const toS = 1.05025e-6;
    const { body } = await author.get(`/api/attachments/${captureId}/trace?columns=1200&fromS=${fromS}&toS=${toS}`).expect(200);
    expect(body.fromS).toBe(fromS);
    expect(body.toS).toBe(toS);
    const inside = Array.from(capture.timesS).filter((t) => t >= fromS && t <= toS).length;
    expect(body.windowPoints).toBe(inside);
    expect(body.timesS.length).toBe(inside + 2);
    expect(body.timesS[0]).toBeLessThan(fromS);
    expect(body.timesS.at(-1)).toBeGreaterThan(toS);
    const first = Array.from(capture.timesS).findIndex((t) => t >= fromS) - 1;
    expect(body.volts.slice(0, 5)).toEqual(Array.from(capture.volts.subarray(first, first + 5)));
  });

  it('should clip a window that runs past the capture and decimate a wide one', async () => {
    const { body } = await author.get(`/api/attachments/${captureId}/trace?columns=50&fromS=-1&toS=5e-6`).expect(200);
    expect(body.fromS).toBe(0);
    expect(body.toS).toBe(5e-6);
    expect(body.timesS.length).toBeLessThanOrEqual(100);
    const again = await author.get(`/api/attachments/${captureId}/trace?columns=50&fromS=-1&toS=5e-6`).expect(200);
    expect(again.body).toEqual(body);
  });

  it('should refuse bad parameters with 400 and a message', async () => {
    for (const query of ['columns=0', 'columns=abc', 'columns=2.5', 'columns=100000', 'fromS=2e-6&toS=1e-6', 'fromS=x', 'toS=Infinity', 'fromS=1&toS=2']) {
      const res = await author.get(`/api/attachments/${captureId}/trace?${query}`).expect(400);
      expect(res.body.error, query).toMatch(/trace query|outside the capture/);
    }
    await author.get('/api/attachments/abc/trace').expect(400);
  });

  it('should show a trace only to those who may see the case', async () => {
    await author.get(`/api/attachments/${captureId}/trace`).expect(200);
    await mod.get(`/api/attachments/${captureId}/trace`).expect(200);
    expect((await other.get(`/api/attachments/${captureId}/trace`).expect(404)).body.error).toBe('No such case');
    await request(ctx.app).get(`/api/attachments/${captureId}/trace`).expect(401);
    await author.get('/api/attachments/999999/trace').expect(404);
    expect((await author.get(`/api/attachments/${screenshotId}/trace`).expect(404)).body.error).toMatch(/not a waveform capture/);
  });
});

describe('the compact plot samples', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-plots-'));
  const files = ['a.csv', 'b.csv'].map((name) => {
    const file = path.join(dir, name);
    writeFileSync(file, stepCsv(1000));
    return file;
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("should build a capture's store once, sharing the build between concurrent requests", async () => {
    const plots = createPlotStores();
    const [first, second] = await Promise.all([plots.open(files[0]), plots.open(files[0])]);
    expect(first.ok && second.ok).toBe(true);
    expect(plots.stats()).toEqual({ builds: 1, building: 0 });
    const again = await plots.open(files[0]);
    expect(plots.stats().builds).toBe(1);
    for (const opened of [first, second, again]) if (opened.ok) opened.store.close();
  });

  it('should keep the values the CSV holds, exactly, in 4 bytes a sample', async () => {
    const plots = createPlotStores();
    const opened = await plots.open(files[1]);
    const parsed = await readCaptureStream(createReadStream(files[1]));
    expect(opened.ok && parsed.ok).toBe(true);
    if (!opened.ok || !parsed.ok) return;
    try {
      const volts = opened.store.channel(1);
      expect(volts.length).toBe(parsed.samples.volts.length);
      for (let i = 0; i < volts.length; i++) expect(volts.get(i)).toBe(parsed.samples.volts[i]);
      for (let i = 0; i < volts.length; i++) expect(opened.store.timesS.get(i)).toBeCloseTo(parsed.samples.timesS[i], 15);
      expect(statSync(path.join(`${files[1]}.plot`, 'ch1.i32')).size).toBe(4 * volts.length);
    } finally {
      opened.store.close();
    }
    expect((await plots.open(path.join(dir, 'nope.csv'))).ok).toBe(false);
  });
});
