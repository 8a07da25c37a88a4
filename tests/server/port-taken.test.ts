import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');

describe('start-up on a port that is taken', () => {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-port-'));
  let blocker: Server;
  afterAll(() => {
    blocker?.close();
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('should exit non-zero naming the port instead of saying it listens', async () => {
    blocker = createServer();
    const port = await new Promise<number>((resolve) => blocker.listen(0, '::', () => resolve((blocker.address() as { port: number }).port)));
    const child = spawn(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), 'server/index.ts'], {
      cwd: root,
      env: { ...process.env, DATA_DIR: dataDir, PORT: String(port), SEED_DEMO: '0' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout!.on('data', (d: Buffer) => (output += d.toString()));
    child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    const code = await new Promise<number | null>((resolve) => child.on('exit', resolve));
    expect(code).not.toBe(0);
    expect(output).toContain(`port ${port} is already in use`);
    expect(output).not.toMatch(/listening on/);
  });
});
