/**
 * npm run bench:http — the API under load, signed in, on a temporary DATA_DIR holding
 * BENCH_CASES (10,000) generated cases: the case list, a search and a case page at 16 and 64
 * connections, each as a ratio to GET /api/health measured right before it (so the figures
 * speak of the app, not of the machine, whose speed drifts within a minute). The server runs in
 * its own process.
 *
 * Where Debian's PostgreSQL server is installed, the same runs follow against a server with
 * DATABASE_URL on a throwaway cluster (tests/helpers/postgres.ts), printed beside SQLite's.
 * BENCH_DATABASES=sqlite (or postgres) runs only one of them.
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
import { openDatabase, openPostgres, type Db } from '../server/db/database';
import { migrateToLatest } from '../server/db/migrate';
import { DEMO_ACCOUNTS } from '../server/seed/demo-users';
import { seedBenchCasebook } from '../server/seed/bench/generate-cases';
import { createPostgresDatabase, findPostgresBin, POSTGRES_MISSING, startPostgresCluster, type PostgresCluster } from '../tests/helpers/postgres';

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


interface Run {
  rps: number;
  p50: number;
  p99: number;
  timeouts: number;
  errors: number;
  non2xx: number;
  /** req/s of the health run made right before this one (absent for health itself). */
  healthRps?: number;
}
type Results = Map<string, Run>;
const TARGET_NAMES = ['health', 'list', 'search', 'case page'] as const;

/** Seeds a fresh casebook, starts the server on it with `env`, and measures every target at c=16 and c=64. */
async function benchOne(label: string, open: (dataDir: string) => Db, env: Record<string, string>): Promise<Results> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-bench-http-'));
  try {
    console.log(`\n[${label}] ${COUNT} generated cases, ${SECONDS} s per run`);
    let t = Date.now();
    const db = open(dataDir);
    await migrateToLatest(db);
    await seedBenchCasebook(db, { count: COUNT, password: PASSWORD });
    const someCase = (await db.selectFrom('cases').select('id').where('status', '=', 'verified').orderBy('id', 'desc').limit(1).offset(Math.floor(COUNT / 3)).executeTakeFirstOrThrow()).id;
    await db.destroy();
    console.log(`[${label}] seeded in ${((Date.now() - t) / 1000).toFixed(1)} s`);

    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    const server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/index.ts')], {
      cwd: root,
      // no capture warm-up: it runs once, just after ready, and would share the cores with the first load here
      env: { ...process.env, DATA_DIR: dataDir, PORT: String(port), SEED_DEMO: '0', DEMO_PASSWORD: PASSWORD, LOG_LEVEL: 'warn', CAPTURE_WARM_UP: '0', ...env },
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    const stopped = new Promise((r) => server.once('exit', r));
    const stop = () => {
      if (server.exitCode === null) server.kill('SIGTERM');
    };
    process.on('exit', stop);
    try {
      const waitFor = async (url: string, init: RequestInit, what: string) => {
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
      };
      t = Date.now();
      await waitFor(`${base}/api/health`, {}, '/api/health');
      console.log(`[${label}] server up in ${((Date.now() - t) / 1000).toFixed(1)} s`);

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
      console.log(`[${label}] search answering ${((Date.now() - t) / 1000).toFixed(1)} s after sign-in`);

      const targets: Record<(typeof TARGET_NAMES)[number], string> = {
        health: '/api/health',
        list: '/api/cases?page=1',
        search: '/api/search?q=ringing+ground+lead',
        'case page': `/api/cases/${someCase}`,
      };
      const results: Results = new Map();
      const measure = async (name: (typeof TARGET_NAMES)[number], c: number): Promise<Run> => {
        const url = `${base}${targets[name]}`;
        // a short warm-up, so the first run does not pay for cold caches
        await autocannon({ url, connections: 4, amount: 50, headers });
        const r = await autocannon({ url, connections: c, duration: SECONDS, headers, timeout: 10 });
        return { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, timeouts: r.timeouts, errors: r.errors, non2xx: r.non2xx };
      };
      for (const c of [16, 64]) {
        // health is measured again right before each target, and each ratio is taken against that
        // run: the machine's speed drifts within a minute, and a pair shares its seconds
        const healthRuns: Run[] = [];
        for (const name of TARGET_NAMES.filter((n) => n !== 'health')) {
          const health = await measure('health', c);
          healthRuns.push(health);
          results.set(`${name}@${c}`, { ...(await measure(name, c)), healthRps: health.rps });
        }
        const total = (f: (r: Run) => number) => healthRuns.reduce((sum, r) => sum + f(r), 0);
        results.set(`health@${c}`, {
          rps: total((r) => r.rps) / healthRuns.length,
          p50: Math.max(...healthRuns.map((r) => r.p50)),
          p99: Math.max(...healthRuns.map((r) => r.p99)),
          timeouts: total((r) => r.timeouts),
          errors: total((r) => r.errors),
          non2xx: total((r) => r.non2xx),
        });
      }
      return results;
    } finally {
      stop();
      await stopped;
    }
  } finally {
    rmSync(dataDir, { recursive: true, force: true });
  }
}

