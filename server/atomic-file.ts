import { randomBytes } from 'node:crypto';
import { copyFile, open, rename, rm } from 'node:fs/promises';
import path from 'node:path';

/** Files being written carry this prefix in their final folder; sweeps and backups skip them. */
export const PARTIAL_PREFIX = '.partial-';
export const isPartialName = (name: string) => name.startsWith(PARTIAL_PREFIX);

const tempBeside = (target: string) => path.join(path.dirname(target), `${PARTIAL_PREFIX}${randomBytes(8).toString('hex')}-${path.basename(target)}`);

/** Flushes a folder's entries, so a rename survives a power cut; some filesystems refuse, which is no error. */
async function syncDir(dir: string) {
  const fh = await open(dir, 'r').catch(() => undefined);
  if (!fh) return;
  try {
    await fh.sync();
  } catch {
    // e.g. network filesystems that do not fsync directories
  } finally {
    await fh.close();
  }
}

/** Finishes a temp file: flush it, give it its final name, flush the folder. Removes it on failure. */
async function settle(temp: string, target: string) {
  try {
    const fh = await open(temp, 'r+');
    try {
      await fh.sync();
    } finally {
      await fh.close();
    }
    await rename(temp, target);
  } catch (err) {
    await rm(temp, { force: true });
    throw err;
  }
  await syncDir(path.dirname(target));
}

/**
 * Writes `data` so that `target` is either absent or complete, never half written, even for an
 * instance reading the same shared folder meanwhile: temp name in the same folder, fsync, rename.
 */
export async function writeFileAtomic(target: string, data: Uint8Array | string): Promise<void> {
  const temp = tempBeside(target);
  try {
    const fh = await open(temp, 'wx', 0o644);
    try {
      await fh.writeFile(data);
    } finally {
      await fh.close();
    }
  } catch (err) {
    await rm(temp, { force: true });
    throw err;
  }
  await settle(temp, target);
}

/** Copies `source` to `target` with the same guarantee as `writeFileAtomic`. */
export async function copyFileAtomic(source: string, target: string): Promise<void> {
  const temp = tempBeside(target);
  try {
    await copyFile(source, temp);
  } catch (err) {
    await rm(temp, { force: true });
    throw err;
  }
  await settle(temp, target);
}

/**
 * Moves a finished file under `target`: a flush and a rename when both are on one filesystem,
 * else an atomic copy and the removal of the source.
 */
export async function moveFileAtomic(source: string, target: string): Promise<void> {
  const fh = await open(source, 'r+');
  try {
    await fh.sync();
  } finally {
    await fh.close();
  }
  try {
    await rename(source, target);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EXDEV') throw err;
    await copyFileAtomic(source, target);
    await rm(source, { force: true });
    return;
  }
  await syncDir(path.dirname(target));
}
