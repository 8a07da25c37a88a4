import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import SQLite from 'better-sqlite3';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { ON_POSTGRES } from './helpers/test-context';
import { openDatabase } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';
import { createAdmin } from '../../server/services/first-admin';
import { pngBytes } from './helpers/fixtures';

const root = path.resolve(import.meta.dirname, '../..');
const ADMIN = { email: 'crash.admin@falsetrace.test', name: 'Crash Admin', password: 'crash-admin-password' };

/** The real server in one node process (no tsx or npm wrapper), so SIGKILL hits the server itself. */
async function start(dataDir: string): Promise<{ child: ChildProcess; baseUrl: string; output: () => string }> {
  let output = '';
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: { ...process.env, DATA_DIR: dataDir, PORT: '0', SEED_DEMO: '0', SMTP_URL: '', NODE_ENV: '' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (d: Buffer) => (output += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
  const port = await new Promise<number>((resolve, reject) => {
    child.stdout!.on('data', () => {
      const m = output.match(/listening on http:\/\/localhost:(\d+)/);
      if (m) resolve(Number(m[1]));
    });
    child.once('exit', (code) => reject(new Error(`server exited (${code}): ${output}`)));
  });
  return { child, baseUrl: `http://127.0.0.1:${port}`, output: () => output };
}

async function signIn(baseUrl: string) {
  const agent = request.agent(baseUrl);
  const before: string = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken;
  await agent.post('/api/auth/login').set('x-csrf-token', before).send({ email: ADMIN.email, password: ADMIN.password }).expect(200);
  // sign-in renews the CSRF token
  const token: string = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken;
  return { agent, token };
}

// SQLite only: this checks SQLite's own durability (WAL, integrity check) under kill -9; PostgreSQL's is the server's job
describe.skipIf(ON_POSTGRES)('kill -9 with writers in flight loses nothing acknowledged (SQLite file; skipped on PostgreSQL)', () => {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-crash-'));
  const children: ChildProcess[] = [];
  afterAll(() => {
    for (const c of children) if (c.exitCode === null) c.kill('SIGKILL');
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('should keep every acknowledged case and attachment, pass the integrity check and leave no orphan file', async () => {
    const setup = openDatabase(path.join(dataDir, 'falsetrace.sqlite'));
    await migrateToLatest(setup);
    await createAdmin(setup, ADMIN);
    await setup.destroy();

    const first = await start(dataDir);
    children.push(first.child);
    const { agent, token } = await signIn(first.baseUrl);
    const png = await pngBytes(200, 120);
    const ackedCases: number[] = [];
    const ackedAttachments: number[] = [];
    let killed = false;
    const writer = async (w: number) => {
      for (let i = 0; !killed; i++) {
        try {
          const res = await agent.post('/api/cases').set('x-csrf-token', token).send({ title: `Crash writer ${w} case ${i}`, summary: 'written while the server dies' });
          if (res.status !== 201) throw new Error(`case write refused: ${res.status} ${JSON.stringify(res.body)}`);
          ackedCases.push(res.body.case.id);
          const up = await agent.post(`/api/cases/${res.body.case.id}/attachments`).set('x-csrf-token', token).attach('file', png, { filename: 'shot.png', contentType: 'image/png' });
          if (up.status === 201) ackedAttachments.push(up.body.attachment.id);
        } catch (err) {
          if (!killed && /refused/.test((err as Error).message)) throw err;
          return; // the server is gone
        }
      }
    };
    let failure: unknown;
    const writers = [1, 2, 3, 4].map((w) => writer(w).catch((err) => void (failure = err)));
    // kill once enough writes are acknowledged, while the writers keep going
    await new Promise<void>((resolve) => {
      const check = setInterval(() => {
        if (ackedAttachments.length >= 12 || failure) {
          clearInterval(check);
          resolve();
        }
      }, 20);
    });
    const exited = new Promise((r) => first.child.once('exit', r));
    first.child.kill('SIGKILL');
    await exited;
    killed = true;
    await Promise.all(writers);
    expect(failure).toBeUndefined();

    const second = await start(dataDir);
    children.push(second.child);
    const again = await signIn(second.baseUrl);
    for (const id of ackedCases) await again.agent.get(`/api/cases/${id}`).expect(200);
    const stopped = new Promise((r) => second.child.once('exit', r));
    second.child.kill('SIGTERM');
    await stopped;

    const db = new SQLite(path.join(dataDir, 'falsetrace.sqlite'), { readonly: true });
    try {
      expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
      const rows = db.prepare('SELECT id, storage_name, thumbnail_name FROM attachments').all() as { id: number; storage_name: string; thumbnail_name: string | null }[];
      const ids = new Set(rows.map((r) => r.id));
      for (const id of ackedAttachments) expect(ids.has(id)).toBe(true);
      const named = new Set(rows.flatMap((r) => [r.storage_name, ...(r.thumbnail_name ? [r.thumbnail_name] : [])]));
      const uploads = path.join(dataDir, 'uploads');
      const files = readdirSync(uploads, { withFileTypes: true }).filter((e) => e.isFile()).map((e) => e.name);
      expect(files.filter((f) => !named.has(f))).toEqual([]);
      for (const n of named) expect(existsSync(path.join(uploads, n))).toBe(true);
      expect(existsSync(path.join(uploads, 'incoming')) ? readdirSync(path.join(uploads, 'incoming')) : []).toEqual([]);
    } finally {
      db.close();
    }
  }, 120_000);
});

describe('the start-up sweep of uploads', () => {
  it('should remove partial uploads and set aside files that no attachment names', async () => {
    const { sweepUploads } = await import('../../server/backup/upload-sweep');
    const { createTestContext, signedIn } = await import('./helpers/test-context');
    const { writeFileSync, mkdirSync, readFileSync } = await import('node:fs');
    const ctx = await createTestContext();
    try {
      const eng = await signedIn(ctx, 'engineer');
      const id = (await eng.post('/api/cases', { title: 'Kept file', summary: 'has a screenshot' }).expect(201)).body.case.id;
      await eng.upload(`/api/cases/${id}/attachments`, await pngBytes(40, 40), 'kept.png', 'image/png').expect(201);
      const uploads = path.join(ctx.config.dataDir, 'uploads');
      mkdirSync(path.join(uploads, 'incoming'), { recursive: true });
      writeFileSync(path.join(uploads, 'incoming', 'half-written'), 'partial');
      writeFileSync(path.join(uploads, 'written-before-crash.png'), 'orphan bytes');
      const kept = readdirSync(uploads).filter((f) => f.endsWith('.png') && f !== 'written-before-crash.png');
      expect(await sweepUploads(ctx.db, ctx.config.dataDir)).toEqual({ partial: 1, orphaned: 1 });
      expect(readdirSync(path.join(uploads, 'incoming'))).toEqual([]);
      expect(readFileSync(path.join(ctx.config.dataDir, 'orphaned-uploads', 'written-before-crash.png'), 'utf8')).toBe('orphan bytes');
      expect(readdirSync(uploads).filter((f) => f.endsWith('.png')).sort()).toEqual(kept.sort());
    } finally {
      await ctx.close();
    }
  });
  it('should remove plot samples whose capture is gone and scratch folders a crashed analysis left, keeping a live capture\'s', async () => {
    const { sweepUploads } = await import('../../server/backup/upload-sweep');
    const { createTestContext, signedIn } = await import('./helpers/test-context');
    const { writeFileSync, mkdirSync, existsSync } = await import('node:fs');
    const ctx = await createTestContext();
    try {
      const eng = await signedIn(ctx, 'engineer');
      const id = (await eng.post('/api/cases', { title: 'Kept capture', summary: 'has a capture' }).expect(201)).body.case.id;
      const csv = Array.from({ length: 200 }, (_, i) => `${i * 1e-6},${i % 100 < 50 ? 0 : 1}`).join('\n');
      await eng.upload(`/api/cases/${id}/attachments`, Buffer.from(`time,volts\n${csv}\n`), 'edge.csv', 'text/csv').expect(201);
      const uploads = path.join(ctx.config.dataDir, 'uploads');
      const live = readdirSync(uploads).filter((f) => f.endsWith('.plot'));
      expect(live).toHaveLength(1);
      mkdirSync(path.join(uploads, 'gone.csv.plot'));
      mkdirSync(path.join(uploads, '.x.csv.samples-0b7e4c1a-9d2f-4a57-8c3e-2f1d6a9b0c4e'));
      writeFileSync(path.join(uploads, 'gone.csv.plot', 'time.bin'), 'stale');
      expect(await sweepUploads(ctx.db, ctx.config.dataDir)).toEqual({ partial: 2, orphaned: 0 });
      expect(existsSync(path.join(uploads, 'gone.csv.plot'))).toBe(false);
      expect(readdirSync(uploads).filter((f) => f.includes('.samples-'))).toEqual([]);
      expect(readdirSync(uploads).filter((f) => f.endsWith('.plot'))).toEqual(live);
    } finally {
      await ctx.close();
    }
  });
});
