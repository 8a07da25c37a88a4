/**
 * Capture benchmark: `npx tsx bench/capture.ts` (npm run bench:capture).
 *
 * Writes a 1,000,000-sample capture CSV (a 1 MHz square wave with ringing edges and noise) to a
 * temp file, then measures, each in a fresh child process so their peak memory does not mix:
 *  - stream: fs.createReadStream → readCaptureStream → analyzeCapture (what the server does);
 *  - naive:  fs.readFileSync of the whole text, split into lines, parseFloat each cell, then the
 *    same analyzeCapture — the baseline, measured in the same run.
 * Figures: wall time of parse + analysis (median of the runs) and peak resident set size
 * (getrusage maxRSS, the high-water mark, which a synchronous run cannot hide from a sampler).
 * The analysis includes the new measurements (shape, clipping, tilt, corner, noise) and the
 * spectrum (fft.js) behind hum and the strongest lines.
 * Target: under 1 s and under 250 MB on 2 cores.
 */
import { spawnSync } from 'node:child_process';
import { createReadStream, createWriteStream, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { once } from 'node:events';
import { readCaptureStream } from '../server/captures/read-capture-stream';
import { analyzeCapture, type CaptureAnalysis } from '../shared/capture/analyze';
import { gaussian, mulberry32, secondOrderStep, squareWaveform } from '../shared/capture/synthetic';

const SAMPLES = 1_000_000;
const SAMPLE_INTERVAL_S = 1e-9;
const RUNS = 3;
const TARGET_S = 1;
const TARGET_MB = 250;

interface ChildReport {
  mode: 'stream' | 'naive';
  parseS: number;
  analyzeS: number;
  totalS: number;
  startRssMB: number;
  peakRssMB: number;
  peakHeapMB: number;
  analysis: Pick<CaptureAnalysis, 'points' | 'riseTimeS' | 'overshootPct' | 'ringingFrequencyHz' | 'periodS' | 'shape' | 'noiseRmsV' | 'tiltPct' | 'cornerPct' | 'humFrequencyHz'> & { strongestLineHz: number | null };
}

async function writeCapture(file: string): Promise<void> {
  // 1 MHz clock, 0 to 3.3 V, edges ringing at about 49 MHz (f_n 50 MHz, ζ = 0.2), 15 mV noise.
  const wave = squareWaveform(secondOrderStep(50e6, 0.2), { periodS: 1e-6, baseV: 0, topV: 3.3 });
  const normal = gaussian(mulberry32(181));
  const out = createWriteStream(file);
  out.write('Time (s),CH1 (V)\n');
  const linesPerWrite = 10_000;
  for (let start = 0; start < SAMPLES; start += linesPerWrite) {
    let text = '';
    for (let k = start; k < Math.min(SAMPLES, start + linesPerWrite); k++) {
      const tS = k * SAMPLE_INTERVAL_S;
      text += `${tS.toExponential(8)},${(wave(tS) + 0.015 * normal()).toFixed(4)}\n`;
    }
    if (!out.write(text)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

function naiveParse(file: string): { timesS: Float64Array; volts: Float64Array } {
  const lines = readFileSync(file, 'utf8').split('\n');
  const times: number[] = [];
  const volts: number[] = [];
  for (let i = 1; i < lines.length; i++) {
    if (lines[i] === '') continue;
    const cells = lines[i].split(',');
    times.push(parseFloat(cells[0]));
    volts.push(parseFloat(cells[1]));
  }
  return { timesS: Float64Array.from(times), volts: Float64Array.from(volts) };
}

async function child(mode: 'stream' | 'naive', file: string): Promise<void> {
  const startRssMB = process.memoryUsage().rss / 2 ** 20;
  let peakHeapMB = 0;
  const sampler = setInterval(() => {
    peakHeapMB = Math.max(peakHeapMB, process.memoryUsage().heapUsed / 2 ** 20);
  }, 5);
  const t0 = performance.now();
  let samples;
  if (mode === 'stream') {
    const parsed = await readCaptureStream(createReadStream(file));
    if (!parsed.ok) throw new Error(parsed.error.message);
    samples = parsed.samples;
  } else samples = naiveParse(file);
  const t1 = performance.now();
  const analysis = analyzeCapture(samples);
  const t2 = performance.now();
  clearInterval(sampler);
  peakHeapMB = Math.max(peakHeapMB, process.memoryUsage().heapUsed / 2 ** 20);
  const report: ChildReport = {
    mode,
    parseS: (t1 - t0) / 1000,
    analyzeS: (t2 - t1) / 1000,
    totalS: (t2 - t0) / 1000,
    startRssMB,
    peakRssMB: process.resourceUsage().maxRSS / 1024,
    peakHeapMB,
    analysis: {
      points: analysis.points,
      riseTimeS: analysis.riseTimeS,
      overshootPct: analysis.overshootPct,
      ringingFrequencyHz: analysis.ringingFrequencyHz,
      periodS: analysis.periodS,
      shape: analysis.shape,
      noiseRmsV: analysis.noiseRmsV,
      tiltPct: analysis.tiltPct,
      cornerPct: analysis.cornerPct,
      humFrequencyHz: analysis.humFrequencyHz,
      strongestLineHz: analysis.spectrum?.lines[0]?.frequencyHz ?? null,
    },
  };
  process.stdout.write(`${JSON.stringify(report)}\n`);
}

function runChild(mode: 'stream' | 'naive', file: string): ChildReport {
  const script = fileURLToPath(import.meta.url);
  const run = spawnSync(process.execPath, [...process.execArgv, script, 'child', mode, file], { encoding: 'utf8' });
  if (run.status !== 0) throw new Error(`${mode} run failed: ${run.stderr}`);
  return JSON.parse(run.stdout.trim().split('\n').pop()!) as ChildReport;
}

function summarize(reports: ChildReport[]) {
  const sorted = [...reports].sort((a, b) => a.totalS - b.totalS);
  const median = sorted[sorted.length >> 1];
  return { ...median, peakRssMB: Math.max(...reports.map((r) => r.peakRssMB)) };
}

const fmt = (value: number, digits = 2) => value.toFixed(digits);

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'falsetrace-bench-'));
  const file = join(dir, 'capture.csv');
  try {
    await writeCapture(file);
    console.log(`capture file: ${SAMPLES.toLocaleString('en')} samples, ${fmt(statSync(file).size / 2 ** 20, 1)} MB`);
    const streamRuns: ChildReport[] = [];
    const naiveRuns: ChildReport[] = [];
    for (let run = 0; run < RUNS; run++) {
      streamRuns.push(runChild('stream', file));
      naiveRuns.push(runChild('naive', file));
    }
    const ours = summarize(streamRuns);
    const naive = summarize(naiveRuns);
    console.log(
      `capture parse+analyze: ${fmt(ours.totalS)} s, peak rss ${fmt(ours.peakRssMB, 0)} MB ` +
        `(naive: ${fmt(naive.totalS)} s, ${fmt(naive.peakRssMB, 0)} MB; ratio ${fmt(ours.totalS / naive.totalS)})`,
    );
    console.log(
      `  stream: parse ${fmt(ours.parseS, 3)} s + analyze ${fmt(ours.analyzeS, 3)} s; rss at start ${fmt(ours.startRssMB, 0)} MB; peak heap ${fmt(ours.peakHeapMB, 0)} MB`,
    );
    console.log(
      `  naive:  parse ${fmt(naive.parseS, 3)} s + analyze ${fmt(naive.analyzeS, 3)} s; rss at start ${fmt(naive.startRssMB, 0)} MB`,
    );
    console.log(`ratio time ${fmt(ours.totalS / naive.totalS)}, ratio peak rss ${fmt(ours.peakRssMB / naive.peakRssMB)}`);
    const a = ours.analysis;
    console.log(
      `  measured: ${a.points} points, rise ${fmt((a.riseTimeS ?? 0) * 1e9)} ns, overshoot ${fmt(a.overshootPct ?? 0, 1)} %, ` +
        `ringing ${fmt((a.ringingFrequencyHz ?? 0) / 1e6, 2)} MHz, period ${fmt((a.periodS ?? 0) * 1e6, 4)} µs`,
    );
    console.log(
      `  and: shape ${a.shape}, noise ${fmt(a.noiseRmsV * 1e3, 1)} mV rms, tilt ${a.tiltPct} %, corner ${a.cornerPct} %, hum ${a.humFrequencyHz ?? 'none'}, ` +
        `strongest spectral line ${fmt((a.strongestLineHz ?? 0) / 1e6, 3)} MHz (FFT by fft.js, included in the analysis time)`,
    );
    if (JSON.stringify(a) !== JSON.stringify(naive.analysis)) console.log('  warning: the two readings differ', naive.analysis);
    const met = ours.totalS < TARGET_S && ours.peakRssMB < TARGET_MB;
    console.log(`target < ${TARGET_S} s and < ${TARGET_MB} MB: ${met ? 'met' : 'MISSED'}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

if (process.argv[2] === 'child') await child(process.argv[3] as 'stream' | 'naive', process.argv[4]);
else await main();
