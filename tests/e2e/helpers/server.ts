import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../../..');

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

export interface RunningServer {
  baseUrl: string;
  dataDir: string;
  log: () => string;
  stop(): Promise<void>;
}

/** Starts the real server (tsx server/index.ts) on a free port with a temporary DATA_DIR; resolves once it is ready. */
export async function startRealServer(env: Record<string, string> = {}): Promise<RunningServer> {
  const port = await freePort();
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-e2e-'));
  let output = '';
  const child: ChildProcess = spawn(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), 'server/index.ts'], {
    cwd: root,
    env: { ...process.env, PORT: String(port), DATA_DIR: dataDir, SMTP_URL: '', PUBLIC_URL: `http://127.0.0.1:${port}`, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (d) => (output += d));
  child.stderr!.on('data', (d) => (output += d));
  const baseUrl = `http://127.0.0.1:${port}`;
  // ready, not only listening: the search index loads in the background after start, and until
  // it has, a search waits for it or answers 503; tests begin where a load balancer sends traffic.
  // Under the 120 s hook limit, so a server that never gets there is reported with its log.
  const deadline = Date.now() + 90_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early: ${output}`);
    try {
      if ((await fetch(`${baseUrl}/api/ready`)).ok) break;
    } catch {
      /* not listening yet */
    }
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`server not ready in 90 s: ${output}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    baseUrl,
    dataDir,
    log: () => output,
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null) child.kill('SIGKILL');
      }
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
