import { randomUUID } from 'node:crypto';
import { open, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import { ByteCaptureParser } from '../../shared/capture/parse-bytes';
import type { ParsedColumns } from '../../shared/capture/parse';
import type { CaptureParseOptions } from '../../shared/capture/types';
import { BackHalfSplit } from './back-half';
import type { BackHalfResult, BackHalfTask } from './back-half-worker';
import { feedCaptureStream, SkippedBytes } from './read-capture-stream';
import { writePlotStore } from './plot-store-writer';
import { openStore, SampleFileWriter, type OpenStore } from './sample-store';

// Large reads: fewer trips through the stream machinery for a file of a gigabyte.
export const READ_CHUNK_BYTES = 1 << 19;
/**
 * The first read is small: it holds the header (read as text to find the layout) and the rows
 * the bytes reader does not yet take, and on a large file the second thread starts only after
 * it (512 KB first took 5–8 ms of one thread before the other could start).
 */
export const FIRST_READ_BYTES = 1 << 16;

/**
 * The bytes of a file, a chunk at a time, read into two buffers used in turn: the next chunk is
 * read (on libuv's thread pool) while the caller parses this one, so the parse does not wait
 * for each read. Reusing the buffers matters too: a stream's fresh 512 KB buffer per chunk is
 * freed only when the heap is next collected, and with little else to collect they piled up
 * into tens of MB of resident memory. Each chunk is valid until the next is asked for; the
 * reader copies what it keeps.
 *
 * With a `split`, once the layout is known the back half of a large file may go to a second thread:
 * the chunks then stop at the split, and go on from where the other thread's rows end (the
 * bytes between are announced as `SkippedBytes`).
 */
async function* fileChunks(file: string, split?: BackHalfSplit): AsyncGenerator<Buffer | SkippedBytes> {
  const handle = await open(file, 'r');
  const buffers = [Buffer.allocUnsafe(READ_CHUNK_BYTES), Buffer.allocUnsafe(READ_CHUNK_BYTES)];
  const size = split ? (await handle.stat()).size : Number.POSITIVE_INFINITY;
  let limit = size; // this thread reads up to here
  let position = 0;
  let which = 0;
  const readNext = () =>
    position < limit ? handle.read(buffers[which], 0, Math.min(position === 0 ? FIRST_READ_BYTES : READ_CHUNK_BYTES, limit - position), position) : Promise.resolve({ bytesRead: 0 });
  let reading: Promise<{ bytesRead: number }> | null = readNext();
  try {
    for (;;) {
      const { bytesRead } = await reading;
      reading = null;
      if (bytesRead === 0) {
        if (limit === size) return;
        // at the split: everything before it is parsed
        const { resumeByte, skippedBytes } = await split!.join();
        if (skippedBytes > 0) yield new SkippedBytes(skippedBytes);
        position = resumeByte;
        limit = size;
        reading = readNext();
        continue;
      }
      const chunk = buffers[which].subarray(0, bytesRead);
      position += bytesRead;
      which = 1 - which;
      reading = readNext();
      yield chunk;
      if (split && !split.decided) {
        // the chunk read now ends at position + READ_CHUNK_BYTES at most: split after it
        const at = await split.start(handle, position + READ_CHUNK_BYTES, size);
        if (at !== null) limit = at;
      }
    }
  } finally {
    // a caller that stops early leaves a read in flight: let it land before the file is closed
    await reading?.catch(() => undefined);
    await split?.settle();
    await handle.close();
  }
}

/** A scratch directory beside `file` (same disk, never a RAM-backed temp dir), removed by the caller. */
export function scratchDirFor(file: string, purpose: string): string {
  return path.join(path.dirname(file), `.${path.basename(file)}.${purpose}-${randomUUID()}`);
}

/** How a read is split between two threads (back-half.ts): the size that splits, and for tests the other thread. */
export interface ReadTuning {
  splitMinBytes?: number;
  backHalf?: (task: BackHalfTask) => Promise<BackHalfResult>;
}

/**
 * Parses a capture file into a store on disk (`dir`, one binary file per column) in one
 * streaming pass: memory stays a few blocks whatever the size of the file. On failure nothing
 * usable is left in `dir` (the caller removes it either way).
 */
export async function readCaptureToStore(
  file: string,
  dir: string,
  options: CaptureParseOptions = {},
  tuning: ReadTuning = {},
): Promise<{ ok: true; columns: ParsedColumns; store: OpenStore } | { ok: false; message: string }> {
  let writer: SampleFileWriter | null = null;
  const parser = new ByteCaptureParser(options, (count) => (writer = new SampleFileWriter(dir, count)));
  const split = new BackHalfSplit(file, dir, parser, () => writer, tuning.splitMinBytes, tuning.backHalf);
  const fed = await feedCaptureStream(fileChunks(file, split), parser);
  const w = writer as SampleFileWriter | null;
  if (fed.error !== null) {
    w?.abandon();
    return { ok: false, message: fed.error.message };
  }
  const columns = parser.finishColumns();
  if (!columns.ok || w === null) {
    w?.abandon();
    return { ok: false, message: columns.ok ? 'no samples' : columns.error.message };
  }
  w.close({ timeExp10: columns.timeExp10, channelExp10s: columns.channelExp10s });
  if (fed.note !== null) columns.notes.push(fed.note);
  return { ok: true, columns, store: openStore(dir) };
}

/** Where the compact samples of a stored capture file are kept for plotting. */
export const plotStoreDirFor = (file: string) => `${file}.plot`;

/**
 * Writes the plot store of an open store to `target`, through a scratch directory renamed into
 * place, so a reader never sees half a store.
 */
export async function savePlotStore(store: OpenStore, target: string): Promise<void> {
  const scratch = scratchDirFor(target, 'plot');
  try {
    writePlotStore(store, scratch);
    await rm(target, { recursive: true, force: true });
    await rename(scratch, target);
  } finally {
    await rm(scratch, { recursive: true, force: true });
  }
}

/**
 * Builds the plot store of a capture file stored before plot stores were written at upload:
 * parses it into a scratch store beside it and keeps the compact samples in `dir`.
 */
export async function buildPlotStore(file: string, dir: string): Promise<{ ok: true } | { ok: false; message: string }> {
  const scratch = scratchDirFor(file, 'samples');
  try {
    const parsed = await readCaptureToStore(file, scratch);
    if (!parsed.ok) return parsed;
    try {
      await savePlotStore(parsed.store, dir);
    } finally {
      parsed.store.close();
    }
    return { ok: true };
  } finally {
    await rm(scratch, { recursive: true, force: true });
  }
}
