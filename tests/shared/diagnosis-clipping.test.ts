import { describe, expect, it } from 'vitest';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';
import { observedOf, resolveSetup } from '../../shared/diagnosis/defaults';
import { assessClipping, clippedAmplitudeV, clippedSpan, screenWindow } from '../../shared/diagnosis/clipping';

const run = (input: DiagnosisInput) => assessClipping({ setup: resolveSetup(input).setup, observed: observedOf(input) });

describe('clipping', () => {
  it('should show offset ± divisions/2 × V/div', () => {
    // source: graticule definition; worked by hand
    expect(screenWindow(1, 0, 8)).toEqual({ bottomV: -4, topV: 4 });
    expect(screenWindow(0.5, 1, 10)).toEqual({ bottomV: -1.5, topV: 3.5 });
    expect(clippedSpan(-1, 6, { bottomV: -4, topV: 4 })).toEqual({ lowV: -1, highV: 4 });
  });

  it('should cut a 3.3 V square at 0.5 V/div to the 2 V above the centre line', () => {
    // worked by hand: window ±2 V, trace 0…3.3 V → 0…2 V shown
    const [c] = run({ scope: { voltsPerDiv: 0.5, offsetV: 0 }, signal: { expectedAmplitudeV: 3.3, frequencyHz: 1e6, kind: 'square' } });
    expect(c.predicted.amplitudeV).toBeCloseTo(2, 9);
    expect(c.estimates?.screenWindow).toBe('clipped');
    expect(c.deviation).toBeCloseTo(Math.log(3.3 / 2), 9);
    expect(c.detailTags).toEqual(['clipped-trace']);
  });

  it('should read V/div and offset on the screen scale, after the channel setting', () => {
    // 1x probe read at 10x: 3.3 V shows as 0…33 V; at 5 V/div the window is ±20 V → 20 V shown
    const [c] = run({ probe: { attenuation: 1 }, scope: { attenuationSetting: 10, voltsPerDiv: 5 }, signal: { expectedAmplitudeV: 3.3, kind: 'square', frequencyHz: 1e3 } });
    expect(c.predicted.amplitudeV).toBeCloseTo(20, 9);
  });

  it('should centre a sine on zero unless its low level is given', () => {
    // 2 Vpp sine, −1…1 V, at 0.2 V/div: window ±0.8 V → 1.6 V shown
    const [c] = run({ scope: { voltsPerDiv: 0.2 }, signal: { expectedAmplitudeV: 2, kind: 'sine', frequencyHz: 1e3 } });
    expect(c.predicted.amplitudeV).toBeCloseTo(1.6, 9);
  });

  it('should say the trace fits when the window holds it', () => {
    const [c] = run({ scope: { voltsPerDiv: 1 }, signal: { expectedAmplitudeV: 3.3, kind: 'square', frequencyHz: 1e3 } });
    expect(c.estimates?.screenWindow).toBe('fits');
    expect(c.deviation).toBe(0);
    expect(c.predicted.amplitudeV).toBeCloseTo(3.3, 9);
  });

  it('should warn of slow recovery when the input is overdriven far past the edge', () => {
    const [c] = run({ scope: { voltsPerDiv: 0.1 }, signal: { expectedAmplitudeV: 10, kind: 'square', frequencyHz: 1e3 } });
    expect(c.detailTags).toContain('overdriven-input');
    expect(c.explanation).toMatch(/recover/);
  });

  it('should fit a window to a trace seen clipped when no scale is recorded', () => {
    const candidates = run({ signal: { expectedAmplitudeV: 5, kind: 'square', frequencyHz: 1e3 }, observed: { clipped: true, amplitudeV: 4 } });
    const fitted = candidates.find((c) => c.basis === 'fitted')!;
    expect(fitted.predicted.amplitudeV).toBe(4);
    // 4 V across 8 divisions
    expect(fitted.estimates?.impliedVoltsPerDiv).toBeCloseTo(0.5, 9);
    expect(fitted.estimates?.screenWindow).toBe('clipped');
  });

  it('should say nothing without a scale or an amplitude', () => {
    const [c] = run({ signal: { expectedAmplitudeV: 5 } });
    expect(c.predicted).toEqual({});
    expect(c.deviation).toBe(0);
  });

  it('should clip what another cause predicts, for combined hypotheses', () => {
    // a generator set for 50 Ω doubles a 0…1 V square to 0…2 V; at 0.2 V/div the window is ±0.8 V → 0.8 V shown
    const { setup } = resolveSetup({ scope: { voltsPerDiv: 0.2 }, signal: { expectedAmplitudeV: 1, kind: 'square', frequencyHz: 1e3 } });
    expect(clippedAmplitudeV(setup, 2)).toBeCloseTo(0.8, 12);
    expect(clippedAmplitudeV(setup, 0.5)).toBeCloseTo(0.5, 12);
  });
});
