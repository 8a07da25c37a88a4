import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';

export interface DecodedImage {
  image: Uint8Array;
  thumbnail: Uint8Array;
  width: number;
  height: number;
}

/** Heap cap of one decode worker; a decoder that runs away is killed, not the server. */
export const WORKER_HEAP_MB = 384;

let pool: Piscina | undefined;

function thePool(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./reencode-worker.mjs', import.meta.url).href,
    // on 2 cores one decode at a time leaves the other core to requests
    maxThreads: Math.max(1, Math.min(2, availableParallelism() - 1)),
    minThreads: 0,
    idleTimeout: 30_000,
    maxQueue: 32,
    resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB, maxYoungGenerationSizeMb: 32 },
  });
  return pool;
}

/**
 * Decoding and re-encoding, off the request thread. An object (not bare functions) so a test can
 * watch whether decoding was reached at all.
 */
export const imageWorkers = {
  /** Null when the bytes do not decode; throws when the worker died (e.g. over its memory cap) or the queue is full. */
  async reencode(bytes: Buffer, jpeg: boolean): Promise<DecodedImage | null> {
    return thePool().run({ bytes, jpeg });
  },
  async close() {
    const p = pool;
    pool = undefined;
    await p?.destroy();
  },
};
