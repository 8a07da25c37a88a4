import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { connect, type Socket } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import { CAPTURE_DIR } from '../../server/seed/demo/capture-files';
import { createPostgresDatabase } from '../helpers/postgres';
import { ON_POSTGRES } from './helpers/test-context';

const root = path.resolve(import.meta.dirname, '../..');

/** Resolves when a TCP connection to the port is refused (the server stopped listening). */
async function refused(port: number): Promise<void> {
  for (;;) {
    const ok = await new Promise<boolean>((resolve) => {
      const s = connect(port, '127.0.0.1');
      s.once('connect', () => {
        s.destroy();
        resolve(false);
      });
      s.once('error', () => resolve(true));
    });
    if (ok) return;
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe(`the compiled server under plain node stops cleanly on SIGTERM (${ON_POSTGRES ? 'PostgreSQL' : 'SQLite'})`, () => {
  let child: ChildProcess;
  let port: number;
  let output = '';
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-shutdown-'));
  // the api-pg run builds into its own folder, so the two projects' builds never replace each other's files
  const outDir = ON_POSTGRES ? 'dist-server-pg' : 'dist-server';
  let dropDatabase = async () => {};

  beforeAll(async () => {
    execFileSync(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), 'scripts/build-server.ts'], { cwd: root, stdio: 'pipe', env: { ...process.env, BUILD_SERVER_OUT: outDir } });
    let databaseUrl = '';
    if (ON_POSTGRES) {
      const created = await createPostgresDatabase(inject('postgresAdminUrl'));
      databaseUrl = created.url;
      dropDatabase = created.drop;
    }
    child = spawn(process.execPath, [path.join(root, outDir, 'index.mjs')], {
      cwd: root,
      env: { ...process.env, DATA_DIR: dataDir, DATABASE_URL: databaseUrl, PORT: '0', SEED_DEMO: '0', SHUTDOWN_GRACE_MS: '60000', NODE_ENV: '' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout!.on('data', (d: Buffer) => (output += d.toString()));
    child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    port = await new Promise<number>((resolve, reject) => {
      const check = () => {
        const m = output.match(/listening on http:\/\/localhost:(\d+)/);
        if (m) resolve(Number(m[1]));
      };
      child.stdout!.on('data', check);
      child.once('exit', (code) => reject(new Error(`server exited (${code}): ${output}`)));
    });
  }, 60_000);
  afterAll(async () => {
    if (child?.exitCode === null) child.kill('SIGKILL');
    await dropDatabase();
    rmSync(dataDir, { recursive: true, force: true });
    if (ON_POSTGRES) rmSync(path.join(root, outDir), { recursive: true, force: true });
  });

  it('should carry beside the bundle every file the workers and the demo seeding read at run time', () => {
    const built = new Set(readdirSync(path.join(root, outDir)));
    for (const worker of ['search-worker.mjs', 'capture-worker.mjs', 'back-half-worker.mjs', 'zip-worker.mjs', 'reencode-worker.mjs']) expect(built, worker).toContain(worker);
    // an empty DATA_DIR is seeded with the demo, whose captures are read from CAPTURE_DIR beside the bundle
    expect(readdirSync(path.join(root, outDir, 'captures')).sort()).toEqual(readdirSync(CAPTURE_DIR).sort());
  });

  it('should finish a request in flight, refuse new connections, and exit with 0', async () => {
    // a request whose body is still arriving when the signal comes
    const socket: Socket = connect(port, '127.0.0.1');
    await new Promise((r) => socket.once('connect', r));
    let reply = '';
    socket.on('data', (d: Buffer) => (reply += d.toString()));
    const body = JSON.stringify({ email: 'nobody@falsetrace.test', password: 'not-a-password' });
    // "100 Continue" says the server has the request and waits for its body
    socket.write(`POST /api/auth/login HTTP/1.1\r\nHost: localhost\r\nExpect: 100-continue\r\nContent-Type: application/json\r\nContent-Length: ${body.length}\r\n\r\n`);
    await new Promise<void>((resolve) => socket.on('data', () => /100 Continue/.test(reply) && resolve()));
    socket.write(body.slice(0, 5));

    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    child.kill('SIGTERM');
    await refused(port);
    expect(child.exitCode).toBeNull(); // still draining

    socket.write(body.slice(5));
    await new Promise((r) => socket.once('end', r));
    expect(reply).toMatch(/HTTP\/1\.1 403 /); // answered (CSRF), not cut
    // the server's own words when it did not stop cleanly
    expect(await exited, output).toBe(0);
    expect(output).toMatch(/SIGTERM: finishing requests in flight/);
    expect(output).toMatch(/stopped/);
    if (ON_POSTGRES) expect(output).toMatch(/PostgreSQL at 127\.0\.0\.1/);
  }, 60_000);
});
