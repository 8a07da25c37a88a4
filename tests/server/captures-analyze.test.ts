import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { stepCsv } from './helpers/fixtures';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

const CONTRACT_FIELDS = ['points', 'sampleIntervalS', 'baseV', 'topV', 'amplitudeV', 'riseTimeS', 'fallTimeS', 'overshootPct', 'ringingFrequencyHz', 'periodS'];

describe('POST /api/captures/analyze', () => {
  let ctx: TestContext;
  let eng: Awaited<ReturnType<typeof signedIn>>;
  beforeAll(async () => {
    ctx = await createTestContext();
    eng = await signedIn(ctx, 'engineer');
  });
  afterAll(() => ctx.close());

  it('should measure a step capture with every contract field', async () => {
    const res = await eng.upload('/api/captures/analyze', stepCsv(), 'edge.csv', 'text/csv').expect(200);
    for (const f of CONTRACT_FIELDS) expect(res.body).toHaveProperty(f);
    expect(res.body.points).toBe(1000);
    // source: the fixture's step is 0 V then 1 V (invented test data, levels by construction)
    expect(res.body.amplitudeV).toBeCloseTo(1, 6);
    expect(res.body.periodS).toBeNull();
  });

  it('should need sign-in', async () => {
    const agent = request.agent(ctx.app);
    const token = (await agent.get('/api/auth/csrf')).body.csrfToken;
    await agent.post('/api/captures/analyze').set('x-csrf-token', token).attach('file', stepCsv(), 'edge.csv').expect(401);
  });

  it('should say what is wrong, with the line, for a broken row', async () => {
    const res = await eng.upload('/api/captures/analyze', Buffer.from('time_s,voltage_v\n0,0\n1e-9,abc\n2e-9,1\n'), 'bad.csv').expect(400);
    expect(res.body.error).toMatch(/line 3/);
  });

  it('should answer random bytes and broken CSV with 400 and a message, never 500', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(
          fc.uint8Array({ minLength: 1, maxLength: 2000 }).map((a) => Buffer.from(a)),
          fc
            .array(fc.tuple(fc.oneof(fc.double(), fc.string()), fc.oneof(fc.double(), fc.string())), { maxLength: 40 })
            .map((rows) => Buffer.from(rows.map(([a, b]) => `${a},${b}`).join('\n'))),
        ),
        async (bytes) => {
          const res = await eng.upload('/api/captures/analyze', bytes, 'fuzz.csv', 'text/csv');
          expect([200, 400]).toContain(res.status);
          if (res.status === 400) expect(typeof res.body.error).toBe('string');
        },
      ),
      { numRuns: 60, seed: 181 },
    );
  });
});
