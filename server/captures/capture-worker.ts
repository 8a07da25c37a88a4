// Runs in a capture worker thread (see capture-pool.ts): parsing and analysing a capture file
// is long CPU work that would otherwise hold every request behind it.
import type { CaptureParseOptions } from '../../shared/capture/types';
import { analyzeCaptureFile } from './analyze-file';
import { buildPlotStore } from './capture-store';

export type CaptureTask =
  | { op: 'analyze'; file: string; options: Pick<CaptureParseOptions, 'channel'>; plotDir?: string }
  | { op: 'plot'; file: string; dir: string };

export default async function run(task: CaptureTask) {
  if (task.op === 'analyze') return analyzeCaptureFile(task.file, task.options, { plotDir: task.plotDir });
  return buildPlotStore(task.file, task.dir);
}
