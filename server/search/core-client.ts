import { Worker } from 'node:worker_threads';
import { workerEntry } from '../worker-entry';
import { SearchCore, type CoreOptions } from './search-core';

const METHODS = ['size', 'restore', 'begin', 'add', 'finish', 'upsert', 'remove', 'rank', 'highlights', 'similar', 'listCandidates', 'save', 'close'] as const;
type Method = (typeof METHODS)[number];
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Fn = (...args: any[]) => any;

/** SearchCore's calls, answered later: on a worker thread, or in process. */
export type CoreClient = { [K in Method]: SearchCore[K] extends (...a: infer A) => infer R ? (...a: A) => Promise<R> : never } & {
  /** The core itself when it runs in process (tests read the index directly). */
  readonly local?: SearchCore;
  terminate(): Promise<void>;
  /** Ends the worker thread without a word, as a crash would (tests); absent in process. */
  kill?(): Promise<void>;
};

/** The core in this thread: for tests and tools, where one more thread buys nothing. */
export function localCore(options: CoreOptions): CoreClient {
  const core = new SearchCore(options);
  const client = { local: core, terminate: async () => core.close() } as Record<string, unknown>;
  for (const m of METHODS) client[m] = async (...args: unknown[]) => (core[m] as Fn).apply(core, args);
  return client as unknown as CoreClient;
}

/**
 * The core on one long-lived worker thread. Calls are answered in order; if the worker dies,
 * every call in flight and every later one fails with that error, and `onExit` is told, so the
 * owner can open a new one (case-search.ts does).
 */
export function workerCore(options: CoreOptions, onExit: (err: Error) => void): CoreClient {
  const { filename, workerData } = workerEntry('search-worker', new URL('./search-worker.ts', import.meta.url));
  const worker = new Worker(new URL(filename), { workerData: { ...workerData, options } });
  const pending = new Map<number, { resolve: (v: unknown) => void; reject: (e: Error) => void }>();
  let next = 1;
  let dead: Error | undefined;
  worker.on('message', (m: { id: number; result?: unknown; error?: string }) => {
    const p = pending.get(m.id);
    if (!p) return;
    pending.delete(m.id);
    if (m.error !== undefined) p.reject(new Error(m.error));
    else p.resolve(m.result);
  });
  const die = (err: Error) => {
    if (dead) return;
    dead = err;
    for (const p of pending.values()) p.reject(err);
    pending.clear();
    onExit(err);
  };
  worker.on('error', (err) => die(err));
  worker.on('exit', (code) => die(new Error(`the search worker stopped (exit code ${code})`)));
  // the worker must not keep the process alive on its own
  worker.unref();

  const call = (op: Method, args: unknown[]) =>
    new Promise((resolve, reject) => {
      if (dead) return reject(dead);
      const id = next++;
      pending.set(id, { resolve, reject });
      worker.postMessage({ id, op, args });
    });
  const client = {
    async terminate() {
      if (dead) return;
      await call('close', []).catch(() => undefined);
      dead = new Error('the search worker was closed');
      await worker.terminate();
    },
    async kill() {
      await worker.terminate();
    },
  } as Record<string, unknown>;
  for (const m of METHODS) client[m] = (...args: unknown[]) => call(m, args);
  return client as unknown as CoreClient;
}
