import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { gaussian, mulberry32, secondOrderStep, squareWaveform } from '../../shared/capture/synthetic';
import { analyzeCaptureFile } from './analyze-file';

/** Rows of the warm-up capture and how often it is analysed: enough for V8 to optimise every pass. */
export const WARM_UP_ROWS = 50_000;
export const WARM_UP_RUNS = 2;

/**
 * A clock export of our own making, as scopes write them: a time column in seconds with an
 * exponent, a voltage column with fixed decimals; a square wave that rings and carries noise,
 * so the edge, ringing and settling code runs as well as the whole-record passes.
 */
function warmUpCsv(rows: number): string {
  const wave = squareWaveform(secondOrderStep(25e6, 0.25), { periodS: 4e-6, baseV: 0, topV: 5 });
  const normal = gaussian(mulberry32(2026));
  const lines = ['Time (s),CH1 (V)'];
  for (let k = 0; k < rows; k++) {
    const tS = k * 2e-9;
    lines.push(`${tS.toExponential(8)},${(wave(tS) + 0.02 * normal()).toFixed(4)}`);
  }
  return `${lines.join('\n')}\n`;
}

/**
 * Runs the whole upload path (parse to binary columns, analysis, plot store) on a small
 * capture a few times, so that a capture worker's first real upload runs in optimised code:
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
    writeFileSync(file, warmUpCsv(rows));
    for (let run = 0; run < runs; run++) {
      const plotDir = path.join(dir, `plot-${run}`);
      const result = await analyzeCaptureFile(file, {}, { plotDir });
      // a warm-up that fails means the analysis itself is broken: say so rather than warm nothing
      if (!result.ok) throw new Error(`the capture warm-up failed: ${result.message}`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return performance.now() - started;
}
