import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startRealServer, type RunningServer } from '../e2e/helpers/server';
import { createPostgresDatabase } from '../helpers/postgres';
import { pngBytes } from './helpers/fixtures';
import { DEMO_PASSWORD, demoEmail, ON_POSTGRES } from './helpers/test-context';

/**
 * Two real server processes (tsx server/index.ts), as two instances behind a load balancer: one
 * PostgreSQL database, one UPLOADS_DIR, one SESSION_SECRET, a DATA_DIR each. PostgreSQL only:
 * that is the topology the README describes for several instances; two processes on one SQLite
 * file would share DATA_DIR (and its search snapshot), which is not a supported set-up. The
 * in-process pair in two-instances.test.ts covers the SQLite file.
 */

const FOLLOW_BOUND_MS = 2000;

async function ready(server: RunningServer) {
  // the first instance seeds the demo and both build their index before they are ready
  const until = Date.now() + 120_000;
  for (;;) {
    if ((await fetch(`${server.baseUrl}/api/ready`)).ok) return;
    if (Date.now() > until) throw new Error(`instance at ${server.baseUrl} not ready in 120 s: ${server.log().slice(-2000)}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** A browser's cookies, sent to whichever instance it is pointed at. */
function browser() {
  const jar = new Map<string, string>();
  let csrf = '';
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const at = pair.indexOf('=');
      jar.set(pair.slice(0, at), pair.slice(at + 1));
    }
    if (jar.has('ft.csrf')) csrf = decodeURIComponent(jar.get('ft.csrf')!);
    return res;
  };
  const headers = () => ({ cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '), 'x-csrf-token': csrf });
  return {
    async start(on: RunningServer) {
      const res = keep(await fetch(`${on.baseUrl}/api/auth/csrf`, { headers: headers() }));
      csrf = ((await res.json()) as { csrfToken: string }).csrfToken;
    },
    get: async (on: RunningServer, url: string) => keep(await fetch(`${on.baseUrl}${url}`, { headers: headers() })),
    post: async (on: RunningServer, url: string, body: object) =>
      keep(await fetch(`${on.baseUrl}${url}`, { method: 'POST', headers: { ...headers(), 'content-type': 'application/json' }, body: JSON.stringify(body) })),
    upload: async (on: RunningServer, url: string, bytes: Buffer, filename: string, type: string) => {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(bytes)], { type }), filename);
      return keep(await fetch(`${on.baseUrl}${url}`, { method: 'POST', headers: headers(), body: form }));
    },
  };
}

describe.skipIf(!ON_POSTGRES)('two server processes on one PostgreSQL database and one UPLOADS_DIR', () => {
  let a: RunningServer;
  let b: RunningServer;
  let uploads: string;
  let drop: (() => Promise<void>) | undefined;
  const engineer = browser();

  beforeAll(async () => {
    const created = await createPostgresDatabase(inject('postgresAdminUrl'));
    drop = created.drop;
    uploads = mkdtempSync(path.join(tmpdir(), 'falsetrace-shared-uploads-'));
    const env = { DATABASE_URL: created.url, UPLOADS_DIR: uploads, SESSION_SECRET: 'two-processes-share-this-secret-value', DEMO_PASSWORD, LOG_LEVEL: 'warn' };
    // one after the other, as a rolling start would: the first seeds the empty database
    a = await startRealServer(env);
    await ready(a);
    b = await startRealServer(env);
    await ready(b);
  }, 300_000);
  afterAll(async () => {
    await a?.stop();
    await b?.stop();
    await drop?.();
    if (uploads) rmSync(uploads, { recursive: true, force: true });
  });

  it('should keep a session made on one process valid on the other', async () => {
    await engineer.start(a);
    expect((await engineer.post(a, '/api/auth/login', { email: demoEmail('engineer'), password: DEMO_PASSWORD })).status).toBe(200);
    const me = (await (await engineer.get(b, '/api/auth/me')).json()) as { user: { email: string } | null };
    expect(me.user?.email).toBe(demoEmail('engineer'));
  });

  it(`should find on process B, within ${FOLLOW_BOUND_MS / 1000} s, a case created through process A`, async () => {
    const created = await engineer.post(a, '/api/cases', { title: 'Dunnartprobe ringing after the ground spring', summary: 'Created on process A' });
    expect(created.status).toBe(201);
    const id = ((await created.json()) as { case: { id: number } }).case.id;
    // both indexes were ready before the write; the bound counts from A's answer, polled
    const deadline = Date.now() + FOLLOW_BOUND_MS;
    let found: number[] = [];
    while (Date.now() <= deadline) {
      const res = await engineer.get(b, '/api/search?q=dunnartprobe');
      expect(res.status).toBe(200);
      found = ((await res.json()) as { results: { id: number }[] }).results.map((r) => r.id);
      if (found.length) break;
      await new Promise((r) => setTimeout(r, 50));
    }
    expect(found, `process B did not find the case within ${FOLLOW_BOUND_MS} ms of its creation on A`).toEqual([id]);
  });

  it('should download through process B an attachment uploaded through process A', async () => {
    const id = ((await (await engineer.post(a, '/api/cases', { title: 'Shared upload between processes', summary: 'on A' })).json()) as { case: { id: number } }).case.id;
    const png = await pngBytes(40, 30);
    const up = await engineer.upload(a, `/api/cases/${id}/attachments`, png, 'tip.png', 'image/png');
    expect(up.status).toBe(201);
    const attachment = ((await up.json()) as { attachment: { id: number } }).attachment;
    const file = await engineer.get(b, `/api/attachments/${attachment.id}/file`);
    expect(file.status).toBe(200);
    expect(Buffer.compare(Buffer.from(await file.arrayBuffer()), png)).toBe(0);
  });
});
