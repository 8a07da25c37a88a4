import { unzipSync, zipSync, type Zippable } from 'fflate';

/** Limits on what an uploaded archive may unpack to, so a small zip cannot fill the memory. */
export const UNZIP_LIMITS = { entries: 100_000, totalBytes: 1024 * 1024 * 1024 } as const;

// already-compressed formats are stored, not deflated again
const STORED = /\.(png|jpe?g|gif|zip)$/i;

/** A zip of the given files (path → bytes), paths kept exactly as given. */
export function zipFiles(files: Map<string, Uint8Array>): Buffer {
  const tree: Zippable = {};
  for (const [name, bytes] of files) tree[name] = [bytes, { level: STORED.test(name) ? 0 : 6 }];
  return Buffer.from(zipSync(tree));
}

export type UnzipResult = { ok: true; files: Map<string, Uint8Array> } | { ok: false; message: string };

/** The files of a zip, or why it cannot be read (not a zip, damaged, or too big once unpacked). */
export function unzipFiles(bytes: Uint8Array): UnzipResult {
  if (bytes.length < 22 || bytes[0] !== 0x50 || bytes[1] !== 0x4b) return { ok: false, message: 'the file is not a zip archive' };
  let entries = 0;
  let total = 0;
  let tooBig = false;
  try {
    const out = unzipSync(bytes, {
      filter: (f) => {
        entries++;
        total += f.originalSize;
        if (entries > UNZIP_LIMITS.entries || total > UNZIP_LIMITS.totalBytes) tooBig = true;
        return !tooBig && !f.name.endsWith('/');
      },
    });
    if (tooBig) return { ok: false, message: `it unpacks to more than ${UNZIP_LIMITS.entries} files or ${UNZIP_LIMITS.totalBytes / 1024 ** 3} GB` };
    return { ok: true, files: new Map(Object.entries(out)) };
  } catch (err) {
    return { ok: false, message: `the zip is damaged (${(err as Error).message || 'unreadable'})` };
  }
}
