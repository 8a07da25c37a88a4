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
// set by `keepWarm`: the worker warms up as it starts and stays for the server's life
let warm = false;

function thePool(): Piscina {
  const entry = workerEntry('capture-worker', new URL('./capture-worker.ts', import.meta.url));
  pool ??= new Piscina({
    ...entry,
    workerData: { ...entry.workerData, warmUp: warm },
    // one capture at a time: on 2 cores the other one stays with requests
    maxThreads: 1,
    minThreads: warm ? 1 : 0,
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
  /**
   * Starts the worker the server keeps: it runs the warm-up (warm-up.ts) before its first task
   * and is not let go when idle (a new one, should it die, warms up again), so every upload runs
   * in optimised code. Resolves with the warm-up's time, ms.
   */
  async keepWarm(): Promise<number> {
    if (!warm) {
      warm = true;
      // a cold worker started by an upload before this finishes what it has, and goes
      const cold = pool;
      pool = undefined;
      void cold?.close();
    }
    const { warmUpMs } = await run<{ warmUpMs: number | null }>({ op: 'warm-up' });
    return warmUpMs ?? 0;
  },
  async close() {
    const p = pool;
    pool = undefined;
    warm = false;
    await p?.destroy();
  },
};
