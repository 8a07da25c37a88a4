import { createWriteStream, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import SQLite from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeBackup } from '../../server/backup/backup';
import { restoreBackup } from '../../server/backup/restore';
import { PID_FILE } from '../../server/backup/server-lock';
import { pngBytes, stepCsv } from './helpers/fixtures';
import { createTestContext, ON_POSTGRES, invitedEngineer, signedIn, type TestContext, updatedAtOf } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

/** Every row of every table, as sorted JSON lines per table. */
function dumpTables(file: string): Record<string, string[]> {
  const db = new SQLite(file, { readonly: true });
  try {
    const tables = (db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name").all() as { name: string }[]).map((t) => t.name);
    return Object.fromEntries(tables.map((t) => [t, (db.prepare(`SELECT * FROM "${t}"`).all() as object[]).map((r) => JSON.stringify(r)).sort()]));
  } finally {
    db.close();
  }
}

/** Path → bytes of every file the state is made of: uploads (not partial ones) and the session secret. */
function stateFiles(dataDir: string): Map<string, Buffer> {
  const files = new Map<string, Buffer>();
  const uploads = path.join(dataDir, 'uploads');
  if (existsSync(uploads)) for (const e of readdirSync(uploads, { withFileTypes: true })) if (e.isFile()) files.set(`uploads/${e.name}`, readFileSync(path.join(uploads, e.name)));
  const secret = path.join(dataDir, 'session-secret');
  if (existsSync(secret)) files.set('session-secret', readFileSync(secret));
  return files;
}

const toFile = async (ctx: TestContext, file: string) => {
  const out = createWriteStream(file);
  return writeBackup(ctx.db, ctx.config.dataDir, out);
};

// the built-in backup is SQLite's online backup API; on PostgreSQL it refuses (tested below) and pg_dump does the job
describe.skipIf(ON_POSTGRES)('backup and restore of the whole installation (SQLite; skipped on PostgreSQL)', () => {
  let ctx: TestContext;
  let eng: Client;
  let mod: Client;
  let admin: Client;
  const work = mkdtempSync(path.join(tmpdir(), 'falsetrace-restore-'));

  beforeAll(async () => {
    ctx = await createTestContext({ onDisk: true });
    writeFileSync(path.join(ctx.config.dataDir, 'session-secret'), 'secret-of-this-install');
    [eng, mod, admin] = await Promise.all([signedIn(ctx, 'engineer'), signedIn(ctx, 'moderator'), signedIn(ctx, 'admin')]);
    // a little of everything the old import lost: comments, moderator edits, a verification,
    // role changes, a deactivation, tag synonyms and watches
    const id = (await eng.post('/api/cases', { title: 'Ringing on a 15 cm ground lead', summary: 'overshoot at 120 MHz', tags: ['ground-lead'] }).expect(201)).body.case.id;
    await eng.upload(`/api/cases/${id}/attachments`, await pngBytes(320, 200), 'scope.png', 'image/png').expect(201);
    await eng.upload(`/api/cases/${id}/attachments`, stepCsv(400), 'edge.csv', 'text/csv').expect(201);
    await eng.post(`/api/cases/${id}/comments`, { body: 'Spring tip fixed it' }).expect(201);
    await eng.post(`/api/cases/${id}/submit`).expect(200);
    await mod.patch(`/api/cases/${id}`, { summary: 'overshoot at 120 MHz, gone with a spring tip', baseUpdatedAt: await updatedAtOf(mod, id) }).expect(200);
    await mod.post(`/api/cases/${id}/review`, { action: 'verify' }).expect(200);
    await mod.put('/api/tags/ground-lead/synonyms', { synonyms: ['gnd-lead'] }).expect(200);
    const colleague = await invitedEngineer(ctx, 'leaver@falsetrace.test');
    await colleague.post('/api/tags/ground-lead/watch').expect(200);
    const people = (await admin.get('/api/admin/people').expect(200)).body.people as { id: number; email: string }[];
    const leaver = people.find((p) => p.email === 'leaver@falsetrace.test')!;
    await admin.patch(`/api/admin/people/${leaver.id}`, { role: 'moderator' }).expect(200);
    await admin.patch(`/api/admin/people/${leaver.id}`, { active: false }).expect(200);
    await ctx.mail.flush();
  });
  afterAll(async () => {
    await ctx.close();
    rmSync(work, { recursive: true, force: true });
  });

  it('should restore every table and every file exactly into an empty data folder', async () => {
    const archive = path.join(work, 'quiet.zip');
    await toFile(ctx, archive);
    const expectedTables = dumpTables(path.join(ctx.config.dataDir, 'falsetrace.sqlite'));
    const expectedFiles = stateFiles(ctx.config.dataDir);
    expect(expectedFiles.size).toBeGreaterThanOrEqual(4); // screenshot, thumbnail, capture, secret

    const fresh = path.join(work, 'fresh');
    const result = await restoreBackup(archive, fresh);
    expect(result.asideDir).toBeNull();
    expect(dumpTables(path.join(fresh, 'falsetrace.sqlite'))).toEqual(expectedTables);
    expect(stateFiles(fresh)).toEqual(expectedFiles);
    const check = new SQLite(path.join(fresh, 'falsetrace.sqlite'), { readonly: true });
    expect(check.pragma('integrity_check', { simple: true })).toBe('ok');
    check.close();
  });

  it('should download a consistent backup while people keep writing, for admins only', async () => {
    await eng.get('/api/admin/backup').expect(403);
    await mod.get('/api/admin/backup').expect(403);
    const writers = Array.from({ length: 6 }, (_, i) => eng.post('/api/cases', { title: `Written during backup ${i}`, summary: 'concurrent' }));
    const [download] = await Promise.all([
      admin.get('/api/admin/backup').buffer(true).parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      }),
      ...writers,
    ]);
    expect(download.status).toBe(200);
    expect(download.headers['content-disposition']).toMatch(/attachment; filename="falsetrace-backup-/);
    const archive = path.join(work, 'online.zip');
    writeFileSync(archive, download.body as Buffer);
    const target = path.join(work, 'online');
    await restoreBackup(archive, target);
    const restored = new SQLite(path.join(target, 'falsetrace.sqlite'), { readonly: true });
    expect(restored.pragma('integrity_check', { simple: true })).toBe('ok');
    const names = restored.prepare('SELECT storage_name AS n FROM attachments UNION SELECT thumbnail_name FROM attachments WHERE thumbnail_name IS NOT NULL').all() as { n: string }[];
    restored.close();
    for (const { n } of names) expect(existsSync(path.join(target, 'uploads', n))).toBe(true);
  });

  it('should keep an existing folder’s files aside, and refuse while a server holds the folder', async () => {
    const archive = path.join(work, 'quiet.zip');
    const used = path.join(work, 'used');
    mkdirSync(path.join(used, 'uploads'), { recursive: true });
    writeFileSync(path.join(used, 'falsetrace.sqlite'), 'an older database');
    writeFileSync(path.join(used, 'uploads', 'old.png'), 'old bytes');

    writeFileSync(path.join(used, PID_FILE), String(process.pid));
    await expect(restoreBackup(archive, used)).rejects.toThrow(/server \(process \d+\) is using .*Stop it first/);
    expect(readFileSync(path.join(used, 'falsetrace.sqlite'), 'utf8')).toBe('an older database');

    rmSync(path.join(used, PID_FILE));
    const result = await restoreBackup(archive, used);
    expect(result.asideDir).toMatch(/before-restore-/);
    expect(readFileSync(path.join(result.asideDir!, 'falsetrace.sqlite'), 'utf8')).toBe('an older database');
    expect(readFileSync(path.join(result.asideDir!, 'uploads', 'old.png'), 'utf8')).toBe('old bytes');
    expect(existsSync(path.join(used, 'uploads', 'old.png'))).toBe(false);
    expect(stateFiles(used)).toEqual(stateFiles(path.join(work, 'fresh')));
  });

  it('should refuse a damaged archive and a casebook export, changing nothing', async () => {
    const target = path.join(work, 'untouched');
    mkdirSync(target, { recursive: true });
    writeFileSync(path.join(target, 'keep.txt'), 'keep');
    const bytes = readFileSync(path.join(work, 'quiet.zip'));
    const damaged = Buffer.from(bytes);
    damaged[Math.floor(damaged.length / 3)] ^= 0xff;
    writeFileSync(path.join(work, 'damaged.zip'), damaged);
    await expect(restoreBackup(path.join(work, 'damaged.zip'), target)).rejects.toThrow();
    const exported = await admin.get('/api/admin/casebook/export').buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    writeFileSync(path.join(work, 'casebook.zip'), exported.body as Buffer);
    await expect(restoreBackup(path.join(work, 'casebook.zip'), target)).rejects.toThrow(/not a Falsetrace backup/);
    expect(readdirSync(target)).toEqual(['keep.txt']);
  });
});

describe.runIf(ON_POSTGRES)('backup on PostgreSQL', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should refuse the built-in backup and point to pg_dump and the uploads directory', async () => {
    const admin = await signedIn(ctx, 'admin');
    const res = await admin.get('/api/admin/backup').expect(409);
    expect(res.body.error).toMatch(/pg_dump/);
    expect(res.body.error).toMatch(/uploads/);
  });
});
