import { Piscina } from 'piscina';
import type { UnpackResult } from '../backup/zip-stream';
import { workerEntry } from '../worker-entry';
import type { ZipEntrySource } from './zip-worker';

/** Heap cap of a zip worker: entries pass through it a chunk at a time, so this is plenty. */
export const ZIP_WORKER_HEAP_MB = 256;

let pool: Piscina | undefined;

function thePool(): Piscina {
  pool ??= new Piscina({
    ...workerEntry('zip-worker', new URL('./zip-worker.ts', import.meta.url)),
    // one archive at a time: the other core stays with requests, and two exports queue
    maxThreads: 1,
    minThreads: 0,
    idleTimeout: 30_000,
    maxQueue: 8,
    resourceLimits: { maxOldGenerationSizeMb: ZIP_WORKER_HEAP_MB, maxYoungGenerationSizeMb: 32 },
  });
  return pool;
}

export type { ZipEntrySource, UnpackResult };

/** Packing and unpacking casebook archives, off the request thread. */
export const zipWorkers = {
  /** SHA-256 (hex) of each file on disk. */
  hash: (files: string[]): Promise<string[]> => thePool().run({ op: 'hash', files }),
  /** Writes a zip of the entries, in order, to the file `out`. */
  pack: (out: string, entries: ZipEntrySource[]): Promise<{ bytes: number }> => thePool().run({ op: 'pack', out, entries }),
  /** Unpacks a zip into `destDir`, refusing before inflating when its declared sizes pass the limits. */
  unpack: (archive: string, destDir: string, limits: { maxBytes: number; maxEntries: number }): Promise<UnpackResult> =>
    thePool().run({ op: 'unpack', archive, destDir, ...limits }),
  async close() {
    const p = pool;
    pool = undefined;
    await p?.destroy();
  },
};
