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
      entry.push(chunk);
      await drained();
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
    if (dir.readUInt32LE(p) !== 0x02014b50) throw new Error('the zip is damaged (bad central directory entry)');
    const nameLength = dir.readUInt16LE(p + 28);
    const extraLength = dir.readUInt16LE(p + 30);
    const commentLength = dir.readUInt16LE(p + 32);
    entries.push({
      method: dir.readUInt16LE(p + 10),
      compressedSize: dir.readUInt32LE(p + 20),
      localHeaderOffset: dir.readUInt32LE(p + 42),
      name: dir.toString('utf8', p + 46, p + 46 + nameLength),
    });
    p += 46 + nameLength + extraLength + commentLength;
  }
  return entries;
}

/**
 * Unpacks a zip file into `destDir` entry by entry, as streams (never the whole archive in
 * memory), returning each written file's size and SHA-256. Reads the central directory, so entry
 * ends never depend on guessing. Refuses unsafe names and more than `maxBytes` in total.
 */
export async function unzipToDir(archive: string, destDir: string, maxBytes: number): Promise<Map<string, WrittenEntry>> {
  const written = new Map<string, WrittenEntry>();
  const fh = await open(archive, 'r');
  try {
    const head = Buffer.alloc(4);
    await fh.read(head, 0, 4, 0);
    if (head.readUInt32LE(0) !== 0x04034b50) throw new Error('the file is not a zip archive');
    let total = 0;
    for (const entry of await centralDirectory(fh)) {
      if (entry.name.endsWith('/')) continue;
      const rel = safeEntryPath(entry.name);
      if (!rel) throw new Error(`the archive holds an unsafe path "${entry.name}"`);
      if (entry.method !== 0 && entry.method !== 8) throw new Error(`"${rel}" uses an unknown compression (${entry.method})`);
      const local = Buffer.alloc(30);
      await fh.read(local, 0, 30, entry.localHeaderOffset);
      if (local.readUInt32LE(0) !== 0x04034b50) throw new Error(`the zip is damaged at "${rel}"`);
      const dataStart = entry.localHeaderOffset + 30 + local.readUInt16LE(26) + local.readUInt16LE(28);
      const target = path.join(destDir, rel);
      await mkdir(path.dirname(target), { recursive: true });
      const ws = createWriteStream(target);
      const hash = createHash('sha256');
      let bytes = 0;
      let overflow = false;
      const sink = (chunk: Uint8Array) => {
        bytes += chunk.length;
        total += chunk.length;
        if (total > maxBytes) overflow = true;
        hash.update(chunk);
        ws.write(chunk);
      };
      const inflate = entry.method === 8 ? new Inflate((chunk) => sink(chunk)) : undefined;
      const source = fh.createReadStream({ start: dataStart, end: dataStart + entry.compressedSize - 1, autoClose: false });
      if (entry.compressedSize > 0) {
        for await (const chunk of source as AsyncIterable<Buffer>) {
          if (inflate) inflate.push(chunk);
          else sink(chunk);
          if (overflow) break;
          if (ws.writableNeedDrain) await new Promise<void>((r) => ws.once('drain', () => r()));
        }
      }
      if (inflate && !overflow) inflate.push(new Uint8Array(0), true);
      await new Promise<void>((resolve, reject) => {
        ws.once('error', reject);
        ws.end(() => resolve());
      });
      if (overflow) throw new Error(`the archive unpacks to more than ${Math.round(maxBytes / 1024 ** 2)} MB`);
      written.set(rel, { path: rel, bytes, sha256: hash.digest('hex') });
    }
  } finally {
    await fh.close();
  }
  return written;
}
