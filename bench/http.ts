/**
 * npm run bench:http — the API under load, signed in, on a temporary DATA_DIR holding
 * BENCH_CASES (10,000) generated cases: the case list, a search and a case page at 16 and 64
 * connections, each as a ratio to GET /api/health measured in the same run (so the figures
 * speak of the app, not of the machine). The server runs in its own process.
 *
 * Targets (issue 15): at c=16 the list ≥ 0.3× and search ≥ 0.15× health's req/s, p99 < 150 ms
 * for both; no timeouts at c=64.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { openDatabase } from '../server/db/database';
import { migrateToLatest } from '../server/db/migrate';
import { DEMO_ACCOUNTS } from '../server/seed/demo-users';
import { seedBenchCasebook } from '../server/seed/bench/generate-cases';

const COUNT = Number(process.env.BENCH_CASES ?? 10_000);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const PASSWORD = 'bench-probe-2026';
const root = path.join(import.meta.dirname, '..');

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-bench-http-'));
console.log(`http benchmark: ${COUNT} generated cases in ${dataDir}, ${SECONDS} s per run, node ${process.version}`);
let t = Date.now();
const db = openDatabase(path.join(dataDir, 'falsetrace.sqlite'));
await migrateToLatest(db);
await seedBenchCasebook(db, { count: COUNT, password: PASSWORD });
const someCase = (await db.selectFrom('cases').select('id').where('status', '=', 'verified').orderBy('id', 'desc').limit(1).offset(Math.floor(COUNT / 3)).executeTakeFirstOrThrow()).id;
await db.destroy();
console.log(`seeded in ${((Date.now() - t) / 1000).toFixed(1)} s`);

const port = await freePort();
const base = `http://127.0.0.1:${port}`;
const server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/index.ts')], {
  cwd: root,
  env: { ...process.env, DATA_DIR: dataDir, PORT: String(port), SEED_DEMO: '0', DEMO_PASSWORD: PASSWORD, LOG_LEVEL: 'warn' },
  stdio: ['ignore', 'ignore', 'inherit'],
});
const stop = () => {
  if (server.exitCode === null) server.kill('SIGTERM');
};
process.on('exit', stop);

async function waitFor(url: string, init: RequestInit, what: string) {
  const until = Date.now() + 10 * 60_000;
  for (;;) {
    try {
      const res = await fetch(url, init);
      if (res.ok) return res;
    } catch {
      // not listening yet
    }
    if (Date.now() > until || server.exitCode !== null) throw new Error(`the server never answered ${what}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

t = Date.now();
await waitFor(`${base}/api/health`, {}, '/api/health');
console.log(`server up in ${((Date.now() - t) / 1000).toFixed(1)} s`);

// sign in as the demo engineer (sees verified cases and their own: the common case)
const jar = new Map<string, string>();
const keep = (res: Response) => {
  for (const c of res.headers.getSetCookie()) {
    const [pair] = c.split(';');
    const at = pair.indexOf('=');
    jar.set(pair.slice(0, at), pair.slice(at + 1));
  }
};
const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
const csrfRes = await fetch(`${base}/api/auth/csrf`);
keep(csrfRes);
const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
const email = DEMO_ACCOUNTS.find((a) => a.role === 'engineer')!.email;
const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookie() },
  body: JSON.stringify({ email, password: PASSWORD }),
});
if (!login.ok) throw new Error(`sign-in failed: ${login.status} ${await login.text()}`);
keep(login);
const headers = { cookie: cookie(), 'accept-encoding': 'gzip' };

t = Date.now();
await waitFor(`${base}/api/search?q=ringing+ground+lead`, { headers }, 'a search (index still building?)');
console.log(`search answering ${((Date.now() - t) / 1000).toFixed(1)} s after sign-in`);

const targets = [
  ['health', '/api/health'],
  ['list', '/api/cases?page=1'],
  ['search', '/api/search?q=ringing+ground+lead'],
  ['case page', `/api/cases/${someCase}`],
] as const;

interface Run {
  rps: number;
  p50: number;
  p99: number;
  timeouts: number;
  errors: number;
  non2xx: number;
}
async function run(urlPath: string, connections: number): Promise<Run> {
  const r = await autocannon({ url: `${base}${urlPath}`, connections, duration: SECONDS, headers, timeout: 10 });
  return { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, timeouts: r.timeouts, errors: r.errors, non2xx: r.non2xx };
}

const results = new Map<string, Run>();
for (const c of [16, 64]) {
  for (const [name, urlPath] of targets) {
    // a short warm-up, so the first run does not pay for cold caches
    await autocannon({ url: `${base}${urlPath}`, connections: 4, amount: 50, headers });
    results.set(`${name}@${c}`, await run(urlPath, c));
  }
}
stop();

console.log('');
console.log('                 c    req/s   ×health   p50 ms   p99 ms   timeouts  errors  non-2xx');
for (const c of [16, 64]) {
  const health = results.get(`health@${c}`)!;
  for (const [name] of targets) {
    const r = results.get(`${name}@${c}`)!;
    console.log(
      `${name.padEnd(14)} ${String(c).padStart(3)} ${r.rps.toFixed(0).padStart(8)} ${(r.rps / health.rps).toFixed(2).padStart(9)} ${String(r.p50).padStart(8)} ${String(r.p99).padStart(8)} ${String(r.timeouts).padStart(10)} ${String(r.errors).padStart(7)} ${String(r.non2xx).padStart(8)}`,
    );
  }
}
const at16 = (n: string) => results.get(`${n}@16`)!;
const ratio = (n: string) => at16(n).rps / at16('health').rps;
const checks: [string, boolean][] = [
  [`list ≥ 0.3× health at c=16 (${ratio('list').toFixed(2)})`, ratio('list') >= 0.3],
  [`search ≥ 0.15× health at c=16 (${ratio('search').toFixed(2)})`, ratio('search') >= 0.15],
  [`list p99 < 150 ms at c=16 (${at16('list').p99} ms)`, at16('list').p99 < 150],
  [`search p99 < 150 ms at c=16 (${at16('search').p99} ms)`, at16('search').p99 < 150],
  [`no timeouts at c=64 (${targets.map(([n]) => results.get(`${n}@64`)!.timeouts).join('/')})`, targets.every(([n]) => results.get(`${n}@64`)!.timeouts === 0)],
];
console.log('');
for (const [what, ok] of checks) console.log(`${ok ? 'met    ' : 'NOT MET'}  ${what}`);
rmSync(dataDir, { recursive: true, force: true });
