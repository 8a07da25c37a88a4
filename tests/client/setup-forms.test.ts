import { describe, expect, it } from 'vitest';
import type { CaseSetup } from '../../shared/schemas/case';
import { caseFormSchema } from '../../src/features/cases/form/case-form-schema';
import { caseToFormValues } from '../../src/features/cases/form/case-form-values';
import { BLANK_VALUES } from '../../src/features/diagnosis/form/diagnose-fields';
import { PRESETS } from '../../src/features/diagnosis/form/presets';
import { queryFromInput, readForm, valuesFromQuery } from '../../src/features/diagnosis/form/read-form';
import { readQuantity } from '../../src/lib/quantity';

describe('quantity fields for the acquisition settings', () => {
  it('should read sample rates, vertical scales, decibels and counts as typed at the bench', () => {
    expect(readQuantity('2.5 MSa/s', 'Sa/s')).toEqual({ kind: 'ok', value: 2.5e6 });
    expect(readQuantity('1G', 'Sa/s')).toEqual({ kind: 'ok', value: 1e9 });
    expect(readQuantity('500 mV/div', 'V/div')).toEqual({ kind: 'ok', value: 0.5 });
    expect(readQuantity('40 dB', 'dB')).toEqual({ kind: 'ok', value: 40 });
    expect(readQuantity('10', '#')).toEqual({ kind: 'ok', value: 10 });
    expect(readQuantity('fast', 'Sa/s').kind).toBe('error');
  });
});

describe('the Diagnose form', () => {
  it('should read every preset without a complaint', () => {
    for (const preset of PRESETS) {
      const { errors } = readForm({ ...BLANK_VALUES, ...preset.values });
      expect(errors, preset.id).toEqual({});
    }
  });

  it('should send the new fields in SI units, yes/no as booleans, and get them back from the address bar', () => {
    const values = {
      ...BLANK_VALUES,
      'scope.sampleRateHz': '2.5 MSa/s',
      'scope.coupling': 'ac',
      'probe.kind': 'differential',
      'probe.cmrrDb': '40 dB',
      'circuit.mainsConnected': 'true',
      'observed.clipped': 'false',
      'observed.tiltPct': '16 %',
      'signal.generatorLoad': '50-ohm',
    };
    const { input, errors } = readForm(values);
    expect(errors).toEqual({});
    expect(input.scope).toMatchObject({ sampleRateHz: 2.5e6, coupling: 'ac' });
    expect(input.probe).toMatchObject({ kind: 'differential', cmrrDb: 40 });
    expect(input.circuit).toMatchObject({ mainsConnected: true });
    expect(input.observed).toMatchObject({ clipped: false, tiltPct: 16 });
    expect(input.signal).toMatchObject({ generatorLoad: '50-ohm' });
    const back = valuesFromQuery(queryFromInput(input)).values;
    expect(back['circuit.mainsConnected']).toBe('true');
    expect(back['observed.clipped']).toBe('false');
    expect(back['scope.sampleRateHz']).toBe('2.5 MSa/s');
  });

  it('should refuse what the shared schema refuses, on the field that caused it', () => {
    const { errors } = readForm({ ...BLANK_VALUES, 'observed.tiltPct': '400 %', 'circuit.mainsFrequencyHz': '5 Hz' });
    expect(errors['observed.tiltPct']).toMatch(/at most 100 %/);
    expect(errors['circuit.mainsFrequencyHz']).toMatch(/at least/);
  });
});

describe('the case form', () => {
  it('should keep every new setup field and the safety note through the form and back', () => {
    const setup: CaseSetup = {
      probe: { nominalAttenuation: 10, switchable: false, kind: 'differential', cmrrDb: 60 },
      scope: { attenuationSetting: 10, bandwidthLimitOn: false, coupling: 'ac', acCornerHz: 10, sampleRateHz: 1e6, voltsPerDiv: 0.02, offsetV: -0.5, divisions: 10, riseTimeS: 1.2e-9 },
      circuit: { loadResistanceOhm: 1e6, referenceV: 48, highestVoltageV: 325, mainsConnected: true, mainsFrequencyHz: 50 },
      signal: { expectedAmplitudeV: 0.02, baseV: -0.01, generatorLoad: 'high-z' },
      observed: { amplitudeV: 0.065, frequencyHz: 1e3, clipped: false, tiltPct: 4, humFrequencyHz: 50 },
    };
    const values = caseToFormValues({
      title: 'Hum on a sensor line',
      summary: 'Three times the signal',
      narrative: '',
      setup,
      statedCause: 'mains-pickup',
      statedCauseOther: null,
      fix: null,
      lessonSummary: null,
      lessonDetail: null,
      safetyNote: 'Isolating transformer; scope earthed.',
      tags: [],
      diagnosis: null,
    });
    const parsed = caseFormSchema.parse(values);
    expect(parsed.safetyNote).toBe('Isolating transformer; scope earthed.');
    expect(parsed.setup?.probe).toMatchObject(setup.probe!);
    expect(parsed.setup?.scope).toMatchObject(setup.scope!);
    expect(parsed.setup?.circuit).toMatchObject(setup.circuit!);
    expect(parsed.setup?.signal).toMatchObject(setup.signal!);
    expect(parsed.setup?.observed).toMatchObject(setup.observed!);
  });
});
