import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeCapture } from '../../shared/capture/analyze';
import { parseCaptureText } from '../../shared/capture/parse';
import { medianSampleIntervalS } from '../../shared/capture/sample-interval';
import {
  addNoise,
  firstOrderStep,
  mulberry32,
  sampleUniformly,
  secondOrderStep,
  squareWaveform,
} from '../../shared/capture/synthetic';

// The `POST /api/captures/analyze` response fields (shared/DESIGN.md, HTTP contract).
const CONTRACT_FIELDS = [
  'points', 'sampleIntervalS', 'baseV', 'topV', 'amplitudeV', 'riseTimeS', 'fallTimeS',
  'overshootPct', 'ringingFrequencyHz', 'periodS',
];

describe('analyzeCapture', () => {
  const clock = sampleUniformly(squareWaveform(secondOrderStep(30e6, 0.25), { periodS: 1e-6, baseV: 0, topV: 3.3 }), {
    sampleIntervalS: 1e-9,
    points: 5000,
  });

  it('should answer every contract field, as JSON numbers', () => {
    const analysis = analyzeCapture(clock);
    for (const field of CONTRACT_FIELDS) {
      expect(typeof (analysis as unknown as Record<string, unknown>)[field]).toBe('number');
    }
    expect(analysis.amplitudeV).toBeCloseTo(3.3, 3);
    expect(JSON.parse(JSON.stringify(analysis))).toEqual(analysis);
  });

  it('should answer null for what a flat line does not have', () => {
    const flat = sampleUniformly(() => 0.8, { sampleIntervalS: 2e-9, points: 3000 });
    const analysis = analyzeCapture(flat);
    expect(analysis).toMatchObject({
      points: 3000,
      baseV: 0.8,
      topV: 0.8,
      amplitudeV: 0,
      riseTimeS: null,
      fallTimeS: null,
      overshootPct: null,
      undershootPct: null,
      ringingFrequencyHz: null,
      periodS: null,
      frequencyHz: null,
      edges: [],
      referenceLevels: null,
    });
    expect(analysis.sampleIntervalS).toBeCloseTo(2e-9, 20);
    expect(JSON.stringify(analysis)).not.toMatch(/NaN|Infinity/);
  });

  it('should answer null levels, not throw, for fewer than two samples', () => {
    const analysis = analyzeCapture({ timesS: new Float64Array([0]), volts: new Float64Array([1]) });
    expect(analysis.points).toBe(1);
    expect(analysis.sampleIntervalS).toBeNull();
    expect(analysis.baseV).toBeNull();
  });

  it('should measure a CSV capture written in µs and mV, answering in SI units', () => {
    const rows = ['Time (us),CH1 (mV)'];
    for (let k = 0; k < clock.timesS.length; k++) rows.push(`${(clock.timesS[k] * 1e6).toFixed(3)},${(clock.volts[k] * 1000).toFixed(3)}`);
    const parsed = parseCaptureText(rows.join('\n'));
    if (!parsed.ok) throw new Error(parsed.error.message);
    const fromCsv = analyzeCapture(parsed.samples);
    const direct = analyzeCapture(clock);
    expect(fromCsv.sampleIntervalS).toBeCloseTo(1e-9, 18);
    expect(fromCsv.amplitudeV).toBeCloseTo(direct.amplitudeV!, 4);
    expect(fromCsv.periodS).toBeCloseTo(direct.periodS!, 12);
    expect(Math.abs(fromCsv.riseTimeS! / direct.riseTimeS! - 1)).toBeLessThan(1e-3);
  });

  it('should list at most maxListedEdges edges but count them all', () => {
    const analysis = analyzeCapture(clock, { maxListedEdges: 3 });
    expect(analysis.edgeCount).toBe(10);
    expect(analysis.edges).toHaveLength(3);
    // the first three in time, and the means still over all ten, as with every edge listed
    const all = analyzeCapture(clock);
    expect(analysis.edges).toEqual(all.edges.slice(0, 3));
    expect([analysis.riseTimeS, analysis.fallTimeS, analysis.overshootPct, analysis.undershootPct]).toEqual([all.riseTimeS, all.fallTimeS, all.overshootPct, all.undershootPct]);
    const mean = (values: number[]) => values.reduce((sum, v) => sum + v, 0) / values.length;
    expect(all.riseTimeS).toBe(mean(all.edges.filter((edge) => edge.kind === 'rise').map((edge) => edge.durationS)));
  });

  it('should measure a 1,000,000-sample capture', () => {
    const big = sampleUniformly(squareWaveform(firstOrderStep(5e-9), { periodS: 1e-5, baseV: 0, topV: 1 }), {
      sampleIntervalS: 1e-9,
      points: 1_000_000,
    });
    addNoise(big.volts, 0.005, 1);
    const analysis = analyzeCapture(big);
    expect(analysis.points).toBe(1_000_000);
    expect(analysis.edgeCount).toBe(200);
    expect(Math.abs(analysis.periodS! / 1e-5 - 1)).toBeLessThan(1e-5);
    expect(Math.abs(analysis.riseTimeS! / (5e-9 * Math.log(9)) - 1)).toBeLessThan(0.03);
  });
});

