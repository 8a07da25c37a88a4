// Runs in a zip worker thread (see zip-pool.ts): packs and unpacks casebook archives as streams,
// a chunk at a time, so neither a large export nor an archive that inflates to far more than it
// weighs stalls the server or fills its memory. The zip code itself is the backup's (zip-stream.ts).
import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { unpackZip, zipWriter, type UnpackResult } from '../backup/zip-stream';

export type ZipEntrySource = { name: string; file: string } | { name: string; bytes: Uint8Array };

export type ZipTask =
  | { op: 'hash'; files: string[] }
  | { op: 'pack'; out: string; entries: ZipEntrySource[] }
  | { op: 'unpack'; archive: string; destDir: string; maxBytes: number; maxEntries: number };

/** SHA-256 (hex) of each file, read as a stream. */
async function hash(files: string[]): Promise<string[]> {
  const out: string[] = [];
  for (const file of files) {
    const h = createHash('sha256');
    for await (const chunk of createReadStream(file)) h.update(chunk);
    out.push(h.digest('hex'));
  }
  return out;
}

/** Writes a zip of the entries, in order, to the file `out`; waits for the disk when it lags. */
async function pack(out: string, entries: ZipEntrySource[]): Promise<{ bytes: number }> {
  const ws = createWriteStream(out);
  const zip = zipWriter(ws);
  for (const e of entries) {
    if ('file' in e) await zip.addFile(e.name, e.file);
    else await zip.addBytes(e.name, e.bytes);
  }
  await zip.finish();
  return { bytes: ws.bytesWritten };
}

export default async function run(task: ZipTask): Promise<string[] | { bytes: number } | UnpackResult> {
  if (task.op === 'hash') return hash(task.files);
  if (task.op === 'pack') return pack(task.out, task.entries);
  return unpackZip(task.archive, task.destDir, { maxBytes: task.maxBytes, maxEntries: task.maxEntries });
}
