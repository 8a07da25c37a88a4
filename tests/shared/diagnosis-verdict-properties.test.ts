import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { diagnose } from '../../shared/diagnosis/ranker';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';

// source: single-pole rise time t_r = ln 9/(2π·BW); stages add root-sum-square
const riseOf = (bandwidthHz: number) => Math.log(9) / (2 * Math.PI * bandwidthHz);
// common practice: a 1x passive probe reaches a few MHz (the engine's stated typical 6 MHz)
const ONE_X_BANDWIDTH_HZ = 6e6;

const anySetup = fc.record({
  attenuation: fc.constantFrom(1, 10, 100),
  setting: fc.constantFrom(1, 10, 100),
  inputOhm: fc.constantFrom(50, 1e6),
  leadM: fc.option(fc.double({ min: 0.005, max: 0.3, noNaN: true }), { nil: undefined }),
  sourceOhm: fc.option(fc.double({ min: 0, max: 1e6, noNaN: true }), { nil: undefined }),
  scopeHz: fc.option(fc.double({ min: 20e6, max: 2e9, noNaN: true }), { nil: undefined }),
  frequencyHz: fc.option(fc.double({ min: 10, max: 100e6, noNaN: true }), { nil: undefined }),
  kind: fc.option(fc.constantFrom('square' as const, 'sine' as const, 'dc' as const, 'pulse' as const), { nil: undefined }),
  amplitude: fc.option(fc.double({ min: 1e-3, max: 100, noNaN: true }), { nil: undefined }),
  observedAmplitude: fc.option(fc.double({ min: 1e-6, max: 1e3, noNaN: true }), { nil: undefined }),
  observedRise: fc.option(fc.double({ min: 1e-10, max: 1e-5, noNaN: true }), { nil: undefined }),
  overshoot: fc.option(fc.double({ min: -50, max: 100, noNaN: true }), { nil: undefined }),
  ringing: fc.option(fc.double({ min: 1e3, max: 2e9, noNaN: true }), { nil: undefined }),
});

