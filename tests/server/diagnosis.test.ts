import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUSES } from '../../shared/schemas/diagnosis';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

describe('POST /api/diagnosis', () => {
  let ctx: TestContext;
  let eng: Awaited<ReturnType<typeof signedIn>>;
  beforeAll(async () => {
    ctx = await createTestContext();
    eng = await signedIn(ctx, 'engineer');
  });
  afterAll(() => ctx.close());

  it('should need sign-in', async () => {
    const agent = request.agent(ctx.app);
    const token = (await agent.get('/api/auth/csrf')).body.csrfToken;
    await agent.post('/api/diagnosis').set('x-csrf-token', token).send({}).expect(401);
  });

  it('should put attenuation mismatch on top for a 10x probe read at 1x, with the predicted amplitude', async () => {
    const res = await eng
      .post('/api/diagnosis', {
        probe: { attenuation: 10 },
        scope: { attenuationSetting: 1, inputResistanceOhm: 1e6 },
        signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e3 },
        observed: { amplitudeV: 0.33 },
      })
      .expect(200);
    const top = res.body.hypotheses[0];
    expect(top.cause).toBe('attenuation-mismatch');
    // shown = true × setting ÷ actual (DESIGN.md; common practice)
    expect(top.predicted.amplitudeV).toBeCloseTo(0.33, 6);
    expect(top.likelihood).toBeGreaterThan(0.5);
    expect(typeof top.explanation).toBe('string');
    expect(typeof top.fix).toBe('string');
    expect(res.body.tags).toContain('attenuation-mismatch');
    const sum = res.body.hypotheses.reduce((s: number, h: { likelihood: number }) => s + h.likelihood, 0);
    expect(sum).toBeCloseTo(1, 6);
    for (const h of res.body.hypotheses) expect([...CAUSES, 'faithful']).toContain(h.cause);
    expect(res.body.verdict).toBe('measurement-error');
    expect(top.fits).toBe(true);
    expect(top.causes[0]).toBe(top.cause);
  });

  it('should accept an empty body (everything optional)', async () => {
    const res = await eng.post('/api/diagnosis', {}).expect(200);
    expect(Array.isArray(res.body.hypotheses)).toBe(true);
    expect(Array.isArray(res.body.tags)).toBe(true);
  });

  it('should refuse NaN-like, negative and absurd values with the field path', async () => {
    const bad = await eng
      .post('/api/diagnosis', { probe: { tipCapacitanceF: -1e-12, attenuation: 'ten' }, scope: { bandwidthHz: 1e15 }, observed: { overshootPct: 5000 } })
      .expect(400);
    expect(bad.body.error).toBeTruthy();
    expect(bad.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(
      ['observed.overshootPct', 'probe.attenuation', 'probe.tipCapacitanceF', 'scope.bandwidthHz'].sort(),
    );
    const nan = await eng.agent
      .post('/api/diagnosis')
      .set('x-csrf-token', eng.token)
      .set('Content-Type', 'application/json')
      .send('{"probe":{"attenuation":NaN}}')
      .expect(400);
    expect(nan.body.error).toMatch(/not valid JSON/);
  });
});
