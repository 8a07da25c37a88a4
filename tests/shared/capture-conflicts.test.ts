import { describe, expect, it } from 'vitest';
import { observedProposals, settingConflicts, settingProposals } from '../../shared/capture/case-fill';
import { captureSettingsCheck } from '../../shared/review/capture-conflicts';
import type { Attachment } from '../../shared/schemas/case';

const capture = (analysis: Record<string, unknown>, id = 1): Attachment => ({
  id,
  kind: 'capture',
  url: '',
  thumbnailUrl: null,
  originalName: `c${id}.csv`,
  contentType: 'text/csv',
  sizeBytes: 1,
  width: null,
  height: null,
  createdAt: '',
  analysis,
  captureRole: null,
});

describe('settings from a capture against the recorded setup', () => {
  const analysis = { metadata: { attenuationSetting: 1, voltsPerDiv: 0.5, coupling: 'dc', raw: {} } };

  it('offers the settings the file recorded', () => {
    expect(settingProposals(analysis).map((p) => [p.field, p.value])).toEqual([
      ['attenuationSetting', 1],
      ['voltsPerDiv', 0.5],
      ['coupling', 'dc'],
    ]);
  });

  it('names a conflict: the file says 1X, the case says 10X', () => {
    const conflicts = settingConflicts(analysis, { attenuationSetting: 10, voltsPerDiv: 0.5 });
    expect(conflicts).toHaveLength(1);
    expect(conflicts[0].message).toBe('The file says the channel was set to 1X; the case records 10X.');
    // an empty field is something to fill, not a conflict; within 2 % is the same setting
    expect(settingConflicts(analysis, { voltsPerDiv: 0.505 })).toEqual([]);
  });

  it('gives the review checklist item', () => {
    const base = { setup: { scope: { attenuationSetting: 10 } }, attachments: [capture(analysis)] } as never;
    const check = captureSettingsCheck(base);
    expect(check.state).toBe('attention');
    expect(check.detail).toMatch(/c1.csv: The file says the channel was set to 1X; the case records 10X/);
    expect(captureSettingsCheck({ setup: { scope: { attenuationSetting: 1 } }, attachments: [capture(analysis)] } as never).state).toBe('pass');
    expect(captureSettingsCheck({ setup: {}, attachments: [] } as never).state).toBe('not_needed');
  });
});

describe('observed values from a capture', () => {
  it('fills every observed field the engine reads, corners through the signed overshoot', () => {
    const proposals = observedProposals({ amplitudeV: 3.3, riseTimeS: 2e-9, overshootPct: 0, cornerPct: -15, ringingFrequencyHz: null, frequencyHz: 1e3, clipped: false, tiltPct: 0, humFrequencyHz: 50 });
    const byField = Object.fromEntries(proposals.map((p) => [p.field, p.value]));
    expect(byField).toEqual({ amplitudeV: 3.3, riseTimeS: 2e-9, overshootPct: -15, ringingFrequencyHz: null, frequencyHz: 1e3, clipped: false, tiltPct: 0, humFrequencyHz: 50 });
    expect(proposals.find((p) => p.field === 'overshootPct')!.note).toMatch(/corner error -15 % \(rounded corners\)/);
  });
});
