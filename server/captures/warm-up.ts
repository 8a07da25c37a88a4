import { closeSync, mkdtempSync, openSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { gaussian, mulberry32, secondOrderStep, squareWaveform } from '../../shared/capture/synthetic';
import { analyzeCaptureFile } from './analyze-file';

/** Rows of the warm-up capture and how often it is analysed: enough for V8 to optimise every pass. */
export const WARM_UP_ROWS = 100_000;
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
 * Runs the whole upload path (parse to binary columns, analysis, plot store) on a small
 * capture a few times, read by one thread and split between two (back-half.ts), so that a
 * capture worker's first real upload runs in optimised code:
 * cold, a 1M-sample capture takes about twice as long as warm, most of it in V8's
 * interpreter and baseline code before each pass is optimised. Leaves nothing behind.
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
      const result = await analyzeCaptureFile(file, {}, { plotDir }, run === 0 ? {} : { splitMinBytes: 0 });
      // a warm-up that fails means the analysis itself is broken: say so rather than warm nothing
      if (!result.ok) throw new Error(`the capture warm-up failed: ${result.message}`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return performance.now() - started;
}
