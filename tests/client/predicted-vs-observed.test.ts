import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { PredictedVsObserved } from '../../src/components/ui/PredictedVsObserved';
import { diagnose } from '../../shared/diagnosis/ranker';
import type { DiagnosisInput } from '../../shared/schemas/diagnosis';

/** A 10x passive probe into 50 Ω on a 1 MHz square: needles at the edges over flat tops near nothing (DESIGN, termination). */
const intoFifty = (observedV: number): DiagnosisInput => ({
  probe: { attenuation: 10, tipCapacitanceF: 10e-12 },
  scope: { attenuationSetting: 10, inputResistanceOhm: 50, bandwidthHz: 1e9 },
  signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' },
  observed: { amplitudeV: observedV },
});

const table = (input: DiagnosisInput) => {
  const result = diagnose(input);
  const termination = result.hypotheses.find((h) => h.cause === 'termination-mismatch')!;
  return renderToStaticMarkup(createElement(PredictedVsObserved, { hypothesis: termination, observed: input.observed as Record<string, unknown> }));
};

describe('the predicted-against-observed table on a needle train', () => {
  it('should show the amplitude as the needle it was read as, beside the reading', () => {
    const html = table(intoFifty(0.95));
    expect(html).toContain('Amplitude, read as one needle');
    // not the flat level, a few tens of µV, set against a reading of about a volt
    expect(html).not.toMatch(/µV/);
  });

  it('should name the peak to peak when the reading spans two needles', () => {
    expect(table(intoFifty(1.9))).toContain('Amplitude, read as the needles&#x27; peak to peak');
  });

  it('should keep the flat level where the reading is the flat level', () => {
    const html = table(intoFifty(5.6e-5));
    expect(html).toContain('>Amplitude<');
    expect(html).toMatch(/55\.\d µV/);
  });
});
