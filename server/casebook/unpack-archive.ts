import { mkdtemp, rm } from 'node:fs/promises';
import path from 'node:path';
import type { UnpackedArchive } from './import-plan';
import { zipWorkers } from './zip-pool';

/**
 * What an uploaded archive may unpack to. Attachments are stored uncompressed in our archives, so
 * a real one unpacks to little more than it weighs (the upload limit, 500 MB); the rest is room for
 * the JSON and Markdown, which compress well. More than this is a zip bomb, not a casebook.
 */
export const UNPACK_LIMITS = { maxEntries: 100_000, maxBytes: 640 * 1024 * 1024 } as const;

export type Unpacked = ({ ok: true } & UnpackedArchive) | { ok: false; tooLarge: boolean; message: string };

/**
 * Unpacks an archive file into a fresh folder under `parentDir`, in the zip worker: declared sizes
 * are checked before anything is inflated, then entries go to disk one by one. The caller removes
 * the folder with `discard` whatever happens.
 */
export async function unpackArchive(archive: string, parentDir: string, limits: { maxEntries: number; maxBytes: number } = UNPACK_LIMITS) {
  const dir = await mkdtemp(path.join(parentDir, 'import-'));
  const discard = () => rm(dir, { recursive: true, force: true });
  try {
    const result = await zipWorkers.unpack(archive, dir, limits);
    const unpacked: Unpacked = result.ok ? { ok: true, dir, files: new Map(result.files.map((f) => [f.path, f])) } : result;
    return { unpacked, discard };
  } catch (err) {
    await discard();
    throw err;
  }
}
