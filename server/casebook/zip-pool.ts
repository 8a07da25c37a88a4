import { Piscina } from 'piscina';

/** Heap cap of a zip worker: entries pass through it a chunk at a time, so this is plenty. */
export const ZIP_WORKER_HEAP_MB = 256;

let pool: Piscina | undefined;

function thePool(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./zip-worker.mjs', import.meta.url).href,
    // one archive at a time: the other core stays with requests, and two exports queue
    maxThreads: 1,
    minThreads: 0,
    idleTimeout: 30_000,
    maxQueue: 8,
    resourceLimits: { maxOldGenerationSizeMb: ZIP_WORKER_HEAP_MB, maxYoungGenerationSizeMb: 32 },
  });
  return pool;
}

export type ZipEntrySource = { name: string; file: string } | { name: string; bytes: Uint8Array };
export interface UnpackedFile {
  name: string;
  bytes: number;
  sha256: string;
}
export type UnpackResult = { ok: true; files: UnpackedFile[] } | { ok: false; tooLarge: boolean; message: string };

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
