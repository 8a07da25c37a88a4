// Starts the zip worker from its TypeScript source (development, tests): a worker thread has no
// loader of its own, so it registers tsx before importing the entry.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const mod = await import(workerData.entry);
export default mod.default;
