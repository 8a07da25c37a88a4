import { existsSync } from 'node:fs';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Writable } from 'node:stream';
import SQLite from 'better-sqlite3';
import { isPartialName } from '../atomic-file';
import { sqliteOf, type Db } from '../db/database';
import type { UploadDirs } from './upload-sweep';
import { isPostgres } from '../db/dialect';
import { zipWriter, type WrittenEntry } from './zip-stream';

export const BACKUP_FORMAT = 'falsetrace-backup';
export const BACKUP_VERSION = 1;
export const MANIFEST_NAME = 'falsetrace-backup.json';
export const DATABASE_NAME = 'falsetrace.sqlite';
export const SECRET_NAME = 'session-secret';
/** Why there is no online backup on PostgreSQL, and what to do instead (README: Running for a larger team). */
export const POSTGRES_BACKUP_REFUSAL =
  'The built-in backup copies the SQLite database; this server runs on PostgreSQL (DATABASE_URL). Back up with pg_dump (pg_dump --format=custom "$DATABASE_URL" > falsetrace.dump) and copy the uploads directory beside it.';

/** The built-in backup is SQLite's online backup API; null when it can run on this database. */
export const backupRefusal = (db: Db): string | null => (isPostgres(db) ? POSTGRES_BACKUP_REFUSAL : null);

/** Uploads in progress (multer's partial files) are not part of the state. */
const SKIP_UPLOAD_DIRS = new Set(['incoming']);

export interface BackupManifest {
  format: typeof BACKUP_FORMAT;
  version: number;
  createdAt: string;
  /** Applied migrations, newest last: a restore into an older program can tell. */
  migrations: string[];
  files: WrittenEntry[];
}

/** DATA_DIR/uploads unless UPLOADS_DIR put them elsewhere. */
const uploadsOf = (dirs: UploadDirs) => dirs.uploadsDir ?? path.join(dirs.dataDir, 'uploads');

/** Every upload file name (not the partial ones, not files being written), sorted. */
async function uploadNames(uploads: string): Promise<string[]> {
  if (!existsSync(uploads)) return [];
  const entries = await readdir(uploads, { withFileTypes: true });
  return entries.filter((e) => e.isFile() && !SKIP_UPLOAD_DIRS.has(e.name) && !isPartialName(e.name)).map((e) => e.name).sort();
}

/**
 * A consistent copy of the live database through SQLite's online backup API (writers keep
 * writing meanwhile), checked so that every file its attachments name is on disk: a file
 * deleted between the copy and the read of the uploads makes the copy be taken again.
 */
async function snapshot(db: Db, uploadsDir: string, workDir: string) {
  for (let attempt = 1; ; attempt++) {
    const copy = path.join(workDir, DATABASE_NAME);
    await rm(copy, { force: true });
    await sqliteOf(db).backup(copy);
    const check = new SQLite(copy, { readonly: true });
    let referenced: string[];
    let migrations: string[];
    try {
      referenced = (check.prepare('SELECT storage_name AS n FROM attachments UNION SELECT thumbnail_name FROM attachments WHERE thumbnail_name IS NOT NULL').all() as { n: string }[]).map((r) => r.n);
      migrations = (check.prepare('SELECT name FROM kysely_migration ORDER BY name').all() as { name: string }[]).map((r) => r.name);
    } finally {
      check.close();
    }
    const present = new Set(await uploadNames(uploadsDir));
    const missing = referenced.filter((n) => !present.has(n));
    if (!missing.length) return { copy, uploads: [...present], migrations };
    if (attempt === 3) throw new Error(`Attachment files are missing from ${uploadsDir}: ${missing.slice(0, 5).join(', ')}${missing.length > 5 ? ' …' : ''}`);
  }
}

/**
 * Writes one zip with the database, every upload and the session secret to `out`, then a
 * manifest with each file's size and SHA-256. Streams: neither the database nor the uploads are
 * held in memory whole. `where` is DATA_DIR, or DATA_DIR and UPLOADS_DIR; the archive is the same
 * either way (uploads under uploads/).
 */
export async function writeBackup(db: Db, where: string | UploadDirs, out: Writable, now = new Date()): Promise<BackupManifest> {
  const dirs = typeof where === 'string' ? { dataDir: where } : where;
  const dataDir = dirs.dataDir;
  const uploadsDir = uploadsOf(dirs);
  const refusal = backupRefusal(db);
  if (refusal) throw new Error(refusal);
  const workDir = await mkdtemp(path.join(tmpdir(), 'falsetrace-backup-'));
  try {
    const { copy, uploads, migrations } = await snapshot(db, uploadsDir, workDir);
    const zip = zipWriter(out);
    const files: WrittenEntry[] = [await zip.addFile(DATABASE_NAME, copy)];
    const secret = path.join(dataDir, SECRET_NAME);
    if (existsSync(secret)) files.push(await zip.addFile(SECRET_NAME, secret));
    for (const name of uploads) {
      const file = path.join(uploadsDir, name);
      // an unreferenced file removed meanwhile is simply not part of this backup
      if (existsSync(file)) files.push(await zip.addFile(`uploads/${name}`, file));
    }
    const manifest: BackupManifest = { format: BACKUP_FORMAT, version: BACKUP_VERSION, createdAt: now.toISOString(), migrations, files };
    await zip.addBytes(MANIFEST_NAME, Buffer.from(JSON.stringify(manifest, null, 2)));
    await zip.finish();
    return manifest;
  } finally {
    await rm(workDir, { recursive: true, force: true });
  }
}

export const backupFileName = (now = new Date()) => `falsetrace-backup-${now.toISOString().replace(/[:.]/g, '-')}.zip`;
