// Starts the search worker from its TypeScript source (development, tests): the worker thread
// has no loader of its own, so it registers tsx before importing the entry.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
