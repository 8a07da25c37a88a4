// Starts a worker thread from its TypeScript source (development, tests): a worker thread has no
// loader of its own, so it registers tsx before importing the entry. A piscina task function is
// the entry's default export; a plain worker (search) has none, and runs on import.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const mod = await import(workerData.entry);
export default mod.default;
