import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

describe('POST /api/diagnosis with the acquisition, reference and source fields', () => {
  let ctx: TestContext;
  let eng: Awaited<ReturnType<typeof signedIn>>;
  beforeAll(async () => {
    ctx = await createTestContext();
    eng = await signedIn(ctx, 'engineer');
  });
  afterAll(() => ctx.close());

  it('should return a hazard for a passive probe grounded on a node away from earth', async () => {
    const res = await eng
      .post('/api/diagnosis', { probe: { kind: 'passive', groundKind: 'clip-lead' }, circuit: { referenceV: 325 }, signal: { expectedAmplitudeV: 5, frequencyHz: 50e3 } })
      .expect(200);
    const risk = res.body.risks.find((r: { id: string }) => r.id === 'ground-clip-away-from-earth');
    expect(risk?.level).toBe('hazard');
    expect(risk?.message).toMatch(/differential or isolated probe/);
    const cm = res.body.hypotheses.find((h: { cause: string }) => h.cause === 'common-mode');
    expect(cm.explanation).toMatch(/not a measurement/);
  });

  it('should put generator load first when a 50 Ω setting drives a 1 MΩ input, with the doubled amplitude', async () => {
    const res = await eng
      .post('/api/diagnosis', {
        probe: { attenuation: 1 },
        scope: { attenuationSetting: 1, inputResistanceOhm: 1e6 },
        circuit: { loadResistanceOhm: 1e6 },
        signal: { expectedAmplitudeV: 1, generatorLoad: '50-ohm', frequencyHz: 1e3, kind: 'sine' },
        observed: { amplitudeV: 2 },
      })
      .expect(200);
    expect(res.body.hypotheses[0].cause).toBe('generator-load');
    // voltage divider: 1 V × 2 × 1 MΩ / (1 MΩ + 50 Ω)
    expect(res.body.hypotheses[0].predicted.amplitudeV).toBeCloseTo(1.9999, 4);
    expect(res.body.tags).toContain('generator-load-setting');
  });

  it('should reject a bad coupling with a message naming the field', async () => {
    const res = await eng.post('/api/diagnosis', { scope: { coupling: 'dcx' } }).expect(400);
    expect(JSON.stringify(res.body.issues)).toMatch(/Coupling must be dc or ac/);
  });
});
