import { existsSync } from 'node:fs';
import { mkdir, readdir, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import type { Db } from '../db/database';

/**
 * Run at start, before any request: removes partial uploads a crash left in uploads/incoming, and
 * moves upload files that no attachment names (written just before a crash, ahead of their row)
 * into DATA_DIR/orphaned-uploads/ rather than deleting them.
 */
export async function sweepUploads(db: Db, dataDir: string): Promise<{ partial: number; orphaned: number }> {
  const uploads = path.join(dataDir, 'uploads');
  if (!existsSync(uploads)) return { partial: 0, orphaned: 0 };
  const incoming = path.join(uploads, 'incoming');
  let partial = 0;
  if (existsSync(incoming)) {
    for (const name of await readdir(incoming)) {
      await rm(path.join(incoming, name), { recursive: true, force: true });
      partial++;
    }
  }
  const rows = await db.selectFrom('attachments').select(['storage_name', 'thumbnail_name']).execute();
  const named = new Set(rows.flatMap((r) => [r.storage_name, ...(r.thumbnail_name ? [r.thumbnail_name] : [])]));
  const entries = await readdir(uploads, { withFileTypes: true });
  const orphans = entries.filter((e) => e.isFile() && !named.has(e.name)).map((e) => e.name);
  if (orphans.length) {
    const aside = path.join(dataDir, 'orphaned-uploads');
    await mkdir(aside, { recursive: true });
    for (const name of orphans) await rename(path.join(uploads, name), path.join(aside, name));
  }
  return { partial, orphaned: orphans.length };
}
