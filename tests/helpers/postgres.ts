import { execFileSync, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chownSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';

/**
 * A throwaway PostgreSQL cluster for tests: Debian's server binaries, a data folder and a socket
 * folder under a temp folder, a free TCP port on 127.0.0.1, trust authentication, no fsync.
 */

const DEBIAN_ROOT = '/usr/lib/postgresql';

/** The newest installed server's bin folder (initdb, pg_ctl, postgres), or null. */
export function findPostgresBin(): string | null {
  if (!existsSync(DEBIAN_ROOT)) return null;
  const versions = readdirSync(DEBIAN_ROOT)
    .filter((v) => existsSync(path.join(DEBIAN_ROOT, v, 'bin', 'postgres')) && existsSync(path.join(DEBIAN_ROOT, v, 'bin', 'initdb')))
    .sort((a, b) => Number.parseFloat(b) - Number.parseFloat(a));
  return versions.length ? path.join(DEBIAN_ROOT, versions[0], 'bin') : null;
}

export const POSTGRES_MISSING = `no PostgreSQL server under ${DEBIAN_ROOT}/*/bin (install Debian's package: apt-get install -y postgresql)`;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

export interface PostgresCluster {
  /** The superuser's address of the `postgres` database (create test databases through it). */
  adminUrl: string;
  stop(): void;
}

export async function startPostgresCluster(): Promise<PostgresCluster> {
  const bin = findPostgresBin();
  if (!bin) throw new Error(POSTGRES_MISSING);
  const root = mkdtempSync(path.join(tmpdir(), 'falsetrace-pg-'));
  const dataDir = path.join(root, 'data');
  const logFile = path.join(root, 'server.log');
  // the server refuses to run as root: run it as Debian's postgres account then
  const asRoot = process.getuid?.() === 0;
  if (asRoot) {
    const { uid, gid } = postgresAccount();
    chownSync(root, uid, gid);
  }
  const run = (cmd: string, args: string[]) => {
    const [file, argv] = asRoot ? ['runuser', ['-u', 'postgres', '--', path.join(bin, cmd), ...args]] : [path.join(bin, cmd), args];
    const r = spawnSync(file, argv, { encoding: 'utf8' });
    if (r.status !== 0) {
      const log = existsSync(logFile) ? readFileSync(logFile, 'utf8').slice(-2000) : '';
      throw new Error(`${cmd} failed (${r.status}): ${r.stderr || r.stdout}${log ? `\nserver log:\n${log}` : ''}`);
    }
  };
  // C collation: text sorts by code point, as SQLite's does
  run('initdb', ['-D', dataDir, '-U', 'falsetrace', '--auth=trust', '--encoding=UTF8', '--locale=C', '--no-sync']);
  const port = await freePort();
  const options = [`-p ${port}`, `-k ${root}`, '-h 127.0.0.1', '-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off', '-c max_connections=200'].join(' ');
  run('pg_ctl', ['-D', dataDir, '-l', logFile, '-o', options, '-w', '-t', '60', 'start']);
  let stopped = false;
  return {
    adminUrl: `postgres://falsetrace@127.0.0.1:${port}/postgres`,
    stop() {
      if (stopped) return;
      stopped = true;
      try {
        run('pg_ctl', ['-D', dataDir, '-m', 'immediate', '-w', 'stop']);
      } finally {
        rmSync(root, { recursive: true, force: true });
      }
    },
  };
}

function postgresAccount() {
  try {
    return { uid: Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim()), gid: Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim()) };
  } catch {
    throw new Error('running as root needs the postgres account (created by Debian\'s postgresql package) to start a test cluster');
  }
}

/** A fresh, empty database on the cluster; `drop` removes it (closing whatever is still connected). */
export async function createPostgresDatabase(adminUrl: string): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `ft_${randomBytes(6).toString('hex')}`;
  const admin = async (statement: string) => {
    const client = new pg.Client({ connectionString: adminUrl });
    await client.connect();
    try {
      await client.query(statement);
    } finally {
      await client.end();
    }
  };
  await admin(`CREATE DATABASE "${name}"`);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return { url: url.toString(), drop: () => admin(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`) };
}
