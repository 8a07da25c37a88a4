import { readdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { captureWorkers } from '../../server/captures/capture-pool';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

const MB = 1024 * 1024;
// PNG's signature (ISO/IEC 15948, 5.2), then filler: the limit is checked before any decoding
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const bigPicture = () => Buffer.concat([PNG_SIGNATURE, Buffer.alloc(11 * MB)]);

/** A 1 ns-sampled square wave with times precise enough to stay increasing. */
function squareCsv(samples: number): Buffer {
  const rows = ['time_s,voltage_v'];
  for (let i = 0; i < samples; i++) rows.push(`${(i * 1e-9).toExponential(6)},${Math.floor(i / 10_000) % 2 ? '3.300' : '0.000'}`);
  return Buffer.from(rows.join('\n'));
}

describe('the screenshot limit, while the upload streams', () => {
  let ctx: TestContext;
  let eng: Awaited<ReturnType<typeof signedIn>>;
  let caseId: number;
  beforeAll(async () => {
    ctx = await createTestContext();
    eng = await signedIn(ctx, 'engineer');
    caseId = (await eng.post('/api/cases', { title: 'Big pictures', summary: 'limit check' }).expect(201)).body.case.id;
  });
  afterAll(async () => {
    await captureWorkers.close();
    await ctx.close();
  });

  const incoming = () => readdirSync(path.join(ctx.config.dataDir, 'uploads', 'incoming'));

  it('should refuse a picture named and typed as one above 10 MB with 413 as it arrives, keeping nothing', async () => {
    const res = await eng.upload(`/api/cases/${caseId}/attachments`, bigPicture(), 'scope.png', 'image/png').expect(413);
    expect(res.body.error).toMatch(/Screenshots are limited to 10 MB; this image was refused while it was still arriving/);
    expect(incoming()).toHaveLength(0);
    expect((await eng.get(`/api/cases/${caseId}`).expect(200)).body.case.attachments).toEqual([]);
  });

  it('should know a picture by its first bytes under another name and type', async () => {
    const res = await eng.upload(`/api/cases/${caseId}/attachments`, bigPicture(), 'export.bin', 'application/octet-stream').expect(413);
    expect(res.body.error).toMatch(/refused while it was still arriving/);
    const analyzed = await eng.upload('/api/captures/analyze', bigPicture(), 'scope.jpg', 'image/jpeg').expect(413);
    expect(analyzed.body.error).toMatch(/Screenshots are limited to 10 MB/);
    expect(incoming()).toHaveLength(0);
  });

  it('should still take a CSV capture above 10 MB', async () => {
    const csv = squareCsv(650_000);
    expect(csv.length).toBeGreaterThan(11 * MB);
    const res = await eng.upload('/api/captures/analyze', csv, 'long.csv', 'text/csv').expect(200);
    expect(res.body.points).toBe(650_000);
    expect(incoming()).toHaveLength(0);
  });
});
