import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import type { AppDeps } from '../../server/deps';
import { DEMO_PASSWORD, createTestContext, demoEmail, signedIn, type TestContext } from './helpers/test-context';

const TOKEN = 'metrics-token-for-the-test-0123456789';

describe('readiness and liveness', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  const appWith = (deps: Partial<AppDeps>) => createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config, search: ctx.search, ...deps });

  it('should answer ready when the database answers and the index does not say otherwise', async () => {
    const res = await request(ctx.app).get('/api/ready').expect(200);
    expect(res.body).toEqual({ ready: true, database: 'ok', search: 'ready' });
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it('should follow the index when it reports readiness', async () => {
    let loaded = false;
    const search = Object.assign(Object.create(ctx.search), { isReady: () => loaded }) as TestContext['search'];
    const app = appWith({ search });
    expect((await request(app).get('/api/ready').expect(503)).body).toEqual({ ready: false, database: 'ok', search: 'not ready' });
    loaded = true;
    expect((await request(app).get('/api/ready').expect(200)).body).toEqual({ ready: true, database: 'ok', search: 'ready' });
  });

  it('should say the database is not ready when it does not answer, without its error text', async () => {
    const { createTestContext: create } = await import('./helpers/test-context');
    const other = await create();
    const app = createApp({ db: other.db, mailer: other.mailer, mail: other.mail, config: other.config, search: other.search });
    await other.close(); // destroys the database
    const res = await request(app).get('/api/ready').expect(503);
    expect(res.body).toEqual({ ready: false, database: 'failing', search: 'ready' });
    // liveness does not look at the database
    await request(app).get('/api/health').expect(200, { ok: true });
  });
});

describe('Prometheus metrics at /metrics', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should be off (404) without METRICS_TOKEN, even for an admin', async () => {
    const admin = await signedIn(ctx, 'admin');
    const res = await admin.get('/metrics').expect(404);
    expect(res.body.error).toMatch(/METRICS_TOKEN/);
    await request(ctx.app).get('/metrics').set('Authorization', `Bearer ${TOKEN}`).expect(404);
  });

  it('should refuse a missing or wrong bearer token with 401, a session is not enough', async () => {
    const app = createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: { ...ctx.config, metricsToken: TOKEN }, search: ctx.search });
    await request(app).get('/metrics').expect(401);
    await request(app).get('/metrics').set('Authorization', `Bearer ${TOKEN}x`).expect(401);
    await request(app).get('/metrics').set('Authorization', TOKEN).expect(401);
    await request(app).get('/metrics').set('Authorization', `Basic ${Buffer.from(`x:${TOKEN}`).toString('base64')}`).expect(401);
  });

  it('should give latency by route pattern, method and status class, the mail queue depth, the index lag and process metrics', async () => {
    let lag: number | undefined = 1.5;
    const search = Object.assign(Object.create(ctx.search), { lagSeconds: () => lag }) as TestContext['search'];
    const app = createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: { ...ctx.config, metricsToken: TOKEN }, search });
    await ctx.mail.enqueue({ to: 'waiting@falsetrace.test', subject: 'queued', text: 'queued', html: '<p>queued</p>' });
    await ctx.mail.enqueue({ to: 'waiting@falsetrace.test', subject: 'queued', text: 'queued', html: '<p>queued</p>' });
    const agent = request.agent(app);
    const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string;
    await agent.post('/api/auth/login').set('x-csrf-token', csrf).send({ email: demoEmail('engineer'), password: DEMO_PASSWORD }).expect(200);
    await agent.get('/api/cases/123456').expect(404);
    await agent.get('/api/cases/456789').expect(404);
    await request(app).get('/api/health').expect(200);

    const res = await request(app).get('/metrics').set('Authorization', `Bearer ${TOKEN}`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/plain/);
    const text = res.text;
    // two different case ids, one series
    expect(text).toMatch(/falsetrace_http_request_duration_seconds_count\{route="\/api\/cases\/:id",method="GET",status_class="4xx"\} 2/);
    expect(text).toMatch(/falsetrace_http_request_duration_seconds_count\{route="\/api\/health",method="GET",status_class="2xx"\} 1/);
    expect(text).not.toMatch(/\/api\/cases\/123456|\/api\/cases\/456789/);
    expect(text).toMatch(/falsetrace_mail_queue_pending 2/);
    expect(text).toMatch(/falsetrace_search_index_lag_seconds\{index="cases"\} 1.5/);
    expect(text).toMatch(/process_cpu_user_seconds_total/);
    expect(text).toMatch(/nodejs_heap_size_used_bytes/);

    lag = undefined;
    const without = await request(app).get('/metrics').set('Authorization', `Bearer ${TOKEN}`).expect(200);
    expect(without.text).not.toMatch(/^falsetrace_search_index_lag_seconds\{/m);
    await ctx.mail.flush();
  });

  it('should leave the lag out when the index does not report one', async () => {
    // the same index, seen through an object that does not report its lag
    const silent = Object.assign(Object.create(ctx.search!), { lagSeconds: undefined });
    const app = createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: { ...ctx.config, metricsToken: TOKEN }, search: silent });
    const res = await request(app).get('/metrics').set('Authorization', `Bearer ${TOKEN}`).expect(200);
    expect(res.text).toMatch(/# TYPE falsetrace_search_index_lag_seconds gauge/);
    expect(res.text).not.toMatch(/^falsetrace_search_index_lag_seconds\{/m);
  });

  it('should report the index lag the search index gives', async () => {
    const app = createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: { ...ctx.config, metricsToken: TOKEN }, search: ctx.search });
    const res = await request(app).get('/metrics').set('Authorization', `Bearer ${TOKEN}`).expect(200);
    expect(res.text).toMatch(/^falsetrace_search_index_lag_seconds\{index="cases"\} \d/m);
  });
});

describe('operations settings', () => {
  it('should refuse a short METRICS_TOKEN and leave metrics off without one', async () => {
    const { mkdtempSync, rmSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const path = await import('node:path');
    const { loadConfig } = await import('../../server/config');
    const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-config-'));
    try {
      expect(() => loadConfig({ DATA_DIR: dataDir, METRICS_TOKEN: 'short' })).toThrow(/METRICS_TOKEN must be at least 16 characters/);
      expect(loadConfig({ DATA_DIR: dataDir, METRICS_TOKEN: ` ${TOKEN} ` }).metricsToken).toBe(TOKEN);
      expect(loadConfig({ DATA_DIR: dataDir, METRICS_TOKEN: '' }).metricsToken).toBeUndefined();
    } finally {
      rmSync(dataDir, { recursive: true, force: true });
    }
  });

  it('should take LOG_LEVEL, refuse an unknown one, and stay quiet under vitest unless asked', async () => {
    const { logLevelFrom } = await import('../../server/logger');
    expect(logLevelFrom({ LOG_LEVEL: 'debug' })).toBe('debug');
    expect(logLevelFrom({ LOG_LEVEL: 'WARN' })).toBe('warn');
    expect(() => logLevelFrom({ LOG_LEVEL: 'loud' })).toThrow(/LOG_LEVEL must be one of/);
    expect(logLevelFrom({ VITEST: 'true' })).toBe('silent');
    expect(logLevelFrom({ VITEST: 'true' }, false)).toBe('info');
    expect(logLevelFrom({})).toBe('info');
  });
});
