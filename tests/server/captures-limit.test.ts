import { readdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { stepCsv } from './helpers/fixtures';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

// A small configured limit stands in for the default (2 GiB), which a test cannot upload.
const LIMIT_BYTES = 64 * 1024;

describe('the capture upload limit', () => {
  let ctx: TestContext;
  let eng: Awaited<ReturnType<typeof signedIn>>;
  let caseId: number;
  beforeAll(async () => {
    ctx = await createTestContext({ captureLimitBytes: LIMIT_BYTES });
    eng = await signedIn(ctx, 'engineer');
    caseId = (await eng.post('/api/cases', { title: 'A long capture', summary: 'limit check' }).expect(201)).body.case.id;
  });
  afterAll(() => ctx.close());

  const incoming = () => readdirSync(path.join(ctx.config.dataDir, 'uploads', 'incoming'));

  it('should analyse and attach a capture just under the limit', async () => {
    const csv = stepCsv(3000);
    expect(csv.length).toBeLessThan(LIMIT_BYTES);
    await eng.upload('/api/captures/analyze', csv, 'edge.csv', 'text/csv').expect(200);
    await eng.upload(`/api/cases/${caseId}/attachments`, csv, 'edge.csv', 'text/csv').expect(201);
  });

  it('should refuse a capture over the limit with 413 and say what the limit is, keeping nothing', async () => {
    const csv = stepCsv(5000);
    expect(csv.length).toBeGreaterThan(LIMIT_BYTES);
    const analyzed = await eng.upload('/api/captures/analyze', csv, 'edge.csv', 'text/csv').expect(413);
    expect(analyzed.body.error).toMatch(/larger than the 64 KB upload limit/);
    const attached = await eng.upload(`/api/cases/${caseId}/attachments`, csv, 'edge.csv', 'text/csv').expect(413);
    expect(attached.body.error).toMatch(/64 KB/);
    expect(incoming()).toHaveLength(0);
  });

  it('should read the limit from CAPTURE_LIMIT_BYTES, default to at least 1 GB, and refuse nonsense', () => {
    const dataDir = ctx.config.dataDir;
    expect(loadConfig({ DATA_DIR: dataDir }).captureLimitBytes).toBeGreaterThanOrEqual(1e9);
    expect(loadConfig({ DATA_DIR: dataDir, CAPTURE_LIMIT_BYTES: '5000000000' }).captureLimitBytes).toBe(5e9);
    expect(() => loadConfig({ DATA_DIR: dataDir, CAPTURE_LIMIT_BYTES: '1.5GB' })).toThrow(/CAPTURE_LIMIT_BYTES/);
    // and the capture worker is kept warm unless CAPTURE_WARM_UP turns it off
    expect(loadConfig({ DATA_DIR: dataDir }).captureWarmUp).toBe(true);
    expect(loadConfig({ DATA_DIR: dataDir, CAPTURE_WARM_UP: '0' }).captureWarmUp).toBe(false);
  });
});
