import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { diagnose } from '../../shared/diagnosis/ranker';
import { groundLeadResonance, straightWireInductanceH } from '../../shared/diagnosis/ground-lead';
import { loadingRatioAt } from '../../shared/diagnosis/loading';

const MISMATCHES = ['attenuation-mismatch', 'termination-mismatch', 'compensation'];

describe('diagnosis properties', () => {
  it('should ring lower with a longer ground lead', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.005, max: 1, noNaN: true }),
        fc.double({ min: 1.01, max: 5, noNaN: true }),
        fc.double({ min: 1e-12, max: 200e-12, noNaN: true }),
        fc.double({ min: 0.05e-3, max: 1e-3, noNaN: true }),
        (shortM, stretch, capacitanceF, radiusM) => {
          const f = (lengthM: number) =>
            groundLeadResonance({ sourceResistanceOhm: 0, inductanceH: straightWireInductanceH(lengthM, radiusM), capacitanceF })
              .naturalFrequencyHz;
          expect(f(shortM * stretch)).toBeLessThan(f(shortM));
        },
      ),
    );
  });

  it('should predict a lower ringing frequency for a longer lead in diagnose', () => {
    // with ζ < 1/√2 the damped frequency falls with L too; 0–5 Ω keeps ζ well below that
    fc.assert(
      fc.property(
        fc.double({ min: 0.02, max: 0.5, noNaN: true }),
        fc.double({ min: 1.05, max: 4, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        (leadM, stretch, sourceOhm) => {
          const ring = (groundLeadM: number) =>
            diagnose({ probe: { attenuation: 10, groundLeadM }, circuit: { sourceResistanceOhm: sourceOhm }, signal: { frequencyHz: 1e6 } })
              .hypotheses.find((h) => h.cause === 'ground-lead')?.predicted.ringingFrequencyHz as number;
          expect(ring(leadM * stretch)).toBeLessThan(ring(leadM));
        },
      ),
    );
  });

  it('should show less amplitude from a higher source resistance', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e7, noNaN: true }),
        fc.double({ min: 1, max: 1e7, noNaN: true }),
        fc.double({ min: 1e5, max: 1e8, noNaN: true }),
        fc.double({ min: 1e-12, max: 200e-12, noNaN: true }),
        fc.double({ min: 0, max: 1e9, noNaN: true }),
        (sourceOhm, extraOhm, inputOhm, capacitanceF, frequencyHz) => {
          const p = { inputResistanceOhm: inputOhm, inputCapacitanceF: capacitanceF };
          const low = loadingRatioAt({ ...p, sourceResistanceOhm: sourceOhm }, frequencyHz);
          const high = loadingRatioAt({ ...p, sourceResistanceOhm: sourceOhm + extraOhm }, frequencyHz);
          expect(high).toBeLessThan(low);
        },
      ),
    );
  });

  it('should predict less amplitude under the loading hypothesis as the source resistance grows', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(1, 10),
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: 10, max: 1e6, noNaN: true }),
        fc.option(fc.double({ min: 1e3, max: 1e8, noNaN: true }), { nil: undefined }),
        fc.constantFrom('sine' as const, 'square' as const, 'dc' as const),
        (attenuation, sourceOhm, extraOhm, frequencyHz, kind) => {
          const shown = (sourceResistanceOhm: number) =>
            diagnose({ probe: { attenuation }, circuit: { sourceResistanceOhm }, signal: { expectedAmplitudeV: 1, frequencyHz, kind } })
              .hypotheses.find((h) => h.cause === 'loading')?.predicted.amplitudeV as number;
          expect(shown(sourceOhm + extraOhm)).toBeLessThan(shown(sourceOhm));
        },
      ),
    );
  });

  const matchedSetup = fc
    .record({
      attenuation: fc.constantFrom(1, 10, 100),
      sourceOhm: fc.double({ min: 0, max: 1000, noNaN: true }),
      leadM: fc.double({ min: 0, max: 0.03, noNaN: true }),
      groundKind: fc.constantFrom('spring' as const, 'clip-lead' as const),
      scopeHz: fc.double({ min: 100e6, max: 2e9, noNaN: true }),
      frequencyShare: fc.option(fc.double({ min: 1e-6, max: 1 / 50, noNaN: true }), { nil: undefined }),
      amplitudeV: fc.double({ min: 0.01, max: 20, noNaN: true }),
      kind: fc.option(fc.constantFrom('square' as const, 'sine' as const, 'dc' as const), { nil: undefined }),
      observe: fc.boolean(),
    })
    .map((s) => {
      const limitHz = s.attenuation === 1 ? 6e6 : s.scopeHz;
      return {
        probe: { attenuation: s.attenuation, groundLeadM: s.leadM, groundKind: s.groundKind },
        scope: { attenuationSetting: s.attenuation, inputResistanceOhm: 1e6, bandwidthHz: s.scopeHz },
        circuit: { sourceResistanceOhm: s.sourceOhm },
        signal: {
          expectedAmplitudeV: s.amplitudeV,
          frequencyHz: s.frequencyShare === undefined ? undefined : s.frequencyShare * limitHz,
          kind: s.kind,
        },
        observed: s.observe ? { amplitudeV: s.amplitudeV } : undefined,
      };
    });

  it('should never put a mismatch on top of a matched setup', () => {
    fc.assert(
      fc.property(matchedSetup, (input) => {
        const result = diagnose(input);
        expect(MISMATCHES).not.toContain(result.hypotheses[0].cause);
        for (const h of result.hypotheses) if (MISMATCHES.includes(h.cause)) expect(h.likelihood).toBeLessThan(0.5);
      }),
      { numRuns: 300 },
    );
  });

  it('should put attenuation mismatch on top for a 10x probe read at 1x, showing a tenth', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 0.3, noNaN: true }),
        fc.double({ min: 50e6, max: 2e9, noNaN: true }),
        // signals well inside the chain's bandwidth, so no other effect rivals a factor of ten
        fc.option(fc.double({ min: 1e-6, max: 0.01, noNaN: true }), { nil: undefined }),
        fc.option(fc.constantFrom('square' as const, 'sine' as const, 'dc' as const, 'pulse' as const), { nil: undefined }),
        fc.boolean(),
        (amplitudeV, sourceOhm, leadM, scopeHz, share, kind, observe) => {
          const result = diagnose({
            probe: { attenuation: 10, groundLeadM: leadM },
            scope: { attenuationSetting: 1, bandwidthHz: scopeHz },
            circuit: { sourceResistanceOhm: sourceOhm },
            signal: { expectedAmplitudeV: amplitudeV, frequencyHz: share === undefined ? undefined : share * scopeHz, kind },
            observed: observe ? { amplitudeV: amplitudeV / 10 } : undefined,
          });
          const top = result.hypotheses[0];
          expect(top.cause).toBe('attenuation-mismatch');
          expect(top.predicted.amplitudeV).toBeCloseTo(amplitudeV / 10, 9);
        },
      ),
      { numRuns: 300 },
    );
  });
});