describe('medianSampleIntervalS', () => {
  // source: the definition of the median, checked against a plain sort
  const sortedMedian = (values: number[]) => {
    const sorted = [...values].sort((a, b) => a - b);
    const middle = sorted.length >> 1;
    return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
  };

  it('should be the sample interval of a uniform capture', () => {
    expect(medianSampleIntervalS(new Float64Array([0, 2e-9, 4e-9, 6e-9]))).toBe(2e-9);
  });

  it('should equal the median of the spacings of a non-uniform capture', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 400 }), fc.integer(), (points, seed) => {
        const random = mulberry32(seed);
        const timesS = new Float64Array(points);
        for (let k = 1; k < points; k++) timesS[k] = timesS[k - 1] + 1e-9 * (0.5 + random() * (random() < 0.05 ? 20 : 1));
        const spacings = Array.from({ length: points - 1 }, (_, k) => timesS[k + 1] - timesS[k]);
        expect(medianSampleIntervalS(timesS)).toBe(sortedMedian(spacings));
      }),
      { numRuns: 300 },
    );
  });

  it('should equal the median of the spacings when found by histogram passes, ties and clusters included', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 600 }), fc.integer(), fc.constantFrom(1, 3, 8, 40), fc.boolean(), (points, seed, keep, quantised) => {
        const random = mulberry32(seed);
        const timesS = new Float64Array(points);
        // clustered spacings, often equal (a quantised time base), with rare long gaps
        for (let k = 1; k < points; k++) {
          const jitter = quantised ? Math.round(random() * 3) / 3 : random();
          timesS[k] = timesS[k - 1] + 1e-9 * (random() < 0.05 ? 20 + jitter : 1 + 1e-6 * jitter);
        }
        const spacings = Array.from({ length: points - 1 }, (_, k) => timesS[k + 1] - timesS[k]);
        expect(medianSampleIntervalS(timesS, keep, 0)).toBe(sortedMedian(spacings));
      }),
      { numRuns: 400 },
    );
  });

  it('should equal the median of the spacings when they take a few values, counted in one pass', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 600 }), fc.integer(), fc.integer({ min: 1, max: 40 }), fc.constantFrom(1, 2, 32, 256), (points, seed, values, distinct) => {
        const random = mulberry32(seed);
        // spacings drawn from `values` candidates: more than `distinct` of them sends the count on to the other paths
        const candidates = Array.from({ length: values }, () => 1e-9 * (1 + random()));
        const timesS = new Float64Array(points);
        for (let k = 1; k < points; k++) timesS[k] = timesS[k - 1] + candidates[Math.floor(random() * values)];
        const spacings = Array.from({ length: points - 1 }, (_, k) => timesS[k + 1] - timesS[k]);
        expect(medianSampleIntervalS(timesS, 1 << 18, distinct)).toBe(sortedMedian(spacings));
      }),
      { numRuns: 400 },
    );
  });

  it('should still equal the median when two instants tie, which the counting pass leaves to the other paths', () => {
    // source: the definition of the median, checked against a plain sort
    const timesS = new Float64Array([0, 1e-9, 1e-9, 2e-9, 3e-9, 3e-9, 3e-9, 4e-9]);
    const spacings = Array.from({ length: 7 }, (_, k) => timesS[k + 1] - timesS[k]);
    expect(medianSampleIntervalS(timesS)).toBe(sortedMedian(spacings));
    expect(spacings.filter((d) => d === 0)).toHaveLength(3);
  });

  it('should equal the median of the spacings of a time column written to nine significant digits', () => {
    // common practice, no source: a scope's CSV writes start + k·interval in scientific notation
    for (const [startS, intervalS] of [[0, 1e-9], [-5e-6, 2e-9], [1.5e-3, 4e-10]]) {
      const timesS = Float64Array.from({ length: 5001 }, (_, k) => Number((startS + k * intervalS).toExponential(8)));
      const spacings = Array.from({ length: 5000 }, (_, k) => timesS[k + 1] - timesS[k]);
      expect(new Set(spacings).size).toBeGreaterThan(1);
      expect(medianSampleIntervalS(timesS)).toBe(sortedMedian(spacings));
      expect(medianSampleIntervalS(timesS, 1 << 18, 0)).toBe(sortedMedian(spacings));
    }
  });
});
