import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeCaptureFile, type AnalysisTuning } from '../../server/captures/analyze-file';
import { closeBackHalfThread } from '../../server/captures/back-half';
import { measureWholeRecord, type WholeRecordTask } from '../../server/captures/back-half-worker';
import { analysisSteps, analyzeCapture } from '../../shared/capture/analyze';
import { addNoise, gaussian, mulberry32, sampleUniformly, secondOrderStep, squareWaveform } from '../../shared/capture/synthetic';
import type { CaptureSamples } from '../../shared/capture/types';
import { wholeRecordMeasures } from '../../shared/capture/whole-record';
import { asSeries } from '../../shared/capture/series';

// On a large capture the server takes the measures that need no edges (sample interval, rails,
// noise, spectrum) on a second thread while the first finds the levels and edges
// (analyze-file.ts). Whichever thread takes them, and whether that thread works, fails or is
// slow, the answer must be the one a single thread gives.

const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-beside-'));
afterAll(async () => {
  await closeBackHalfThread();
  rmSync(dir, { recursive: true, force: true });
});

function writeCsv(name: string, capture: CaptureSamples): string {
  const lines = ['Time (s),CH1 (V)'];
  for (let k = 0; k < capture.timesS.length; k++) lines.push(`${capture.timesS[k].toExponential(9)},${capture.volts[k].toFixed(5)}`);
  const file = path.join(dir, name);
  writeFileSync(file, `${lines.join('\n')}\n`);
  return file;
}

const POINTS = 40_000;
const waveforms: [string, () => CaptureSamples][] = [
  // two histogram levels: the edges are found before the whole-record measures are needed
  ['a ringing clock', () => {
    const c = sampleUniformly(squareWaveform(secondOrderStep(50e6, 0.2), { periodS: 1e-6, baseV: 0, topV: 3.3 }), { sampleIntervalS: 1e-9, points: POINTS });
    addNoise(c.volts, 0.015, 11);
    return c;
  }],
  // no two histogram levels: the edges wait for the noise, taken elsewhere
  ['a triangle', () => {
    const c = sampleUniformly((t) => { const p = (t / 20e-6) % 1; return p < 0.5 ? 4 * p - 1 : 3 - 4 * p; }, { sampleIntervalS: 5e-9, points: POINTS });
    addNoise(c.volts, 0.004, 12);
    return c;
  }],
  // flat runs on both extremes: the noise leaves the rails out
  ['a sine clipped at ±1 V', () => {
    const normal = gaussian(mulberry32(13));
    return sampleUniformly((t) => Math.max(-1, Math.min(1, 1.6 * Math.sin(2 * Math.PI * 50e3 * t) + 0.01 * normal())), { sampleIntervalS: 10e-9, points: POINTS });
  }],
];

const single: AnalysisTuning = { besideMinPoints: Number.POSITIVE_INFINITY };
const beside = (more: AnalysisTuning = {}): AnalysisTuning => ({ besideMinPoints: 0, ...more });

describe('whole-record measures taken on a second thread', () => {
  it.each(waveforms)('%s: the same analysis as one thread gives', async (name, make) => {
    const capture = make();
    const file = writeCsv(`${name}.csv`, capture);
    const one = await analyzeCaptureFile(file, {}, {}, single);
    const two = await analyzeCaptureFile(file, {}, {}, beside());
    expect(one.ok).toBe(true);
    expect(two).toEqual(one);
  });

  it('finds the period and the noise of the triangle with the noise taken elsewhere', async () => {
    const file = writeCsv('triangle-check.csv', waveforms[1][1]());
    const result = await analyzeCaptureFile(file, {}, {}, beside());
    if (!result.ok) throw new Error(result.message);
    // source: the waveform above, a 20 µs triangle with 4 mV rms of added noise
    expect(result.analysis.periodS).toBeCloseTo(20e-6, 8);
    expect(result.analysis.noiseRmsV).toBeGreaterThan(0.0035);
    expect(result.analysis.noiseRmsV).toBeLessThan(0.0045);
  });

  it('sees the clipped sine as clipped, from rails found on the other thread', async () => {
    const file = writeCsv('clipped-check.csv', waveforms[2][1]());
    const result = await analyzeCaptureFile(file, {}, {}, beside());
    if (!result.ok) throw new Error(result.message);
    // source: the waveform above, 1.6 V peak cut at ±1 V
    expect(result.analysis.clipped).toBe(true);
  });

  it('does the work itself when the other thread fails, refuses the task or answers late', async () => {
    const file = writeCsv('fallbacks.csv', waveforms[0][1]());
    const expected = await analyzeCaptureFile(file, {}, {}, single);
    const failing = await analyzeCaptureFile(file, {}, {}, beside({ beside: () => Promise.reject(new Error('thread died')) }));
    expect(failing).toEqual(expected);
    const refusing = await analyzeCaptureFile(file, {}, {}, beside({ beside: () => { throw new Error('no thread'); } }));
    expect(refusing).toEqual(expected);
    // a late answer still finds its store: the store is removed only once the other thread is done with it
    let storeThere = false;
    const late = async (task: WholeRecordTask) => {
      await new Promise((resolve) => setTimeout(resolve, 100));
      storeThere = existsSync(task.dir);
      return measureWholeRecord(task);
    };
    expect(await analyzeCaptureFile(file, {}, {}, beside({ beside: late }))).toEqual(expected);
    expect(storeThere).toBe(true);
  });

  it('takes the measures from the other thread when it answers', async () => {
    const file = writeCsv('wiring.csv', waveforms[0][1]());
    const marked = async (task: WholeRecordTask) => ({ ...measureWholeRecord(task), sampleIntervalS: 1.25e-9 });
    const result = await analyzeCaptureFile(file, {}, {}, beside({ beside: marked }));
    if (!result.ok) throw new Error(result.message);
    expect(result.analysis.sampleIntervalS).toBe(1.25e-9);
  });

  it('hands nothing over when the file fails to parse', async () => {
    const file = path.join(dir, 'bad.csv');
    writeFileSync(file, 'Time (s),CH1 (V)\n0,1\n1e-9,oops\n');
    let called = false;
    const result = await analyzeCaptureFile(file, {}, {}, beside({ beside: async (task) => { called = true; return measureWholeRecord(task); } }));
    expect(result.ok).toBe(false);
    // nothing was parsed, so nothing was handed over
    expect(called).toBe(false);
  });
});

describe('the analysis in two steps', () => {
  it('yields once for the whole-record measures, and gives what the one-step analysis gives', () => {
    const capture = waveforms[0][1]();
    const steps = analysisSteps(capture);
    const first = steps.next();
    expect(first.done).toBe(false);
    if (first.done) return;
    const last = steps.next(wholeRecordMeasures(asSeries(capture.timesS), asSeries(capture.volts)));
    expect(last.done).toBe(true);
    expect(last.value).toEqual(analyzeCapture(capture));
  });

  it('finishes without yielding on a record too short to measure', () => {
    const step = analysisSteps({ timesS: Float64Array.of(0), volts: Float64Array.of(1) }).next();
    expect(step.done).toBe(true);
    expect(step.value).toMatchObject({ points: 1, sampleIntervalS: null, edgeCount: 0 });
  });
});
