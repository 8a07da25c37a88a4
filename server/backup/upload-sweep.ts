import { existsSync } from 'node:fs';
import { mkdir, readdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { isPartialName } from '../atomic-file';
import type { Db } from '../db/database';

export interface UploadDirs {
  dataDir: string;
  /** UPLOADS_DIR; DATA_DIR/uploads when absent. */
  uploadsDir?: string;
}

export interface SweepOptions {
  /**
   * Leave alone what is younger than this. 0 for a folder only this server writes; an uploads
   * folder shared by several instances holds other instances' uploads in progress.
   */
  minAgeMs?: number;
  now?: Date;
}

/**
 * Run at start, before any request: removes partial uploads a crash left (uploads/incoming and
 * half-written temp files), and moves upload files that no attachment names (written just before
 * a crash, ahead of their row) aside rather than deleting them: into DATA_DIR/orphaned-uploads/,
 * or UPLOADS_DIR/orphaned/ when the uploads live elsewhere (same filesystem, so a rename).
 */
/** A capture's `<name>.plot` folder whose capture is gone, or a scratch folder (`.<name>.samples-<id>`, `.<name>.plot-<id>`) a crash left. */
function isDerivedSampleDir(name: string, named: Set<string>): boolean {
  if (name.endsWith('.plot')) return !named.has(name.slice(0, -'.plot'.length));
  return /^\..+\.(samples|plot)-[0-9a-f-]+$/i.test(name);
}

export async function sweepUploads(db: Db, where: string | UploadDirs, options: SweepOptions = {}): Promise<{ partial: number; orphaned: number }> {
  const dirs = typeof where === 'string' ? { dataDir: where } : where;
  const uploads = dirs.uploadsDir ?? path.join(dirs.dataDir, 'uploads');
  if (!existsSync(uploads)) return { partial: 0, orphaned: 0 };
  const cutoff = (options.now ?? new Date()).getTime() - (options.minAgeMs ?? 0);
  const oldEnough = async (file: string) => (options.minAgeMs ? (await stat(file).catch(() => null))?.mtimeMs ?? Infinity : -Infinity) <= cutoff;

  const incoming = path.join(uploads, 'incoming');
  let partial = 0;
  if (existsSync(incoming)) {
    for (const name of await readdir(incoming)) {
      if (!(await oldEnough(path.join(incoming, name)))) continue;
      await rm(path.join(incoming, name), { recursive: true, force: true });
      partial++;
    }
  }
  const rows = await db.selectFrom('attachments').select(['storage_name', 'thumbnail_name']).execute();
  const named = new Set(rows.flatMap((r) => [r.storage_name, ...(r.thumbnail_name ? [r.thumbnail_name] : [])]));
  const orphans: string[] = [];
  for (const e of await readdir(uploads, { withFileTypes: true })) {
    if (e.isDirectory() && isDerivedSampleDir(e.name, named) && (await oldEnough(path.join(uploads, e.name)))) {
      // plot samples are rebuilt from their capture on first view; scratch folders are a crash's leftovers
      await rm(path.join(uploads, e.name), { recursive: true, force: true });
      partial++;
      continue;
    }
    if (!e.isFile() || named.has(e.name) || !(await oldEnough(path.join(uploads, e.name)))) continue;
    if (isPartialName(e.name)) {
      await rm(path.join(uploads, e.name), { force: true });
      partial++;
    } else orphans.push(e.name);
  }
  if (orphans.length) {
    const aside = dirs.uploadsDir ? path.join(uploads, 'orphaned') : path.join(dirs.dataDir, 'orphaned-uploads');
    await mkdir(aside, { recursive: true });
    for (const name of orphans) await rename(path.join(uploads, name), path.join(aside, name));
  }
  return { partial, orphaned: orphans.length };
}