describe('verdict properties', () => {
  it('should return likelihoods that sum to 1, the leader first, and a verdict that agrees with the fits', () => {
    fc.assert(
      fc.property(anySetup, (s) => {
        const result = diagnose({
          probe: { attenuation: s.attenuation, groundLeadM: s.leadM },
          scope: { attenuationSetting: s.setting, inputResistanceOhm: s.inputOhm, bandwidthHz: s.scopeHz },
          circuit: { sourceResistanceOhm: s.sourceOhm },
          signal: { expectedAmplitudeV: s.amplitude, frequencyHz: s.frequencyHz, kind: s.kind },
          observed: { amplitudeV: s.observedAmplitude, riseTimeS: s.observedRise, overshootPct: s.overshoot, ringingFrequencyHz: s.ringing },
        });
        const sum = result.hypotheses.reduce((a, h) => a + h.likelihood, 0);
        expect(sum).toBeCloseTo(1, 9);
        for (let i = 1; i < result.hypotheses.length; i++) {
          expect(result.hypotheses[i - 1].likelihood).toBeGreaterThanOrEqual(result.hypotheses[i].likelihood - 1e-12);
        }
        const top = result.hypotheses[0];
        if (result.verdict === 'faithful') expect(top.cause).toBe('faithful');
        if (result.verdict === 'measurement-error') expect(top.fits && top.cause !== 'faithful').toBe(true);
        if (result.verdict === 'unexplained') expect(result.hypotheses.some((h) => h.fits)).toBe(false);
        for (const h of result.hypotheses) expect(h.cause).toBe(h.causes[0]);
        // only fitting hypotheses tag
        const fittingCauses = new Set(result.hypotheses.filter((h) => h.fits).flatMap((h) => h.causes));
        for (const h of result.hypotheses) if (!fittingCauses.has(h.cause)) expect(result.tags).not.toContain(h.cause);
      }),
      { numRuns: 300 },
    );
  });

  it('should never call a measurement error when the observation equals what the recorded setup faithfully shows', () => {
    fc.assert(
      fc.property(
        fc.record({
          attenuation: fc.constantFrom(1, 10, 100),
          groundKind: fc.constantFrom('spring' as const, 'clip-lead' as const),
          leadM: fc.option(fc.double({ min: 0.005, max: 0.3, noNaN: true }), { nil: undefined }),
          // the source as a share of the most the probe can load without moving the trace (below)
          sourceShare: fc.double({ min: 0, max: 1, noNaN: true }),
          scopeHz: fc.double({ min: 20e6, max: 2e9, noNaN: true }),
          limitHz: fc.option(fc.double({ min: 1e6, max: 100e6, noNaN: true }), { nil: undefined }),
          frequencyHz: fc.option(fc.double({ min: 10, max: 50e6, noNaN: true }), { nil: undefined }),
          kind: fc.constantFrom('square' as const, 'sine' as const, 'dc' as const, 'pulse' as const),
          amplitudeV: fc.double({ min: 1e-3, max: 20, noNaN: true }),
          signalRiseS: fc.option(fc.double({ min: 1e-10, max: 1e-6, noNaN: true }), { nil: undefined }),
          observeEdges: fc.boolean(),
        }),
        (s) => {
          const hasEdges = s.kind === 'square' || s.kind === 'pulse';
          // the faithful picture from the physics, not from the engine: the true amplitude (the
          // channel matches the probe) and the true edge; where the record gives no edge, an
          // ideal one through the chain, its stages in quadrature
          const stages = [riseOf(s.scopeHz), s.attenuation === 1 ? riseOf(ONE_X_BANDWIDTH_HZ) : 0, s.limitHz ? riseOf(s.limitHz) : 0];
          const chainS = Math.sqrt(stages.reduce((a, t) => a + t * t, 0));
          // a recorded edge the chain can show as it is (the chain at most half as slow, so shown within 12 %);
          // a slower chain would make the edge seen here impossible (the next property)
          fc.pre(!(hasEdges && s.observeEdges && s.signalRiseS !== undefined) || chainS <= s.signalRiseS / 2);
          // and a signal the chain passes whole: its bandwidth ten times the frequency (a sine then reads 0.5 % low,
          // a square's settled top is reached); a narrower chain shrinks what is seen (the next property)
          fc.pre(s.frequencyHz === undefined || Math.log(9) / (2 * Math.PI * chainS) >= 10 * s.frequencyHz);
          const riseS = s.signalRiseS ?? chainS;
          // a source the probe barely loads: the load's own edge, ln 9·R_s·C, a third of the edge seen at most
          // (shown within 6 %, edges in quadrature), its RC corner ten times the frequency, and at least 97 %
          // of the level kept by R_in/(R_s + R_in)
          // common practice: a 10x or 100x probe puts about 12 pF on the tip (9 or 99 MΩ into 1 MΩ), a 1x probe about 100 pF
          const tipF = s.attenuation === 1 ? 100e-12 : 12e-12;
          const probeOhm = s.attenuation === 1 ? 1e6 : s.attenuation * 1e6;
          const limits = [1e5, (0.03 / 0.97) * probeOhm];
          if (hasEdges && s.observeEdges) limits.push(riseS / (3 * Math.log(9) * tipF));
          if (s.frequencyHz !== undefined) limits.push(1 / (2 * Math.PI * tipF * 10 * s.frequencyHz));
          const sourceOhm = s.sourceShare * Math.min(...limits);
          const observed: NonNullable<DiagnosisInput['observed']> = { amplitudeV: s.amplitudeV };
          if (hasEdges && s.observeEdges) Object.assign(observed, { riseTimeS: riseS, overshootPct: 0 });
          const result = diagnose({
            probe: { attenuation: s.attenuation, groundKind: s.groundKind, groundLeadM: s.leadM },
            scope: { attenuationSetting: s.attenuation, inputResistanceOhm: 1e6, bandwidthHz: s.scopeHz, bandwidthLimitHz: s.limitHz },
            circuit: { sourceResistanceOhm: sourceOhm },
            signal: { expectedAmplitudeV: s.amplitudeV, frequencyHz: s.frequencyHz, kind: s.kind, riseTimeS: s.signalRiseS },
            observed,
          });
          expect(result.verdict).toBe('faithful');
          expect(result.hypotheses[0].cause).toBe('faithful');
        },
      ),
      { numRuns: 300 },
    );
  });

  // The recorded setup itself predicts an error on what was observed, yet the trace looks like the
  // true signal: a true trace would need a recorded value to be wrong, so nothing fits.
  it('should answer unexplained, not faithful, when what was seen is the true signal but the record says the scope cannot show it', () => {
    fc.assert(
      fc.property(
        fc.record({
          amplitudeV: fc.double({ min: 1e-2, max: 20, noNaN: true }),
          frequencyHz: fc.double({ min: 1e3, max: 10e6, noNaN: true }),
          scopeHz: fc.double({ min: 50e6, max: 1e9, noNaN: true }),
          // source: single-pole rise time; the chain at least 3x slower than the recorded edge shows it ≥ 3.2x slower
          edgeShare: fc.double({ min: 0.01, max: 1 / 3, noNaN: true }),
          which: fc.constantFrom('10x probe on a 1x channel', '1x probe on a 10x channel', '10x probe into 50 Ω', 'edge faster than the chain', 'bandwidth limit below the signal'),
        }),
        (s) => {
          const input: DiagnosisInput = {
            probe: { attenuation: 10 },
            scope: { attenuationSetting: 10, bandwidthHz: s.scopeHz },
            signal: { expectedAmplitudeV: s.amplitudeV, frequencyHz: s.frequencyHz, kind: 'square' },
            observed: { amplitudeV: s.amplitudeV },
          };
          // common practice: the scope shows true × setting ÷ probe ratio; a passive 10x probe into 50 Ω divides by about 180,000 at DC
          if (s.which === '10x probe on a 1x channel') input.scope!.attenuationSetting = 1;
          if (s.which === '1x probe on a 10x channel') input.probe!.attenuation = 1;
          if (s.which === '10x probe into 50 Ω') input.scope!.inputResistanceOhm = 50;
          if (s.which === 'edge faster than the chain') {
            const signalRiseS = s.edgeShare * riseOf(s.scopeHz);
            input.signal!.riseTimeS = signalRiseS;
            input.observed!.riseTimeS = signalRiseS;
          }
          // source: a square through a single pole at f/2 settles to tanh(T/4τ) = tanh(π/4) ≈ 0.66 of its step
          if (s.which === 'bandwidth limit below the signal') input.scope!.bandwidthLimitHz = s.frequencyHz / 2;
          const result = diagnose(input);
          const faithful = result.hypotheses.find((h) => h.cause === 'faithful')!;
          // into 50 Ω each edge comes through as a needle of up to the step on the screen's scale (DESIGN,
          // termination), up at one edge and down at the next: a reading as large as the true amplitude
          // may be one needle or their peak to peak, a termination error
          const needleRead = s.which === '10x probe into 50 Ω' && result.verdict === 'measurement-error';
          if (needleRead) {
            expect(result.hypotheses[0].cause).toBe('termination-mismatch');
            const needleV = result.hypotheses[0].predicted.spikeV!;
            expect(Math.min(...[needleV, 2 * needleV].map((v) => Math.abs(Math.log(v / s.amplitudeV))))).toBeLessThan(0.25);
          } else expect(result.verdict).toBe('unexplained');
          expect(faithful.fits).toBe(false);
          expect(faithful.explanation).toMatch(/a recorded value must be wrong/);
          expect(faithful.explanation).not.toMatch(/probe ratio matches the channel/);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('should never raise the ground-lead fit when a recorded lead contradicts it', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 20e6, max: 400e6, noNaN: true }),
        fc.double({ min: 3, max: 30, noNaN: true }),
        fc.double({ min: 0, max: 50, noNaN: true }),
        (ringHz, factor, sourceOhm) => {
          const base: DiagnosisInput = {
            probe: { attenuation: 10, tipCapacitanceF: 12e-12 },
            scope: { attenuationSetting: 10, bandwidthHz: 1e9 },
            circuit: { sourceResistanceOhm: sourceOhm },
            signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' },
            observed: { amplitudeV: 1, ringingFrequencyHz: ringHz },
          };
          const before = diagnose(base);
          const lead = (r: typeof before) => r.hypotheses.filter((h) => h.causes.includes('ground-lead')).reduce((a, h) => a + h.likelihood, 0);
          const implied = before.hypotheses.find((h) => h.cause === 'ground-lead')?.estimates?.impliedLeadLengthM as number;
          // a recorded length on the far side of the assumed 15 cm clip lead, a factor off the fit
          const recordedM = implied >= 0.15 ? 0.15 / factor : Math.min(10, 0.15 * factor);
          const after = diagnose({ ...base, probe: { ...base.probe, groundLeadM: recordedM } });
          expect(lead(after)).toBeLessThanOrEqual(lead(before) + 1e-9);
          const fitsAfter = after.hypotheses.filter((h) => h.causes.includes('ground-lead') && h.fits);
          if (fitsAfter.length === 0) expect(after.tags).not.toContain('ground-lead');
        },
      ),
      { numRuns: 200 },
    );
  });

  it('should never raise the loading fit when a recorded source impedance contradicts it', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.2, max: 0.9, noNaN: true }), fc.double({ min: 1e-3, max: 0.2, noNaN: true }), (ratio, share) => {
        const base: DiagnosisInput = {
          probe: { attenuation: 10 },
          scope: { attenuationSetting: 10 },
          signal: { expectedAmplitudeV: 1, kind: 'dc' },
          observed: { amplitudeV: ratio },
        };
        const loading = (r: ReturnType<typeof diagnose>) => r.hypotheses.filter((h) => h.causes.includes('loading')).reduce((a, h) => a + h.likelihood, 0);
        const before = diagnose(base);
        const implied = before.hypotheses.find((h) => h.cause === 'loading')?.estimates?.impliedSourceResistanceOhm as number;
        // recorded far below what the fit needs (and below the assumed 50 Ω)
        const after = diagnose({ ...base, circuit: { sourceResistanceOhm: Math.min(50, implied) * share } });
        expect(loading(after)).toBeLessThanOrEqual(loading(before) + 1e-9);
      }),
      { numRuns: 200 },
    );
  });
});

describe('result values', () => {
  it('should hold only finite numbers, so the JSON response never carries null for a number', () => {
    fc.assert(
      fc.property(anySetup, (s) => {
        const result = diagnose({
          probe: { attenuation: s.attenuation, groundLeadM: s.leadM },
          scope: { attenuationSetting: s.setting, inputResistanceOhm: s.inputOhm, bandwidthHz: s.scopeHz },
          circuit: { sourceResistanceOhm: s.sourceOhm },
          signal: { expectedAmplitudeV: s.amplitude, frequencyHz: s.frequencyHz, kind: s.kind },
          observed: { amplitudeV: s.observedAmplitude, riseTimeS: s.observedRise, overshootPct: s.overshoot, ringingFrequencyHz: s.ringing },
        });
        for (const h of result.hypotheses) {
          expect(Number.isFinite(h.likelihood) && Number.isFinite(h.residual)).toBe(true);
          for (const v of Object.values(h.predicted)) expect(Number.isFinite(v)).toBe(true);
          for (const v of Object.values(h.estimates ?? {})) if (typeof v === 'number') expect(Number.isFinite(v)).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });
});
