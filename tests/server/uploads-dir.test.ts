import { createWriteStream, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { copyFileAtomic, isPartialName, writeFileAtomic } from '../../server/atomic-file';
import { writeBackup } from '../../server/backup/backup';
import { restoreBackup } from '../../server/backup/restore';
import { sweepUploads } from '../../server/backup/upload-sweep';
import { loadConfig } from '../../server/config';
import { storagePaths } from '../../server/storage';
import { pngBytes, stepCsv } from './helpers/fixtures';
import { createTestContext, ON_POSTGRES, signedIn, type TestContext } from './helpers/test-context';

const work = mkdtempSync(path.join(tmpdir(), 'falsetrace-uploads-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));
const fresh = (name: string) => {
  const dir = path.join(work, name);
  mkdirSync(dir, { recursive: true });
  return dir;
};

describe('atomic writes of upload files', () => {
  it('should leave neither the final name nor a temp file when a write fails half way', async () => {
    const dir = fresh('failing');
    const target = path.join(dir, 'shot.png');
    async function* halfThenFail() {
      yield Buffer.alloc(64 * 1024, 1);
      throw new Error('disk went away');
    }
    await expect(writeFileAtomic(target, halfThenFail() as unknown as Uint8Array)).rejects.toThrow('disk went away');
    expect(readdirSync(dir)).toEqual([]);
  });

  it('should show the final name only once the whole file is there', async () => {
    const dir = fresh('gated');
    const target = path.join(dir, 'capture.csv');
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    let firstWritten!: () => void;
    const started = new Promise<void>((r) => (firstWritten = r));
    async function* slow() {
      yield Buffer.from('t,v\n0,0\n');
      firstWritten();
      await gate;
      yield Buffer.from('1,1\n');
    }
    const writing = writeFileAtomic(target, slow() as unknown as Uint8Array);
    await started;
    // half written: only a temp name exists, in the same folder
    expect(existsSync(target)).toBe(false);
    expect(readdirSync(dir).every(isPartialName)).toBe(true);
    release();
    await writing;
    expect(readdirSync(dir)).toEqual(['capture.csv']);
    expect(readFileSync(target, 'utf8')).toBe('t,v\n0,0\n1,1\n');
  });

  it('should copy a file under its final name without leaving a temp file when the source is missing', async () => {
    const dir = fresh('copy');
    await expect(copyFileAtomic(path.join(dir, 'no-such-file'), path.join(dir, 'copy.csv'))).rejects.toThrow();
    expect(readdirSync(dir)).toEqual([]);
  });
});

describe('UPLOADS_DIR', () => {
  it('should be read from the environment, and default to DATA_DIR/uploads', () => {
    const dataDir = fresh('config-data');
    expect(loadConfig({ DATA_DIR: dataDir, UPLOADS_DIR: path.join(work, 'shared') }).uploadsDir).toBe(path.join(work, 'shared'));
    const plain = loadConfig({ DATA_DIR: dataDir });
    expect(plain.uploadsDir).toBeUndefined();
    expect(storagePaths(plain).uploadsDir).toBe(path.join(dataDir, 'uploads'));
  });

  let ctx: TestContext;
  let uploads: string;
  let names: string[];
  beforeAll(async () => {
    uploads = path.join(work, 'shared-uploads');
    ctx = await createTestContext({ onDisk: true, uploadsDir: uploads });
  });
  afterAll(() => ctx.close());

  it('should store screenshots, thumbnails and captures there, none in DATA_DIR', async () => {
    const eng = await signedIn(ctx, 'engineer');
    const id = (await eng.post('/api/cases', { title: 'Shared uploads', summary: 'files in UPLOADS_DIR' }).expect(201)).body.case.id;
    const shot = (await eng.upload(`/api/cases/${id}/attachments`, await pngBytes(64, 48), 'scope.png', 'image/png').expect(201)).body.attachment;
    await eng.upload(`/api/cases/${id}/attachments`, stepCsv(200), 'edge.csv', 'text/csv').expect(201);
    names = readdirSync(uploads, { withFileTypes: true }).filter((e) => e.isFile()).map((e) => e.name).sort();
    expect(names.filter((n) => n.endsWith('.csv'))).toHaveLength(1);
    expect(names.filter((n) => n.includes('.thumb.'))).toHaveLength(1);
    expect(names).toHaveLength(3);
    expect(names.some(isPartialName)).toBe(false);
    expect(existsSync(path.join(ctx.config.dataDir, 'uploads')) ? readdirSync(path.join(ctx.config.dataDir, 'uploads')) : []).toEqual([]);
    const file = await eng.get(`/api/attachments/${shot.id}/file`).expect(200);
    expect(file.headers['content-type']).toMatch(/^image\//);
    await eng.get(`/api/attachments/${shot.id}/thumbnail`).expect(200);
  });

  it('should sweep that folder, and leave young files alone when asked (other instances are writing)', async () => {
    writeFileSync(path.join(uploads, 'incoming', 'another-instance-uploading'), 'partial');
    writeFileSync(path.join(uploads, 'written-ahead-of-its-row.png'), 'young');
    writeFileSync(path.join(uploads, '.partial-0123-crashed.png'), 'half');
    const hourAgo = new Date(Date.now() - 2 * 60 * 60 * 1000);
    utimesSync(path.join(uploads, '.partial-0123-crashed.png'), hourAgo, hourAgo);
    const dirs = { dataDir: ctx.config.dataDir, uploadsDir: uploads };
    expect(await sweepUploads(ctx.db, dirs, { minAgeMs: 60 * 60 * 1000 })).toEqual({ partial: 1, orphaned: 0 });
    expect(existsSync(path.join(uploads, 'incoming', 'another-instance-uploading'))).toBe(true);
    expect(existsSync(path.join(uploads, 'written-ahead-of-its-row.png'))).toBe(true);
    // with no grace (a single server after a crash) both go
    expect(await sweepUploads(ctx.db, dirs)).toEqual({ partial: 1, orphaned: 1 });
    expect(readFileSync(path.join(uploads, 'orphaned', 'written-ahead-of-its-row.png'), 'utf8')).toBe('young');
    const left = readdirSync(uploads, { withFileTypes: true }).filter((e) => e.isFile()).map((e) => e.name).sort();
    expect(left).toEqual(names);
  });

  // the built-in backup is SQLite's; on PostgreSQL it refuses and points at pg_dump (backup-restore.test.ts)
  it.skipIf(ON_POSTGRES)('should back up the uploads from that folder and restore them into it', async () => {
    const archive = path.join(work, 'backup.zip');
    const manifest = await writeBackup(ctx.db, { dataDir: ctx.config.dataDir, uploadsDir: uploads }, createWriteStream(archive));
    expect(manifest.files.map((f) => f.path).filter((p) => p.startsWith('uploads/')).sort()).toEqual(names.map((n) => `uploads/${n}`));

    const targetData = fresh('restored-data');
    const targetUploads = fresh('restored-uploads');
    writeFileSync(path.join(targetUploads, 'older.png'), 'older bytes');
    const result = await restoreBackup(archive, { dataDir: targetData, uploadsDir: targetUploads });
    const restored = readdirSync(targetUploads, { withFileTypes: true }).filter((e) => e.isFile()).map((e) => e.name).sort();
    expect(restored).toEqual(names);
    for (const n of names) expect(readFileSync(path.join(targetUploads, n))).toEqual(readFileSync(path.join(uploads, n)));
    expect(readFileSync(path.join(result.uploadsAsideDir!, 'older.png'), 'utf8')).toBe('older bytes');
    expect(existsSync(path.join(targetData, 'falsetrace.sqlite'))).toBe(true);
    expect(existsSync(path.join(targetData, 'uploads'))).toBe(false);
  });
});
