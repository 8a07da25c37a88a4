import compression from 'compression';
import express from 'express';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { constants, gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GZIP_THRESHOLD_BYTES, gzipWholeAnswers } from '../../server/middleware/gzip-whole';

/** Raw bytes and headers, undecoded (fetch and supertest unzip on their own). */
function get(port: number, path: string, headers: Record<string, string>, method = 'GET') {
  return new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
    const req = http.request({ port, path, headers, method }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body: Buffer.concat(chunks) }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('gzipping whole API answers', () => {
  const rows = Array.from({ length: 40 }, (_, i) => ({ id: i, title: `Ground lead loop rang at 60 MHz, case ${i}` }));
  let server: http.Server;
  let port: number;

  beforeAll(async () => {
    const app = express();
    app.use(compression({ level: constants.Z_BEST_SPEED }));
    app.use('/api', gzipWholeAnswers(constants.Z_BEST_SPEED));
    app.get('/api/big', (_req, res) => void res.json({ rows }));
    app.get('/api/small', (_req, res) => void res.json({ ok: true }));
    app.get('/api/kept', (_req, res) => void res.set('Cache-Control', 'no-transform').json({ rows }));
    app.get('/api/pieces', (_req, res) => {
      res.type('text/csv');
      for (const r of rows) res.write(`${r.id},${r.title}\n`);
      res.end();
    });
    server = app.listen(0);
    await new Promise((r) => server.once('listening', r));
    port = (server.address() as AddressInfo).port;
  });
  afterAll(() => new Promise((r) => server.close(r)));

  it('should gzip a JSON answer sent whole, with its gzipped length, and unzip to the same JSON', async () => {
    const res = await get(port, '/api/big', { 'accept-encoding': 'gzip, deflate, br' });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers.vary).toMatch(/accept-encoding/i);
    expect(Number(res.headers['content-length'])).toBe(res.body.length);
    expect(JSON.parse(gunzipSync(res.body).toString('utf8'))).toEqual({ rows });
    // without Accept-Encoding the same answer goes plain
    const plain = await get(port, '/api/big', {});
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(JSON.parse(plain.body.toString('utf8'))).toEqual({ rows });
  });

  it('should leave small answers, HEAD, no-transform and answers written in pieces as they were', async () => {
    const small = await get(port, '/api/small', { 'accept-encoding': 'gzip' });
    expect(JSON.stringify({ ok: true }).length).toBeLessThan(GZIP_THRESHOLD_BYTES);
    expect(small.headers['content-encoding']).toBeUndefined();
    expect(JSON.parse(small.body.toString('utf8'))).toEqual({ ok: true });

    const head = await get(port, '/api/big', { 'accept-encoding': 'gzip' }, 'HEAD');
    expect(head.status).toBe(200);
    expect(head.body.length).toBe(0);

    const kept = await get(port, '/api/kept', { 'accept-encoding': 'gzip' });
    expect(kept.headers['content-encoding']).toBeUndefined();
    expect(JSON.parse(kept.body.toString('utf8'))).toEqual({ rows });

    // a streamed answer is still gzipped, by the compression middleware's stream
    const pieces = await get(port, '/api/pieces', { 'accept-encoding': 'gzip' });
    expect(pieces.headers['content-encoding']).toBe('gzip');
    expect(pieces.headers['content-length']).toBeUndefined();
    expect(gunzipSync(pieces.body).toString('utf8')).toBe(rows.map((r) => `${r.id},${r.title}\n`).join(''));
  });

  it('should answer a conditional request with 304 and no body', async () => {
    const first = await get(port, '/api/big', { 'accept-encoding': 'gzip' });
    const etag = first.headers.etag!;
    expect(etag).toBeTruthy();
    const again = await get(port, '/api/big', { 'accept-encoding': 'gzip', 'if-none-match': etag });
    expect(again.status).toBe(304);
    expect(again.body.length).toBe(0);
  });
});