const wanted = (process.env.BENCH_DATABASES ?? 'sqlite,postgres').split(',').map((s) => s.trim());
console.log(`http benchmark: ${COUNT} generated cases, ${SECONDS} s per run, node ${process.version}`);
const runs: [string, Results][] = [];
if (wanted.includes('sqlite')) runs.push(['SQLite', await benchOne('SQLite', (dataDir) => openDatabase(path.join(dataDir, 'falsetrace.sqlite')), {})]);
if (wanted.includes('postgres')) {
  if (!findPostgresBin()) console.log(`\n[PostgreSQL] left out: ${POSTGRES_MISSING}`);
  else {
    let cluster: PostgresCluster | undefined;
    try {
      cluster = await startPostgresCluster();
      process.on('exit', () => cluster?.stop());
      const { url, drop } = await createPostgresDatabase(cluster.adminUrl);
      // the server's pool is its default size (10), as a deployment would start with
      runs.push(['PostgreSQL', await benchOne('PostgreSQL', () => openPostgres(url, { max: 4 }), { DATABASE_URL: url })]);
      await drop();
    } finally {
      cluster?.stop();
    }
  }
}

// one block per database, side by side: the ratios to health are what compare across them
/** A target's req/s as a share of the health run paired with it (health itself: 1). */
const shareOfHealth = (r: Run) => r.rps / (r.healthRps ?? r.rps);
const cell = (r: Run) =>
  `${r.rps.toFixed(0).padStart(7)} ${shareOfHealth(r).toFixed(2).padStart(6)} ${String(r.p50).padStart(5)} ${String(r.p99).padStart(5)} ${String(r.timeouts + r.errors + r.non2xx).padStart(4)}`;
console.log('');
console.log(`${' '.repeat(19)}${runs.map(([label]) => `| ${label.padEnd(31)}`).join('')}`);
console.log(`target           c ${runs.map(() => '|   req/s ×hlth   p50   p99  bad ').join('')}`);
for (const c of [16, 64]) {
  for (const name of TARGET_NAMES) {
    const cells = runs.map(([, res]) => `| ${cell(res.get(`${name}@${c}`)!)} `);
    console.log(`${name.padEnd(14)} ${String(c).padStart(3)} ${cells.join('')}`);
  }
}
console.log('(p50/p99 in ms; bad = timeouts + errors + non-2xx answers; ×hlth: against the health run made just before; health: the mean of those runs)');

for (const [label, results] of runs) {
  const at16 = (n: string) => results.get(`${n}@16`)!;
  const ratio = (n: string) => shareOfHealth(at16(n));
  const checks: [string, boolean][] = [
    [`list ≥ 0.3× health at c=16 (${ratio('list').toFixed(2)})`, ratio('list') >= 0.3],
    [`search ≥ 0.15× health at c=16 (${ratio('search').toFixed(2)})`, ratio('search') >= 0.15],
    [`list p99 < 150 ms at c=16 (${at16('list').p99} ms)`, at16('list').p99 < 150],
    [`search p99 < 150 ms at c=16 (${at16('search').p99} ms)`, at16('search').p99 < 150],
    [`no timeouts at c=64 (${TARGET_NAMES.map((n) => results.get(`${n}@64`)!.timeouts).join('/')})`, TARGET_NAMES.every((n) => results.get(`${n}@64`)!.timeouts === 0)],
  ];
  console.log(`\n${label}:`);
  for (const [what, ok] of checks) console.log(`${ok ? 'met    ' : 'NOT MET'}  ${what}`);
}
