import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createTestContext, type TestContext } from './helpers/test-context';

describe('serving the built client', () => {
  let ctx: TestContext;
  let app: ReturnType<typeof createApp>;
  beforeAll(async () => {
    ctx = await createTestContext();
    const dir = mkdtempSync(path.join(tmpdir(), 'ft-client-'));
    mkdirSync(path.join(dir, 'assets'));
    writeFileSync(path.join(dir, 'index.html'), '<!doctype html><div id="root"></div>');
    writeFileSync(path.join(dir, 'assets', 'cases-abc.js'), 'export const x = 1;');
    app = createApp({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config }, { clientDir: dir });
  });
  afterAll(() => {
    (app.locals.sessionStore as { close(): void }).close();
    return ctx.close();
  });

  it('should answer client addresses with the page and a script policy of its own origin', async () => {
    const page = await request(app).get('/cases/new').expect(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
    expect(page.headers['content-security-policy']).toMatch(/script-src 'self'/);
  });

  it('should serve a screen script, and 404 (not the page) for one from an older build', async () => {
    const js = await request(app).get('/assets/cases-abc.js').expect(200);
    expect(js.headers['content-type']).toMatch(/javascript/);
    const gone = await request(app).get('/assets/cases-old.js').expect(404);
    expect(gone.headers['content-type']).toMatch(/json/);
    expect(gone.body.error).toMatch(/reload the page/);
  });
});
