import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, open, type FileHandle } from 'node:fs/promises';
import path from 'node:path';
import type { Writable } from 'node:stream';
import { Inflate, Zip, ZipDeflate } from 'fflate';

// already-compressed formats are only framed (level 0); every entry is deflate so a streaming
// reader finds each entry's end without sizes in the local header
const COMPRESSED = /\.(png|jpe?g|gif|zip)$/i;

export interface WrittenEntry {
  path: string;
  bytes: number;
  sha256: string;
}

/** A zip written entry by entry to `out`, one file in memory a chunk at a time, with backpressure. */
export function zipWriter(out: Writable) {
  let failed: Error | undefined;
  const done = new Promise<void>((resolve, reject) => {
    out.once('finish', resolve);
    out.once('close', resolve);
    out.once('error', reject);
  });
  const zip = new Zip((err, chunk, final) => {
    if (err) {
      failed = err;
      out.destroy(err);
      return;
    }
    out.write(chunk);
    if (final) out.end();
  });
  const drained = () => (out.writableNeedDrain ? new Promise<void>((r) => out.once('drain', () => r())) : Promise.resolve());

  async function addStream(name: string, source: AsyncIterable<Buffer>): Promise<WrittenEntry> {
    const entry = new ZipDeflate(name, { level: COMPRESSED.test(name) ? 0 : 6 });
    zip.add(entry);
    const hash = createHash('sha256');
    let bytes = 0;
    for await (const chunk of source) {
      if (failed) throw failed;
      hash.update(chunk);
      bytes += chunk.length;
      // large given texts go in slices so the deflater's output reaches the disk as it comes
      for (let i = 0; i < chunk.length; i += 1 << 16) {
        entry.push(chunk.subarray(i, i + (1 << 16)));
        await drained();
      }
    }
    entry.push(new Uint8Array(0), true);
    await drained();
    return { path: name, bytes, sha256: hash.digest('hex') };
  }

  return {
    addFile: (name: string, file: string) => addStream(name, createReadStream(file)),
    addBytes: (name: string, bytes: Uint8Array) => addStream(name, (async function* () { yield Buffer.from(bytes); })()),
    async finish() {
      zip.end();
      await done;
      if (failed) throw failed;
    },
  };
}

/** A zip entry's name as a safe relative path, or null (absolute, `..`, backslashes, NUL). */
export function safeEntryPath(name: string): string | null {
  if (!name || name.endsWith('/') || name.includes('\\') || name.includes('\0') || name.startsWith('/')) return null;
  const parts = name.split('/');
  if (parts.some((p) => p === '' || p === '.' || p === '..')) return null;
  return parts.join('/');
}

interface CentralEntry {
  name: string;
  method: number;
  compressedSize: number;
  /** The size the archive says the entry unpacks to (an archive may understate it). */
  declaredSize: number;
  localHeaderOffset: number;
}

/** The archive's central directory (where a zip lists its entries with their true sizes). */
async function centralDirectory(fh: FileHandle): Promise<CentralEntry[]> {
  const { size } = await fh.stat();
  const tailLength = Math.min(size, 22 + 65_535);
  const tail = Buffer.alloc(tailLength);
  await fh.read(tail, 0, tailLength, size - tailLength);
  let eocd = -1;
  for (let i = tailLength - 22; i >= 0; i--) if (tail.readUInt32LE(i) === 0x06054b50) { eocd = i; break; }
  if (eocd < 0) throw new Error('the file is not a zip archive (no central directory)');
  const count = tail.readUInt16LE(eocd + 10);
  const dirSize = tail.readUInt32LE(eocd + 12);
  const dirOffset = tail.readUInt32LE(eocd + 16);
  if (dirOffset + dirSize > size) throw new Error('the zip is damaged (central directory out of range)');
  const dir = Buffer.alloc(dirSize);
  await fh.read(dir, 0, dirSize, dirOffset);
  const entries: CentralEntry[] = [];
  for (let i = 0, p = 0; i < count; i++) {
    if (p + 46 > dirSize || dir.readUInt32LE(p) !== 0x02014b50) throw new Error('the zip is damaged (bad central directory entry)');
    const nameLength = dir.readUInt16LE(p + 28);
    const extraLength = dir.readUInt16LE(p + 30);
    const commentLength = dir.readUInt16LE(p + 32);
    entries.push({
      method: dir.readUInt16LE(p + 10),
      compressedSize: dir.readUInt32LE(p + 20),
      declaredSize: dir.readUInt32LE(p + 24),
      localHeaderOffset: dir.readUInt32LE(p + 42),
      name: dir.toString('utf8', p + 46, p + 46 + nameLength),
    });
    p += 46 + nameLength + extraLength + commentLength;
  }
  return entries;
}

const mb = (n: number) => `${Math.round(n / 1024 ** 2)} MB`;

export type UnpackResult = { ok: true; files: WrittenEntry[] } | { ok: false; tooLarge: boolean; message: string };

