import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeCaptureFile } from '../../server/captures/analyze-file';
import { analyzeCapture } from '../../shared/capture/analyze';
import { parseCaptureText } from '../../shared/capture/parse';
import { medianSampleIntervalS } from '../../shared/capture/sample-interval';
import { ArraySeries } from '../../shared/capture/series';
import { addNoise, sampleUniformly, secondOrderStep, squareWaveform } from '../../shared/capture/synthetic';

// The server measures a capture from binary columns on disk, a block at a time; the in-memory
// analysis (which the IEEE 181, numpy and ngspice checks cover) must read the same file the same way.

const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-store-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function ringingSquareCsv(points: number, unit: 'V' | 'mV'): string {
  // invented test signal: a 1 MHz clock ringing at about 49 MHz with 10 mV of noise
  const { timesS, volts } = sampleUniformly(squareWaveform(secondOrderStep(50e6, 0.2), { periodS: 1e-6, baseV: 0, topV: 3.3 }), { sampleIntervalS: 1e-9, points });
  addNoise(volts, 0.01, 7);
  const scale = unit === 'mV' ? 1000 : 1;
  const rows = [`Time (us),CH1 (${unit}),CH2 (${unit})`];
  for (let i = 0; i < points; i++) rows.push(`${(timesS[i] * 1e6).toFixed(4)},${(volts[i] * scale).toFixed(3)},${(-volts[i] * scale).toFixed(3)}`);
  return `${rows.join('\r\n')}\r\n`;
}

describe('analysis from the store on disk', () => {
  it('should give exactly the in-memory analysis of the same file, channel by channel', async () => {
    // longer than one block the analysis reads (262,144 samples), so block edges are crossed
    for (const unit of ['V', 'mV'] as const) {
      const text = ringingSquareCsv(280_000, unit);
      const file = path.join(dir, `square-${unit}.csv`);
      writeFileSync(file, text);
      for (const channel of unit === 'V' ? [1, 2] : [1]) {
        const fromDisk = await analyzeCaptureFile(file, { channel });
        const parsed = parseCaptureText(text, { channel });
        expect(fromDisk.ok && parsed.ok).toBe(true);
        if (!fromDisk.ok || !parsed.ok) continue;
        const inMemory = analyzeCapture(parsed.samples, { voltsPerDiv: parsed.metadata.voltsPerDiv, offsetV: parsed.metadata.offsetV });
        const { channel: _c, channels: _cs, metadata, notes, ...measured } = fromDisk.analysis;
        expect(measured).toEqual(inMemory);
        expect(notes).toEqual(parsed.notes);
        expect(metadata).toEqual(parsed.metadata);
      }
    }
    // nothing is left beside the file but the file
    expect(readdirSync(dir).sort()).toEqual(['square-V.csv', 'square-mV.csv'].sort());
  });

  it('should find the median sample interval of a long jittered record without holding its spacings', () => {
    // more spacings than are ever copied to memory (262,144); the median by its definition (sort, take the middle)
    for (const count of [300_001, 300_002]) {
      const timesS = new Float64Array(count + 1);
      let seed = 12345;
      for (let i = 1; i <= count; i++) {
        seed = (seed * 1103515245 + 12345) % 2147483648;
        timesS[i] = timesS[i - 1] + 1e-9 * (1 + 0.1 * (seed / 2147483648 - 0.5));
      }
      const spacings = Float64Array.from({ length: count }, (_, i) => timesS[i + 1] - timesS[i]).sort();
      const middle = count >> 1;
      const expected = count % 2 === 1 ? spacings[middle] : (spacings[middle - 1] + spacings[middle]) / 2;
      expect(medianSampleIntervalS(new ArraySeries(timesS))).toBe(expected);
    }
  });
});
