import { describe, expect, it } from 'vitest';
import { diagnosisInputSchema, type DiagnosisInput } from '../../shared/schemas/diagnosis';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import type { Candidate, ModelContext } from '../../shared/diagnosis/types';
import { assessAliasing } from '../../shared/diagnosis/aliasing';
import { assessClipping } from '../../shared/diagnosis/clipping';
import { assessAcCoupling } from '../../shared/diagnosis/ac-coupling';
import { assessCommonMode } from '../../shared/diagnosis/common-mode';
import { assessMainsPickup } from '../../shared/diagnosis/mains-pickup';
import { assessGeneratorLoad } from '../../shared/diagnosis/generator-load';
import { AC_COUPLING_TOPIC, ALIASING_TOPIC, CLIPPING_TOPIC } from '../../src/features/help/topics/acquisition-causes';
import { COMMON_MODE_TOPIC, GENERATOR_LOAD_TOPIC, MAINS_PICKUP_TOPIC } from '../../src/features/help/topics/reference-causes';
import { HELP_TOPICS } from '../../src/features/help/topics/help-topics';
import { CAUSES } from '../../shared/schemas/diagnosis';
import type { HelpTopic } from '../../src/features/help/topics/types';

/** A Help page's Diagnose fields ("probe.kind": "differential") as a request body, checked by the schema. */
function inputOf(topic: HelpTopic): DiagnosisInput {
  const body: Record<string, Record<string, unknown>> = {};
  for (const [path, value] of Object.entries(topic.diagnose ?? {})) {
    const [group, field] = path.split('.');
    body[group] ??= {};
    body[group][field] = value === 'true' ? true : value === 'false' ? false : value;
  }
  return diagnosisInputSchema.parse(body);
}

function run(topic: HelpTopic, model: (ctx: ModelContext) => Candidate[]): Candidate[] {
  const input = inputOf(topic);
  return model({ setup: resolveSetup(input).setup, observed: observedOf(input) });
}

describe('Help pages of the acquisition causes: each worked example', () => {
  it('should have a page for every cause', () => {
    for (const cause of CAUSES) expect(HELP_TOPICS.some((t) => t.cause === cause)).toBe(true);
  });

  it('aliasing: 1 MHz at 1.002 MSa/s shows at 2 kHz', () => {
    // source: sampling theorem, |1 MHz − 1 × 1.002 MSa/s| = 2 kHz
    const [recorded] = run(ALIASING_TOPIC, assessAliasing);
    expect(recorded.predicted.frequencyHz).toBeCloseTo(2e3, 3);
    expect(ALIASING_TOPIC.example).toContain('**2 kHz**');
  });

  it('clipping: a 0…5 V square at 0.5 V/div over 8 divisions shows 2 V', () => {
    // source: graticule definition, window 0 ± 4 × 0.5 V = ±2 V
    const [recorded] = run(CLIPPING_TOPIC, assessClipping);
    expect(recorded.predicted.amplitudeV).toBeCloseTo(2, 12);
    expect(CLIPPING_TOPIC.example).toContain('**2 V**');
  });

  it('AC coupling: a 50 Hz square at a 10 Hz corner droops about 30 %', () => {
    // source: single-pole high-pass steady state, tanh(π·10/100) = 0.30422 (the 50 Ω source moves it by 5e-5)
    const [recorded] = run(AC_COUPLING_TOPIC, assessAcCoupling);
    expect(recorded.predicted.tiltPct).toBeCloseTo(30.42, 1);
    // with a 10x probe: corner 10 Hz × 1 MΩ/10 MΩ = 1 Hz, tanh(π/100) = 3.14 %
    const tenX = assessAcCoupling({
      setup: resolveSetup({ ...inputOf(AC_COUPLING_TOPIC), probe: { attenuation: 10 }, scope: { coupling: 'ac', acCornerHz: 10, attenuationSetting: 10 }, circuit: { sourceResistanceOhm: 0 } }).setup,
      observed: {},
    });
    expect(tenX[0].predicted.tiltPct).toBeCloseTo(3.14, 2);
    expect(AC_COUPLING_TOPIC.example).toContain('**30 %**');
  });

  it('common mode: 400 V at 50 dB leaks about 1.26 V', () => {
    // source: CMRR definition, 400 × 10^(−2.5) = 1.2649 V
    const [recorded] = run(COMMON_MODE_TOPIC, assessCommonMode);
    expect(recorded.estimates?.commonModeLeakV).toBeCloseTo(1.2649, 4);
    expect(COMMON_MODE_TOPIC.example).toContain('**1.26 V**');
  });

  it('mains pickup: 100 Hz on 50 Hz mains is the second harmonic', () => {
    // source: Fourier series of a mains-locked disturbance, 100 / 50 = 2
    const fitted = run(MAINS_PICKUP_TOPIC, assessMainsPickup).find((c) => c.basis === 'fitted');
    expect(fitted?.estimates?.humHarmonic).toBe(2);
  });

  it('generator load: 1 V set for 50 Ω into 1 MΩ shows 2.0 V', () => {
    // source: voltage divider, 1 × 2 × 1e6 / (1e6 + 50) = 1.9999 V
    const [recorded] = run(GENERATOR_LOAD_TOPIC, assessGeneratorLoad);
    expect(recorded.predicted.amplitudeV).toBeCloseTo(1.9999, 4);
    expect(GENERATOR_LOAD_TOPIC.example).toContain('**2.0 V**');
  });
});
