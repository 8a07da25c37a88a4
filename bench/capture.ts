/**
 * Capture benchmark: `npx tsx bench/capture.ts [samples…]` (npm run bench:capture; default 1M and 10M).
 *
 * For each size, writes a capture CSV (a 1 MHz square wave with ringing edges and noise, 1 ns
 * sampling) to a temp file, then runs on that same file, alternately, in fresh child processes
 * so that their peak memory does not mix:
 *  - app:   what the server does with an upload: `analyzeCaptureFile` (a streaming parse from
 *           the bytes into binary columns on disk, past 8 MiB of rows split between two threads
 *           (back-half.ts), so the app uses both cores for the parse where numpy uses one; then
 *           the whole analysis reading those a block at a time: levels, edges, overshoot, ringing,
 *           period, shape, clipping, tilt, corner, noise, the spectrum by fft.js and hum, the
 *           second thread taking the interval, rails, noise and spectrum meanwhile from 262,144
 *           samples on (analyze-file.ts));
 *  - numpy: bench/capture_numpy.py (Debian's python3-numpy): the CSV read by numpy.loadtxt and by
 *           np.fromstring (the faster is the baseline), levels by histogram, 10/50/90 % crossings
 *           with hysteresis, rise/fall time and period: less work than the app does.
 * The app's child runs with the heap limits the server gives its capture worker thread
 * (capture-pool.ts: a 2 MB semi-space, i.e. a 6 MB young generation, and the old-space cap).
 * It runs twice over: warm, after the same warm-up the server's worker runs before its first
 * upload (warm-up.ts; the server keeps that worker, so this is what every upload gets), and
 * cold, a fresh process's first capture (a server run with CAPTURE_WARM_UP=0, whose worker
 * starts with the upload). The target is judged on the warm figure; both are printed.
 * Figures: wall time from opening the file to the result, inside each process (start-up and
 * imports excluded on both sides), median of the runs, with their spread; the ratio is the
 * median of the paired runs' ratios (each warm app run against the numpy run of the same loop
 * pass, seconds apart), steadier than a ratio of medians when the machine's speed drifts; the
 * app's peak resident set size (getrusage maxRSS of its child process, a high-water mark no
 * sampler can miss); the app's garbage collections in that run and their time (node:v8's
 * GCProfiler), which show what the analysis allocates per sample.
 * Targets: app ≤ 1.0× numpy's time at every size, app RSS ≤ 150 MB at 10M samples.
 */
