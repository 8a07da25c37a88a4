import { Piscina } from 'piscina';
import { AppError } from '../errors';
import { workerEntry } from '../worker-entry';
import type { CaptureAnalysis } from './analyze-file';
import type { CaptureTask } from './capture-worker';

/**
 * Heap cap of a capture worker. The samples live in files and typed-array blocks outside the
 * heap; the heap holds per-edge results and the parser's small state, so this is ample.
 */
export const CAPTURE_WORKER_HEAP_MB = 256;
/**
 * Young generation of a capture worker (V8 splits it into three: two 2 MB semi-spaces and a large
 * object space). The analysis makes many short-lived numbers; left at V8's default the nursery
 * grows to 32 MB of resident memory for them, while a 2 MB semi-space costs only more, cheap,
 * scavenges (nearly everything in it is dead).
 */
export const CAPTURE_WORKER_YOUNG_MB = 6;
/** Captures waiting for the worker beyond the one it is on; one more is refused with a 503. */
export const CAPTURE_QUEUE = 8;

let pool: Piscina | undefined;

function thePool(): Piscina {
  pool ??= new Piscina({
    ...workerEntry('capture-worker', new URL('./capture-worker.ts', import.meta.url)),
    // one capture at a time: on 2 cores the other one stays with requests
    maxThreads: 1,
    minThreads: 0,
    idleTimeout: 30_000,
    maxQueue: CAPTURE_QUEUE,
    resourceLimits: { maxOldGenerationSizeMb: CAPTURE_WORKER_HEAP_MB, maxYoungGenerationSizeMb: CAPTURE_WORKER_YOUNG_MB },
  });
  return pool;
}

async function run<T>(task: CaptureTask): Promise<T> {
  try {
    return (await thePool().run(task)) as T;
  } catch (err) {
    const message = (err as Error).message;
    if (/queue is at limit/i.test(message)) throw new AppError('unavailable', `The server is busy analysing ${CAPTURE_QUEUE} other captures; try again in a minute`);
    throw new Error(`The capture worker failed: ${message}`, { cause: err });
  }
}

/**
 * Capture parsing and analysis, off the request thread: the same functions as analyze-file.ts
 * and capture-store.ts, on a worker. An object so a test can replace or watch it.
 */
export const captureWorkers = {
  /** As `analyzeCaptureFile`; throws a 503 AppError when the queue is full. */
  analyze: (file: string, options: { channel?: number | string } = {}, output: { plotDir?: string } = {}) =>
    run<{ ok: true; analysis: CaptureAnalysis } | { ok: false; message: string }>({ op: 'analyze', file, options, plotDir: output.plotDir }),
  /** As `buildPlotStore`. */
  buildPlotStore: (file: string, dir: string) => run<{ ok: true } | { ok: false; message: string }>({ op: 'plot', file, dir }),
  async close() {
    const p = pool;
    pool = undefined;
    await p?.destroy();
  },
};
