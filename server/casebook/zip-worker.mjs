// Runs in a worker thread (plain JavaScript, so node loads it under tsx, vitest and the compiled
// server alike). Packs and unpacks casebook archives as streams, a chunk at a time, so neither a
// large export nor an archive that inflates to far more than it weighs stalls the server or fills
// its memory.
import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, open } from 'node:fs/promises';
import path from 'node:path';
import { Inflate, Zip, ZipDeflate } from 'fflate';

// already-compressed formats are only framed (level 0)
const COMPRESSED = /\.(png|jpe?g|gif|zip)$/i;

/** @param {{ files: string[] }} task  SHA-256 (hex) of each file, read as a stream. */
async function hash({ files }) {
  const out = [];
  for (const file of files) {
    const h = createHash('sha256');
    for await (const chunk of createReadStream(file)) h.update(chunk);
    out.push(h.digest('hex'));
  }
  return out;
}

/**
 * Writes a zip to `out`, entry by entry: `{ name, file }` is streamed from disk, `{ name, bytes }`
 * is given. Waits for the disk when it lags, so at most a few chunks are in memory.
 * @param {{ out: string, entries: ({ name: string, file: string } | { name: string, bytes: Uint8Array })[] }} task
 */
async function pack({ out, entries }) {
  const ws = createWriteStream(out);
  let failed;
  const done = new Promise((resolve, reject) => {
    ws.once('finish', resolve);
    ws.once('error', reject);
  });
  const zip = new Zip((err, chunk, final) => {
    if (err) return void (failed = err);
    ws.write(chunk);
    if (final) ws.end();
  });
  const drained = () => (ws.writableNeedDrain ? new Promise((r) => ws.once('drain', r)) : Promise.resolve());
  for (const e of entries) {
    const entry = new ZipDeflate(e.name, { level: COMPRESSED.test(e.name) ? 0 : 6 });
    zip.add(entry);
    const source = 'file' in e ? createReadStream(e.file) : [Buffer.from(e.bytes.buffer, e.bytes.byteOffset, e.bytes.byteLength)];
    for await (const chunk of source) {
      // large given texts go in slices so the deflater's output reaches the disk as it comes
      for (let i = 0; i < chunk.length; i += 1 << 16) {
        entry.push(chunk.subarray(i, i + (1 << 16)));
        await drained();
      }
      if (failed) throw failed;
    }
    entry.push(new Uint8Array(0), true);
    await drained();
  }
  zip.end();
  await done;
  if (failed) throw failed;
  return { bytes: ws.bytesWritten };
}

/** A zip entry's name as a safe relative path, or null (absolute, `..`, backslashes, NUL). */
function safeEntryPath(name) {
  if (!name || name.includes('\\') || name.includes('\0') || name.startsWith('/')) return null;
  const parts = name.split('/');
  return parts.some((p) => p === '' || p === '.' || p === '..') ? null : name;
}

/** The central directory: every entry with the sizes the archive declares for it. */
async function centralDirectory(fh) {
  const { size } = await fh.stat();
  const tailLength = Math.min(size, 22 + 65_535);
  const tail = Buffer.alloc(tailLength);
  await fh.read(tail, 0, tailLength, size - tailLength);
  let eocd = -1;
  for (let i = tailLength - 22; i >= 0; i--) if (tail.readUInt32LE(i) === 0x06054b50) { eocd = i; break; }
  if (eocd < 0) throw new Error('the file is not a zip archive');
  const count = tail.readUInt16LE(eocd + 10);
  const dirSize = tail.readUInt32LE(eocd + 12);
  const dirOffset = tail.readUInt32LE(eocd + 16);
  if (dirOffset + dirSize > size) throw new Error('the zip is damaged (its directory is out of range)');
  const dir = Buffer.alloc(dirSize);
  await fh.read(dir, 0, dirSize, dirOffset);
  const entries = [];
  for (let i = 0, p = 0; i < count; i++) {
    if (p + 46 > dirSize || dir.readUInt32LE(p) !== 0x02014b50) throw new Error('the zip is damaged (bad directory entry)');
    const nameLength = dir.readUInt16LE(p + 28);
    entries.push({
      method: dir.readUInt16LE(p + 10),
      compressedSize: dir.readUInt32LE(p + 20),
      declaredSize: dir.readUInt32LE(p + 24),
      localHeaderOffset: dir.readUInt32LE(p + 42),
      name: dir.toString('utf8', p + 46, p + 46 + nameLength),
    });
    p += 46 + nameLength + dir.readUInt16LE(p + 30) + dir.readUInt16LE(p + 32);
  }
  return entries;
}

