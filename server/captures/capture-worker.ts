// Runs in a capture worker thread (see capture-pool.ts): parsing and analysing a capture file
// is long CPU work that would otherwise hold every request behind it.
import { workerData } from 'node:worker_threads';
import type { CaptureParseOptions } from '../../shared/capture/types';
import { analyzeCaptureFile } from './analyze-file';
import { keepBackHalfThread } from './back-half';
import { buildPlotStore } from './capture-store';
import { warmUpCaptureAnalysis } from './warm-up';

export type CaptureTask =
  | { op: 'analyze'; file: string; options: Pick<CaptureParseOptions, 'channel'>; plotDir?: string }
  | { op: 'plot'; file: string; dir: string }
  | { op: 'warm-up' };

// A worker the server keeps warm runs the warm-up before it takes its first task (the pool
// hands it none until this module has loaded).
const keptWarm = (workerData as { warmUp?: boolean } | undefined)?.warmUp === true;
// it keeps the thread that reads the back half of large files, warmed up with it
if (keptWarm) keepBackHalfThread();
const warmUpMs: number | null = keptWarm ? await warmUpCaptureAnalysis() : null;

export default async function run(task: CaptureTask) {
  if (task.op === 'analyze') return analyzeCaptureFile(task.file, task.options, { plotDir: task.plotDir });
  if (task.op === 'warm-up') return { warmUpMs };
  return buildPlotStore(task.file, task.dir);
}
