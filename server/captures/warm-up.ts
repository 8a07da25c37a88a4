import { closeSync, mkdtempSync, openSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { gaussian, mulberry32, secondOrderStep, squareWaveform } from '../../shared/capture/synthetic';
import { analyzeCaptureFile } from './analyze-file';

/**
 * Rows of the warm-up capture and how often it is analysed. A million rows, as a deep-memory
 * scope exports: each pass's loop runs as long as in a real upload, so V8 optimises it for that
 * (after three runs of 100k rows, the first 1M-sample upload still took about 1.3 times as long
 * as the next one: loops inside the analysis and the second thread's reader not yet optimised).
 * Three runs, not two: the second thread's reader then deoptimised less in the first upload
 * (median of 8 first uploads: 132 ms against 145).
 */
export const WARM_UP_ROWS = 1_000_000;
export const WARM_UP_RUNS = 3;
const WRITE_ROWS = 10_000;

/**
 * A clock export of our own making, as scopes write them: a time column in seconds with an
 * exponent, a voltage column with fixed decimals; a square wave that rings and carries noise,
 * so the edge, ringing and settling code runs as well as the whole-record passes.
 */
function writeWarmUpCsv(file: string, rows: number): void {
  const wave = squareWaveform(secondOrderStep(25e6, 0.25), { periodS: 4e-6, baseV: 0, topV: 5 });
  const normal = gaussian(mulberry32(2026));
  const fd = openSync(file, 'w');
  try {
    writeSync(fd, 'Time (s),CH1 (V)\n');
    // written a block of rows at a time: the whole text as one string would cost the worker tens of MB of resident memory
    for (let start = 0; start < rows; start += WRITE_ROWS) {
      let text = '';
      for (let k = start; k < Math.min(rows, start + WRITE_ROWS); k++) {
        const tS = k * 2e-9;
        text += `${tS.toExponential(8)},${(wave(tS) + 0.02 * normal()).toFixed(4)}\n`;
      }
      writeSync(fd, text);
    }
  } finally {
    closeSync(fd);
  }
}

/**
 * Runs the whole upload path (parse to binary columns, analysis, plot store) on a made-up
 * capture, read by one thread and then split between two (back-half.ts), so that a capture
 * worker's first real upload runs in optimised code: cold, a 1M-sample capture takes about
 * twice as long as warm, most of it in V8's interpreter and baseline code before each pass is
 * optimised. The second thread takes the whole-record measures in all three runs (a million
 * samples is past `BESIDE_MIN_POINTS`). About 2.5 s of a core, once, after the search index is
 * ready. Leaves nothing behind.
 *
 * @returns the time it took, ms
 */
export async function warmUpCaptureAnalysis(rows = WARM_UP_ROWS, runs = WARM_UP_RUNS): Promise<number> {
  const started = performance.now();
  const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-warm-up-'));
  try {
    const file = path.join(dir, 'clock.csv');
    writeWarmUpCsv(file, rows);
    for (let run = 0; run < runs; run++) {
      const plotDir = path.join(dir, `plot-${run}`);
      // the first run reads the file on one thread, as a small upload is; the others split it, as a large one is
      const result = await analyzeCaptureFile(file, {}, { plotDir }, run === 0 ? { splitMinBytes: Number.POSITIVE_INFINITY } : { splitMinBytes: 0 });
      // a warm-up that fails means the analysis itself is broken: say so rather than warm nothing
      if (!result.ok) throw new Error(`the capture warm-up failed: ${result.message}`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return performance.now() - started;
}