const mb = (n) => `${Math.round(n / 1024 ** 2)} MB`;

/**
 * Unpacks `archive` into `destDir` entry by entry. First adds up the sizes the archive declares
 * and refuses before inflating anything when they pass the limits; then inflates as a stream and
 * stops the moment the real bytes pass `maxBytes` (a zip may understate its sizes).
 * Answers `{ ok: true, files: [{ name, bytes, sha256 }] }` or `{ ok: false, tooLarge, message }`.
 * @param {{ archive: string, destDir: string, maxBytes: number, maxEntries: number }} task
 */
async function unpack({ archive, destDir, maxBytes, maxEntries }) {
  const fh = await open(archive, 'r');
  try {
    const head = Buffer.alloc(4);
    await fh.read(head, 0, 4, 0);
    if (head.readUInt32LE(0) !== 0x04034b50) return { ok: false, tooLarge: false, message: 'the file is not a zip archive' };
    let entries;
    try {
      entries = (await centralDirectory(fh)).filter((e) => !e.name.endsWith('/'));
    } catch (err) {
      return { ok: false, tooLarge: false, message: err.message };
    }
    const declared = entries.reduce((sum, e) => sum + e.declaredSize, 0);
    if (entries.length > maxEntries) return { ok: false, tooLarge: true, message: `it holds ${entries.length} files, more than the ${maxEntries} allowed` };
    if (declared > maxBytes) return { ok: false, tooLarge: true, message: `it unpacks to ${mb(declared)}, more than the ${mb(maxBytes)} allowed` };
    const files = [];
    const seen = new Set();
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
      const h = createHash('sha256');
      let bytes = 0;
      let overflow = false;
      let broken;
      const sink = (chunk) => {
        bytes += chunk.length;
        total += chunk.length;
        if (total > maxBytes) overflow = true;
        if (overflow) return;
        h.update(chunk);
        ws.write(chunk);
      };
      const inflate = e.method === 8 ? new Inflate((chunk) => sink(chunk)) : undefined;
      if (e.compressedSize > 0) {
        const source = fh.createReadStream({ start: dataStart, end: dataStart + e.compressedSize - 1, autoClose: false, highWaterMark: 1 << 16 });
        for await (const chunk of source) {
          try {
            if (inflate) inflate.push(chunk);
            else sink(chunk);
          } catch (err) {
            broken = err;
          }
          if (overflow || broken) break;
          if (ws.writableNeedDrain) await new Promise((r) => ws.once('drain', r));
        }
      }
      try {
        if (inflate && !overflow && !broken) inflate.push(new Uint8Array(0), true);
      } catch (err) {
        broken = err;
      }
      await new Promise((resolve, reject) => {
        ws.once('error', reject);
        ws.end(resolve);
      });
      if (overflow) return { ok: false, tooLarge: true, message: `it unpacks to more than the ${mb(maxBytes)} allowed (its sizes are understated)` };
      if (broken) return { ok: false, tooLarge: false, message: `the zip is damaged at "${name}" (${broken.message || 'unreadable'})` };
      files.push({ name, bytes, sha256: h.digest('hex') });
    }
    return { ok: true, files };
  } finally {
    await fh.close();
  }
}

/** @param {{ op: 'hash' | 'pack' | 'unpack' }} task */
export default async function run(task) {
  if (task.op === 'hash') return hash(task);
  if (task.op === 'pack') return pack(task);
  if (task.op === 'unpack') return unpack(task);
  throw new Error(`unknown zip task ${task.op}`);
}
