import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createTestContext } from './helpers/test-context';

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
});