import { spawnSync } from 'node:child_process';
import { GCProfiler } from 'node:v8';
import { createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { once } from 'node:events';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { analyzeCaptureFile } from '../server/captures/analyze-file';
import { CAPTURE_WORKER_HEAP_MB, CAPTURE_WORKER_YOUNG_MB } from '../server/captures/capture-pool';
import { warmUpCaptureAnalysis } from '../server/captures/warm-up';
import { gaussian, mulberry32, secondOrderStep, squareWaveform } from '../shared/capture/synthetic';

const SIZES = [1_000_000, 10_000_000];
const SAMPLE_INTERVAL_S = 1e-9;
// the machine's noise moves single runs by ±30 %: a median of seven holds better than one of three
const RUNS = 7;
const TARGET_RATIO = 1.0;
const TARGET_RSS_MB = 150;
const NUMPY_SCRIPT = fileURLToPath(new URL('./capture_numpy.py', import.meta.url));

interface Measured {
  points: number;
  baseV: number | null;
  topV: number | null;
  riseTimeS: number | null;
  fallTimeS: number | null;
  periodS: number | null;
}

interface Report {
  totalS: number;
  parseS?: number;
  analyzeS?: number;
  peakRssMB: number | null;
  /** The app's garbage collections during the run, and their time (V8's GC profiler). */
  gc?: { count: number; ms: number };
  reader?: string;
  analysis: Measured & Record<string, unknown>;
}

async function writeCapture(file: string, samples: number): Promise<void> {
  // 1 MHz clock, 0 to 3.3 V, edges ringing at about 49 MHz (f_n 50 MHz, ζ = 0.2), 15 mV noise.
  const wave = squareWaveform(secondOrderStep(50e6, 0.2), { periodS: 1e-6, baseV: 0, topV: 3.3 });
  const normal = gaussian(mulberry32(181));
  const out = createWriteStream(file);
  out.write('Time (s),CH1 (V)\n');
  const linesPerWrite = 20_000;
  for (let start = 0; start < samples; start += linesPerWrite) {
    let text = '';
    for (let k = start; k < Math.min(samples, start + linesPerWrite); k++) {
      const tS = k * SAMPLE_INTERVAL_S;
      text += `${tS.toExponential(8)},${(wave(tS) + 0.015 * normal()).toFixed(4)}\n`;
    }
    if (!out.write(text)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

async function child(file: string, warm: boolean): Promise<void> {
  if (warm) await warmUpCaptureAnalysis();
  const gcProfiler = new GCProfiler();
  gcProfiler.start();
  const t0 = performance.now();
  const result = await analyzeCaptureFile(file);
  const t1 = performance.now();
  const collections = gcProfiler.stop().statistics;
  if (!result.ok) throw new Error(result.message);
  const a = result.analysis;
  const report: Report = {
    totalS: (t1 - t0) / 1000,
    peakRssMB: process.resourceUsage().maxRSS / 1024,
    gc: { count: collections.length, ms: collections.reduce((sum, c) => sum + c.cost, 0) / 1000 },
    analysis: {
      points: a.points,
      baseV: a.baseV,
      topV: a.topV,
      riseTimeS: a.riseTimeS,
      fallTimeS: a.fallTimeS,
      periodS: a.periodS,
      edges: a.edgeCount,
      overshootPct: a.overshootPct,
      ringingFrequencyHz: a.ringingFrequencyHz,
      shape: a.shape,
      noiseRmsV: a.noiseRmsV,
      strongestLineHz: a.spectrum?.lines[0]?.frequencyHz ?? null,
    },
  };
  process.stdout.write(`${JSON.stringify(report)}\n`);
}

function runApp(file: string, warm: boolean): Report {
  const script = fileURLToPath(import.meta.url);
  // the capture worker's resourceLimits, as V8 flags: V8 makes the young generation three semi-spaces
  const limits = [`--max-semi-space-size=${CAPTURE_WORKER_YOUNG_MB / 3}`, `--max-old-space-size=${CAPTURE_WORKER_HEAP_MB}`];
  const run = spawnSync(process.execPath, [...limits, ...process.execArgv, script, 'child', file, warm ? 'warm' : 'cold'], { encoding: 'utf8', maxBuffer: 1 << 24 });
  if (run.status !== 0) throw new Error(`app run failed: ${run.stderr}`);
  return JSON.parse(run.stdout.trim().split('\n').pop()!) as Report;
}

function runNumpy(file: string, reader: 'loadtxt' | 'fromstring'): Report | null {
  const run = spawnSync('python3', [NUMPY_SCRIPT, file, reader], { encoding: 'utf8', maxBuffer: 1 << 24 });
  if (run.error || run.status !== 0) return null;
  return JSON.parse(run.stdout.trim().split('\n').pop()!) as Report;
}

function median(reports: Report[]): Report {
  const sorted = [...reports].sort((a, b) => a.totalS - b.totalS);
  return sorted[sorted.length >> 1];
}

const medianOf = (values: number[]) => [...values].sort((a, b) => a - b)[values.length >> 1];

/** app time ÷ numpy time of each run pair (the same loop pass), in run order. */
const pairedRatios = (app: Report[], numpy: Report[]) => app.slice(0, numpy.length).map((a, k) => a.totalS / numpy[k].totalS);

/** Least and greatest time of the runs, s. */
const spread = (reports: Report[]) => `${fmt(Math.min(...reports.map((r) => r.totalS)))}–${fmt(Math.max(...reports.map((r) => r.totalS)))} s`;

const fmt = (value: number, digits = 2) => value.toFixed(digits);
const ns = (s: number | null) => (s === null ? 'none' : `${fmt(s * 1e9, 3)} ns`);

async function benchSize(samples: number, dir: string): Promise<{ ratio: number | null; rssMB: number }> {
  const file = join(dir, `capture-${samples}.csv`);
  await writeCapture(file, samples);
  console.log(`\n${samples.toLocaleString('en')} samples: ${fmt(statSync(file).size / 2 ** 20, 1)} MB of CSV`);
  const app: Report[] = [];
  const cold: Report[] = [];
  const loadtxt: Report[] = [];
  const fromstring: Report[] = [];
  for (let run = 0; run < RUNS; run++) {
    app.push(runApp(file, true));
    cold.push(runApp(file, false));
    const a = runNumpy(file, 'loadtxt');
    const b = runNumpy(file, 'fromstring');
    if (a) loadtxt.push(a);
    if (b) fromstring.push(b);
  }
  const ours = median(app);
  const first = median(cold);
  const rssMB = Math.max(...[...app, ...cold].map((r) => r.peakRssMB ?? 0));
  console.log(`  app:   ${fmt(ours.totalS)} s warm (parse to binary columns and full analysis, on two threads past 8 MiB and 262,144 samples), peak rss ${fmt(rssMB, 0)} MB, ${ours.gc?.count} collections taking ${fmt(ours.gc?.ms ?? 0, 0)} ms`);
  console.log(`         ${fmt(first.totalS)} s cold (a fresh process's first capture, code not yet optimised)`);
  if (loadtxt.length === 0 && fromstring.length === 0) {
    console.log('  numpy: not available (install python3-numpy); no ratio');
    return { ratio: null, rssMB };
  }
  const candidates = [loadtxt, fromstring].filter((r) => r.length > 0).map(median);
  for (const c of candidates) {
    console.log(`  numpy ${c.reader!.padEnd(10)} ${fmt(c.totalS)} s (read ${fmt(c.parseS!)} s + analysis ${fmt(c.analyzeS!)} s), peak rss ${fmt(c.peakRssMB ?? 0, 0)} MB`);
  }
  const numpy = candidates.reduce((best, c) => (c.totalS < best.totalS ? c : best));
  const numpyRuns = numpy.reader === 'loadtxt' ? loadtxt : fromstring;
  // each warm app run against the numpy run made right after it: the machine's speed drifts over
  // minutes, and a pair shares its minute, so the median of the pairs' ratios is the steadier figure
  const paired = pairedRatios(app, numpyRuns);
  const ratio = paired.length > 0 ? medianOf(paired) : ours.totalS / numpy.totalS;
  console.log(`  spread of the ${RUNS} runs: app warm ${spread(app)}, numpy ${numpy.reader} ${spread(numpyRuns)}`);
  console.log(
    `  ratio app/numpy (fastest numpy reader, ${numpy.reader}): ${fmt(ratio)}× warm (median of ${paired.length} paired runs: ${paired.map((r) => fmt(r)).join(', ')}; ` +
      `ratio of the medians ${fmt(ours.totalS / numpy.totalS)}×), ${fmt(first.totalS / numpy.totalS)}× cold`,
  );
  const a = ours.analysis;
  const b = numpy.analysis;
  console.log(`  app   measured: base ${fmt(a.baseV ?? 0, 5)} V, top ${fmt(a.topV ?? 0, 5)} V, rise ${ns(a.riseTimeS)}, fall ${ns(a.fallTimeS)}, period ${ns(a.periodS)}, ${a.edges} edges`);
  console.log(`  numpy measured: base ${fmt(b.baseV ?? 0, 5)} V, top ${fmt(b.topV ?? 0, 5)} V, rise ${ns(b.riseTimeS)}, fall ${ns(b.fallTimeS)}, period ${ns(b.periodS)}, ${b.edges} edges`);
  console.log(
    `  app also: overshoot ${fmt(Number(a.overshootPct ?? 0), 1)} %, ringing ${fmt(Number(a.ringingFrequencyHz ?? 0) / 1e6, 2)} MHz, shape ${a.shape}, ` +
      `noise ${fmt(Number(a.noiseRmsV) * 1e3, 1)} mV rms, strongest line ${fmt(Number(a.strongestLineHz ?? 0) / 1e6, 3)} MHz`,
  );
  rmSync(file, { force: true });
  return { ratio, rssMB };
}

async function main(): Promise<void> {
  const sizes = process.argv.slice(2).map(Number).filter((n) => n > 0);
  const dir = mkdtempSync(join(tmpdir(), 'falsetrace-bench-'));
  try {
    const results: { samples: number; ratio: number | null; rssMB: number }[] = [];
    for (const samples of sizes.length ? sizes : SIZES) results.push({ samples, ...(await benchSize(samples, dir)) });
    console.log('');
    for (const r of results) {
      const timeOk = r.ratio !== null && r.ratio <= TARGET_RATIO;
      const rssOk = r.samples < 10_000_000 || r.rssMB <= TARGET_RSS_MB;
      console.log(
        `capture ${r.samples.toLocaleString('en')} samples: ratio ${r.ratio === null ? 'n/a' : `${fmt(r.ratio)}×`} warm (target ≤ ${TARGET_RATIO}×) ${timeOk ? 'met' : 'MISSED'}; ` +
          `rss ${fmt(r.rssMB, 0)} MB${r.samples >= 10_000_000 ? ` (target ≤ ${TARGET_RSS_MB} MB) ${rssOk ? 'met' : 'MISSED'}` : ''}`,
      );
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

if (process.argv[2] === 'child') await child(process.argv[3], process.argv[4] === 'warm');
else await main();
