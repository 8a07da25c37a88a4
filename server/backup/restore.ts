import { existsSync, readFileSync, statSync } from 'node:fs';
import { mkdir, readdir, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import SQLite from 'better-sqlite3';
import { moveFileAtomic } from '../atomic-file';
import { DATABASE_NAME, MANIFEST_NAME, BACKUP_FORMAT, type BackupManifest } from './backup';
import type { UploadDirs } from './upload-sweep';
import { PID_FILE, serverHolding } from './server-lock';
import { unzipToDir } from './zip-stream';

/** Generous: a restore reads an operator's own archive, but a wrong file must not fill the disk. */
export const RESTORE_LIMIT_BYTES = 256 * 1024 ** 3;

export interface RestoreResult {
  files: number;
  /** Where the data folder's previous files were moved, or null when it was empty. */
  asideDir: string | null;
  /** With UPLOADS_DIR elsewhere: where its previous files were moved (inside it), or null. */
  uploadsAsideDir?: string | null;
  manifest: BackupManifest;
}

const ASIDE_PREFIX = 'before-restore-';
const STAGING_PREFIX = '.restore-';

/**
 * Restores a backup archive into `dataDir` (empty or not) with the server stopped: unpacks into
 * a staging folder, checks every file against the manifest and the database's integrity, moves
 * what the folder held into `before-restore-<time>/`, then moves the backup in. With UPLOADS_DIR
 * outside DATA_DIR (`where.uploadsDir`), the uploads go there, and what it held moves into its
 * own `before-restore-<time>/` (same filesystem, so renames).
 */
export async function restoreBackup(archive: string, where: string | UploadDirs, now = new Date()): Promise<RestoreResult> {
  const { dataDir, uploadsDir } = typeof where === 'string' ? { dataDir: where, uploadsDir: undefined } : where;
  const separateUploads = uploadsDir !== undefined && path.resolve(uploadsDir) !== path.resolve(dataDir, 'uploads');
  if (!existsSync(archive)) throw new Error(`No such backup file: ${archive}`);
  await mkdir(dataDir, { recursive: true });
  const holder = serverHolding(dataDir);
  if (holder) throw new Error(`A Falsetrace server (process ${holder}) is using ${dataDir}. Stop it first, then restore.`);
  const stamp = now.toISOString().replace(/[:.]/g, '-');
  const staging = path.join(dataDir, `${STAGING_PREFIX}${stamp}`);
  try {
    const written = await unzipToDir(archive, staging, RESTORE_LIMIT_BYTES);
    const manifestEntry = written.get(MANIFEST_NAME);
    if (!manifestEntry) throw new Error(`${archive} is not a Falsetrace backup (no ${MANIFEST_NAME}); a casebook export is imported from the People page instead`);
    const manifest = JSON.parse(readFileSync(path.join(staging, MANIFEST_NAME), 'utf8')) as BackupManifest;
    if (manifest.format !== BACKUP_FORMAT) throw new Error(`${archive} is not a Falsetrace backup (format "${manifest.format}")`);
    for (const f of manifest.files) {
      const got = written.get(f.path);
      if (!got || got.sha256 !== f.sha256 || got.bytes !== f.bytes) throw new Error(`The backup is damaged: ${f.path} ${got ? 'differs from its checksum' : 'is missing'}`);
    }
    const extra = [...written.keys()].filter((p) => p !== MANIFEST_NAME && !manifest.files.some((f) => f.path === p));
    if (extra.length) throw new Error(`The backup holds files its manifest does not list: ${extra.slice(0, 5).join(', ')}`);
    const check = new SQLite(path.join(staging, DATABASE_NAME), { readonly: true });
    try {
      const result = check.pragma('integrity_check', { simple: true });
      if (result !== 'ok') throw new Error(`The backup's database fails its integrity check: ${String(result)}`);
    } finally {
      check.close();
    }
    // the check may leave SQLite's side files; the backup holds a complete database without them
    const wal = path.join(staging, `${DATABASE_NAME}-wal`);
    if (existsSync(wal) && statSync(wal).size === 0) await rm(wal);
    await rm(path.join(staging, `${DATABASE_NAME}-shm`), { force: true });
    await rm(path.join(staging, MANIFEST_NAME));

    const uploadsAsideDir = separateUploads ? await restoreUploadsInto(path.join(staging, 'uploads'), uploadsDir, `${ASIDE_PREFIX}${stamp}`) : undefined;
    // an UPLOADS_DIR inside DATA_DIR stays where it is
    const keep = separateUploads ? path.relative(dataDir, uploadsDir).split(path.sep)[0] : undefined;
    const current = (await readdir(dataDir)).filter((n) => n !== path.basename(staging) && !n.startsWith(ASIDE_PREFIX) && n !== PID_FILE && n !== keep);
    let asideDir: string | null = null;
    if (current.length) {
      asideDir = path.join(dataDir, `${ASIDE_PREFIX}${stamp}`);
      await mkdir(asideDir);
      for (const name of current) await rename(path.join(dataDir, name), path.join(asideDir, name));
    }
    for (const name of await readdir(staging)) await rename(path.join(staging, name), path.join(dataDir, name));
    return { files: manifest.files.length, asideDir, manifest, ...(separateUploads ? { uploadsAsideDir } : {}) };
  } finally {
    await rm(staging, { recursive: true, force: true });
  }
}

/**
 * Moves the uploads folder's files into `<uploads>/<asideName>/` and the backup's uploads in
 * (atomically, also across filesystems); removes the staged uploads folder. Returns the aside
 * folder, or null when the uploads folder held no files.
 */
async function restoreUploadsInto(staged: string, uploadsDir: string, asideName: string): Promise<string | null> {
  await mkdir(uploadsDir, { recursive: true });
  const current = (await readdir(uploadsDir, { withFileTypes: true })).filter((e) => e.isFile()).map((e) => e.name);
  let aside: string | null = null;
  if (current.length) {
    aside = path.join(uploadsDir, asideName);
    await mkdir(aside);
    for (const name of current) await rename(path.join(uploadsDir, name), path.join(aside, name));
  }
  if (existsSync(staged)) {
    for (const name of await readdir(staged)) await moveFileAtomic(path.join(staged, name), path.join(uploadsDir, name));
    await rm(staged, { recursive: true, force: true });
  }
  return aside;
}
