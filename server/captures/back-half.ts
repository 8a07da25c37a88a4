import { Piscina } from 'piscina';
import type { FileHandle } from 'node:fs/promises';
import type { ByteCaptureParser } from '../../shared/capture/parse-bytes';
import { workerEntry } from '../worker-entry';
import type { WholeRecordMeasures } from '../../shared/capture/whole-record';
import type { BackHalfResult, BackHalfTask, WholeRecordTask } from './back-half-worker';
import type { SampleFileWriter } from './sample-store';

/**
 * A file with at least this many bytes of data rows left once its layout is known is read by two
 * threads (our threshold: below it the hand-over costs about what the second thread saves).
 */
export const SPLIT_MIN_BYTES = 8 << 20;
/**
 * Share of what is left that this thread reads itself: a little under half, as the other thread
 * reads faster (it has no stream of chunks to await and check); measured, at an even split this
 * thread never waited for the other at 1M samples, and at 0.42 it waited a few ms.
 */
export const FRONT_SHARE = 0.45;
/** Bytes searched from the split point for the next line's start. */
const LINE_SEARCH_BYTES = 1 << 16;
const SUFFIX = '.back';

let pool: Piscina | undefined;
let keep = false;

function thePool(): Piscina {
  if (pool) return pool;
  pool = new Piscina({
    ...workerEntry('back-half-worker', new URL('./back-half-worker.ts', import.meta.url), { selfContained: true }),
    // plain JavaScript (a bundle): without the parent's flags the thread loads no TypeScript loader
    execArgv: [],
    maxThreads: 1,
    minThreads: keep ? 1 : 0,
    idleTimeout: 30_000,
    // the rows go to files a block at a time: a small heap is plenty
    resourceLimits: { maxOldGenerationSizeMb: 32, maxYoungGenerationSizeMb: 3 },
  });
  // a thread that fails to load or dies fails its task, and the caller does the work itself:
  // the pool's own report of it must not end the process
  pool.on('error', () => undefined);
  return pool;
}

/** Reads a back half on the second thread. */
export const runBackHalf = (task: BackHalfTask) => thePool().run(task) as Promise<BackHalfResult>;

/** Takes the whole-record measures of a stored channel on the second thread. */
export const measureWholeRecordBeside = (task: WholeRecordTask) => thePool().run(task, { name: 'measureWholeRecord' }) as Promise<WholeRecordMeasures>;

/**
 * Starts a task on the second thread: null when the thread cannot start or the task fails, for
 * this thread to do the work itself.
 */
export function onSecondThread<T>(start: () => Promise<T>): Promise<T | null> {
  try {
    return start().catch(() => null);
  } catch {
    return Promise.resolve(null);
  }
}

/** Keeps the back-half thread for the life of the process (a capture worker that is kept warm). */
export function keepBackHalfThread(): void {
  keep = true;
}

export async function closeBackHalfThread(): Promise<void> {
  const p = pool;
  pool = undefined;
  await p?.destroy();
}

/**
 * Splits the reading of one capture file between this thread and a second one. Once the front
 * reader knows the layout (`start`), the back part of what is left (`FRONT_SHARE`), from a line's start, goes to
 * the second thread; this thread reads up to there, then (`join`) takes the rows the other read
 * into its store when they follow on (the parser counts them as its own) and goes on from where
 * the other stopped; otherwise it reads the back half itself. Either way the store, the line
 * numbers, the notes and any error come out as from one reader.
 */
export class BackHalfSplit {
  private task: Promise<BackHalfResult | null> | null = null;
  private startByte = 0;
  // shared with the other thread: set when its rows are no longer wanted
  private readonly cancel = new Int32Array(new SharedArrayBuffer(4));
  /** Whether the file is split, or known to be read by this thread alone. */
  decided = false;

  constructor(
    private readonly file: string,
    private readonly dir: string,
    private readonly parser: ByteCaptureParser,
    private readonly writer: () => SampleFileWriter | null,
    private readonly minBytes = SPLIT_MIN_BYTES,
    // the other thread; a test gives one that fails
    private readonly runTask: (task: BackHalfTask) => Promise<BackHalfResult> = runBackHalf,
  ) {}

  /**
   * Hands the back half to the other thread when the layout is known and enough is left after
   * `fromByte` (the first byte this thread has not yet asked for); returns where this thread's
   * reading is to stop, or null when the file is read by this thread alone.
   */
  async start(handle: FileHandle, fromByte: number, size: number): Promise<number | null> {
    // a header longer than the first read: asked again after the next one
    if (this.parser.readingHeader) return null;
    this.decided = true;
    const layout = this.parser.continuableLayout;
    if (layout === null || this.writer() === null || size - fromByte < this.minBytes) return null;
    const middle = fromByte + Math.floor((size - fromByte) * FRONT_SHARE);
    const window = Buffer.alloc(Math.min(LINE_SEARCH_BYTES, size - middle));
    const { bytesRead } = await handle.read(window, 0, window.length, middle);
    const lineEnd = window.subarray(0, bytesRead).indexOf(10);
    if (lineEnd < 0) return null;
    this.startByte = middle + lineEnd + 1;
    const task: BackHalfTask = { file: this.file, dir: this.dir, suffix: SUFFIX, startByte: this.startByte, layout, cancel: this.cancel };
    // a thread that cannot start or fails leaves the back half to this one: the result is the same, only slower
    this.task = onSecondThread(() => this.runTask(task));
    return this.startByte;
  }

  /**
   * Once this thread has read up to the split: takes the other thread's rows when they follow
   * on from the last row read here, and returns the byte to go on from and how many were taken
   * by the other thread.
   */
  async join(): Promise<{ resumeByte: number; skippedBytes: number }> {
    const result = await this.task;
    this.task = null;
    const writer = this.writer();
    if (result === null || writer === null || result.rows === 0 || this.parser.continuableLayout === null || !this.parser.atLineStart || !(result.firstTimeS > writer.lastTimeS())) {
      return { resumeByte: this.startByte, skippedBytes: 0 };
    }
    writer.appendPart(result);
    this.parser.rowsTakenElsewhere(result.rows);
    return { resumeByte: result.stopByte, skippedBytes: result.stopByte - this.startByte };
  }

  /**
   * Waits for the other thread if it is still reading (the front stopped early, failing), after
   * telling it to stop at its next read; then the store's directory can be removed.
   */
  async settle(): Promise<void> {
    if (this.task !== null) Atomics.store(this.cancel, 0, 1);
    await this.task;
    this.task = null;
  }
}