/**
 * Unpacks a zip file into `destDir` entry by entry, as streams (never the whole archive in
 * memory), with each written file's size and SHA-256. Reads the central directory, so entry ends
 * never depend on guessing. First adds up the sizes the archive declares and refuses before
 * inflating anything when they pass the limits; then stops the moment the real bytes pass
 * `maxBytes` (a zip may understate its sizes). Refuses unsafe or repeated names and compressions
 * other than stored and deflate. Never throws for a bad archive: says why instead.
 */
export async function unpackZip(archive: string, destDir: string, limits: { maxBytes: number; maxEntries: number }): Promise<UnpackResult> {
  const { maxBytes, maxEntries } = limits;
  const fh = await open(archive, 'r');
  try {
    const head = Buffer.alloc(4);
    await fh.read(head, 0, 4, 0);
    if (head.readUInt32LE(0) !== 0x04034b50) return { ok: false, tooLarge: false, message: 'the file is not a zip archive' };
    let entries: CentralEntry[];
    try {
      entries = (await centralDirectory(fh)).filter((e) => !e.name.endsWith('/'));
    } catch (err) {
      return { ok: false, tooLarge: false, message: (err as Error).message };
    }
    const declared = entries.reduce((sum, e) => sum + e.declaredSize, 0);
    if (entries.length > maxEntries) return { ok: false, tooLarge: true, message: `it holds ${entries.length} files, more than the ${maxEntries} allowed` };
    if (declared > maxBytes) return { ok: false, tooLarge: true, message: `it unpacks to ${mb(declared)}, more than the ${mb(maxBytes)} allowed` };
    const files: WrittenEntry[] = [];
    const seen = new Set<string>();
    let total = 0;
    for (const e of entries) {
      const name = safeEntryPath(e.name);
      if (!name) return { ok: false, tooLarge: false, message: `it holds an unsafe path "${e.name}"` };
      if (seen.has(name)) return { ok: false, tooLarge: false, message: `it holds "${name}" twice` };
      seen.add(name);
      if (e.method !== 0 && e.method !== 8) return { ok: false, tooLarge: false, message: `"${name}" uses a compression Falsetrace does not read (${e.method})` };
      const local = Buffer.alloc(30);
      await fh.read(local, 0, 30, e.localHeaderOffset);
      if (local.readUInt32LE(0) !== 0x04034b50) return { ok: false, tooLarge: false, message: `the zip is damaged at "${name}"` };
      const dataStart = e.localHeaderOffset + 30 + local.readUInt16LE(26) + local.readUInt16LE(28);
      const target = path.join(destDir, name);
      await mkdir(path.dirname(target), { recursive: true });
      const ws = createWriteStream(target);
      const hash = createHash('sha256');
      let bytes = 0;
      let overflow = false;
      let broken: Error | undefined;
      const sink = (chunk: Uint8Array) => {
        bytes += chunk.length;
        total += chunk.length;
        if (total > maxBytes) overflow = true;
        if (overflow) return;
        hash.update(chunk);
        ws.write(chunk);
      };
      const inflate = e.method === 8 ? new Inflate((chunk) => sink(chunk)) : undefined;
      if (e.compressedSize > 0) {
        // a stream of its own per entry: streams on the one FileHandle each leave a listener on it
        const source = createReadStream(archive, { start: dataStart, end: dataStart + e.compressedSize - 1, highWaterMark: 1 << 16 });
        for await (const chunk of source as AsyncIterable<Buffer>) {
          try {
            if (inflate) inflate.push(chunk);
            else sink(chunk);
          } catch (err) {
            broken = err as Error;
          }
          if (overflow || broken) break;
          if (ws.writableNeedDrain) await new Promise<void>((r) => ws.once('drain', () => r()));
        }
      }
      try {
        if (inflate && !overflow && !broken) inflate.push(new Uint8Array(0), true);
      } catch (err) {
        broken = err as Error;
      }
      await new Promise<void>((resolve, reject) => {
        ws.once('error', reject);
        ws.end(() => resolve());
      });
      if (overflow) return { ok: false, tooLarge: true, message: `it unpacks to more than the ${mb(maxBytes)} allowed (its sizes are understated)` };
      if (broken) return { ok: false, tooLarge: false, message: `the zip is damaged at "${name}" (${broken.message || 'unreadable'})` };
      files.push({ path: name, bytes, sha256: hash.digest('hex') });
    }
    return { ok: true, files };
  } finally {
    await fh.close();
  }
}

/** `unpackZip` for a backup being restored: the files by path, or an error saying why not. */
export async function unzipToDir(archive: string, destDir: string, maxBytes: number): Promise<Map<string, WrittenEntry>> {
  const result = await unpackZip(archive, destDir, { maxBytes, maxEntries: Number.MAX_SAFE_INTEGER });
  if (!result.ok) throw new Error(`the archive cannot be restored: ${result.message}`);
  return new Map(result.files.map((f) => [f.path, f]));
}
