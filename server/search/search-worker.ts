import { parentPort, workerData } from 'node:worker_threads';
import { SearchCore, type CoreOptions } from './search-core';

/**
 * The search index's thread: one long-lived worker holds the index (it is too big to copy per
 * task, so a pool of workers would each need its own) and answers the request thread's calls
 * one at a time, in order.
 */
const core = new SearchCore((workerData as { options: CoreOptions }).options);
const port = parentPort!;

port.on('message', (m: { id: number; op: string; args: unknown[] }) => {
  try {
    const fn = (core as unknown as Record<string, (...a: unknown[]) => unknown>)[m.op];
    if (typeof fn !== 'function') throw new Error(`unknown search call "${m.op}"`);
    port.postMessage({ id: m.id, result: fn.apply(core, m.args) });
  } catch (err) {
    port.postMessage({ id: m.id, error: (err as Error).message });
  }
});
