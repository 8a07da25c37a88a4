import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createTestContext, DEMO_PASSWORD, demoEmail } from './helpers/test-context';

describe('compression and caching', () => {
  const clientDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-client-'));
  afterAll(() => rmSync(clientDir, { recursive: true, force: true }));

  it('should gzip text answers and cache hashed assets for a year', async () => {
    const ctx = await createTestContext();
    mkdirSync(path.join(clientDir, 'assets'));
    writeFileSync(path.join(clientDir, 'index.html'), '<!doctype html><title>x</title>');
    writeFileSync(path.join(clientDir, 'assets', 'index-abc123.js'), `console.log(${JSON.stringify('x'.repeat(5000))});`);
    const app = createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config, search: ctx.search }, { clientDir });
    const js = await request(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip');
    expect(js.status).toBe(200);
    expect(js.headers['content-encoding']).toBe('gzip');
    expect(js.headers['cache-control']).toMatch(/max-age=31536000/);
    expect(js.headers['cache-control']).toMatch(/immutable/);
    const page = await request(app).get('/cases').set('Accept-Encoding', 'gzip');
    expect(page.headers['cache-control']).toBe('no-cache');
    await ctx.close();
  });

  it('should gzip every kind of text answer: page, script, style, image as SVG and API JSON', async () => {
    const ctx = await createTestContext();
    const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-client-kinds-'));
    mkdirSync(path.join(dir, 'assets'));
    const filler = 'probe '.repeat(400);
    writeFileSync(path.join(dir, 'index.html'), `<!doctype html><title>x</title><p>${filler}</p>`);
    writeFileSync(path.join(dir, 'assets', 'index-abc123.js'), `console.log(${JSON.stringify(filler)});`);
    writeFileSync(path.join(dir, 'assets', 'index-abc123.css'), `body::after { content: "${filler}"; }`);
    writeFileSync(path.join(dir, 'favicon.svg'), `<svg xmlns="http://www.w3.org/2000/svg"><desc>${filler}</desc></svg>`);
    const app = createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config, search: ctx.search }, { clientDir: dir });
    for (const [url, type] of [['/sign-in', /html/], ['/assets/index-abc123.js', /javascript/], ['/assets/index-abc123.css', /css/], ['/favicon.svg', /svg/]] as const) {
      const res = await request(app).get(url).set('Accept-Encoding', 'gzip');
      expect(res.status, url).toBe(200);
      expect(res.headers['content-type'], url).toMatch(type);
      expect(res.headers['content-encoding'], url).toBe('gzip');
    }
    const agent = request.agent(app);
    const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string;
    const login = await agent.post('/api/auth/login').set('x-csrf-token', csrf).send({ email: demoEmail('engineer'), password: DEMO_PASSWORD }).expect(200);
    const renewed = ([] as string[]).concat(login.headers['set-cookie'] ?? []).map((c) => c.match(/^ft\.csrf=([^;]+)/)?.[1]).find(Boolean);
    const created = await agent.post('/api/cases').set('x-csrf-token', decodeURIComponent(renewed ?? csrf)).send({ title: 'Long write-up', summary: 'Reads a tenth of the rail', narrative: filler }).expect(201);
    // the case page's JSON is well over the middleware's 1 KB threshold (smaller answers go as they are)
    const res = await agent.get(`/api/cases/${created.body.case.id}`).set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.headers['content-encoding']).toBe('gzip');
    rmSync(dir, { recursive: true, force: true });
    await ctx.close();
  });
});
