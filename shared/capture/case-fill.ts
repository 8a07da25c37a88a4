/**
 * What a capture's stored analysis offers to a case: the observed values the engine reads and
 * the settings the file recorded. Pure functions over the `POST /api/captures/analyze` shape
 * (read defensively: an older analysis lacks the newer fields), shared by the case form, the
 * case page and the review checklist.
 */

export type ObservedKey = 'amplitudeV' | 'riseTimeS' | 'overshootPct' | 'ringingFrequencyHz' | 'frequencyHz' | 'clipped' | 'tiltPct' | 'humFrequencyHz';
export type ScopeKey = 'attenuationSetting' | 'voltsPerDiv' | 'offsetV' | 'sampleRateHz' | 'coupling' | 'bandwidthLimitHz' | 'inputResistanceOhm';

export interface ObservedProposal {
  field: ObservedKey;
  label: string;
  /** SI number, a boolean for `clipped`; null when the capture has no such feature (the field is left alone). */
  value: number | boolean | null;
  note?: string;
}

export interface SettingProposal {
  field: ScopeKey;
  label: string;
  value: number | 'dc' | 'ac';
}

const num = (a: Record<string, unknown>, key: string) => (typeof a[key] === 'number' && Number.isFinite(a[key]) ? (a[key] as number) : null);

/** The observed fields a capture can fill, in the form's order. */
export function observedProposals(analysis: Record<string, unknown>): ObservedProposal[] {
  const rise = num(analysis, 'riseTimeS');
  const fall = num(analysis, 'fallTimeS');
  const overshoot = num(analysis, 'overshootPct');
  const corner = num(analysis, 'cornerPct');
  // the engine reads a probe's corner error through the signed overshoot (+ spike, − rounding)
  const cornerCarries = corner !== null && corner !== 0 && (overshoot === null || overshoot === 0 || corner > 0);
  const frequency = num(analysis, 'frequencyHz') ?? (num(analysis, 'periodS') ? 1 / num(analysis, 'periodS')! : null);
  return [
    { field: 'amplitudeV', label: 'Observed amplitude', value: num(analysis, 'amplitudeV') || null },
    {
      field: 'riseTimeS',
      label: 'Observed rise time',
      value: rise ?? fall,
      note: rise === null && fall !== null ? 'fall time: the capture has no rising edge' : undefined,
    },
    {
      field: 'overshootPct',
      label: 'Overshoot',
      value: cornerCarries ? corner : overshoot,
      note: cornerCarries ? `corner error ${Number(corner!.toPrecision(3))} %${corner! < 0 ? ' (rounded corners)' : ''}, entered as a signed overshoot as the engine reads corners` : undefined,
    },
    { field: 'ringingFrequencyHz', label: 'Ringing frequency', value: num(analysis, 'ringingFrequencyHz') },
    { field: 'frequencyHz', label: 'Observed frequency', value: frequency },
    { field: 'clipped', label: 'Clipped', value: typeof analysis.clipped === 'boolean' ? analysis.clipped : null },
    { field: 'tiltPct', label: 'Tilt', value: num(analysis, 'tiltPct') },
    { field: 'humFrequencyHz', label: 'Hum frequency', value: num(analysis, 'humFrequencyHz') },
  ];
}

const SETTING_LABELS: Record<ScopeKey, string> = {
  attenuationSetting: 'Channel attenuation setting',
  voltsPerDiv: 'Vertical scale',
  offsetV: 'Offset',
  sampleRateHz: 'Sample rate',
  coupling: 'Coupling',
  bandwidthLimitHz: 'Bandwidth limit',
  inputResistanceOhm: 'Scope input resistance',
};

/** The scope settings a capture's file recorded, for its analysed channel. */
export function settingProposals(analysis: Record<string, unknown>): SettingProposal[] {
  const metadata = (analysis.metadata ?? {}) as Record<string, unknown>;
  const out: SettingProposal[] = [];
  for (const field of Object.keys(SETTING_LABELS) as ScopeKey[]) {
    const value = metadata[field];
    if (field === 'coupling' ? value === 'dc' || value === 'ac' : typeof value === 'number' && Number.isFinite(value)) {
      out.push({ field, label: SETTING_LABELS[field], value: value as number | 'dc' | 'ac' });
    }
  }
  return out;
}

/** A recorded setting the file contradicts. */
export interface SettingConflict {
  field: ScopeKey;
  label: string;
  fileValue: number | 'dc' | 'ac';
  caseValue: number | 'dc' | 'ac';
  /** e.g. "The file says the channel was set to 1X; the case records 10X." */
  message: string;
}

// Settings are typed by hand from a scope's menu: within 2 % they agree.
const TOLERANCE = 0.02;

export function describeSetting(field: ScopeKey, value: number | 'dc' | 'ac'): string {
  if (typeof value === 'string') return value.toUpperCase();
  const g = (v: number) => Number(v.toPrecision(4)).toString();
  switch (field) {
    case 'attenuationSetting':
      return `${g(value)}X`;
    case 'voltsPerDiv':
      return value < 1 ? `${g(value * 1e3)} mV/div` : `${g(value)} V/div`;
    case 'offsetV':
      return `${g(value)} V`;
    case 'sampleRateHz':
      return value >= 1e9 ? `${g(value / 1e9)} GSa/s` : value >= 1e6 ? `${g(value / 1e6)} MSa/s` : value >= 1e3 ? `${g(value / 1e3)} kSa/s` : `${g(value)} Sa/s`;
    case 'bandwidthLimitHz':
      return value >= 1e6 ? `${g(value / 1e6)} MHz` : `${g(value / 1e3)} kHz`;
    case 'inputResistanceOhm':
      return value >= 1e6 ? `${g(value / 1e6)} MΩ` : `${g(value)} Ω`;
    default:
      return g(value);
  }
}

/**
 * The settings a capture's file recorded that differ from the case's recorded scope setup
 * (fields the case leaves empty are not conflicts; they are offered to be filled instead).
 */
export function settingConflicts(analysis: Record<string, unknown>, scope: Partial<Record<ScopeKey, unknown>> | null | undefined): SettingConflict[] {
  const conflicts: SettingConflict[] = [];
  for (const proposal of settingProposals(analysis)) {
    const recorded = scope?.[proposal.field];
    if (recorded === undefined || recorded === null || recorded === '') continue;
    const differs =
      typeof proposal.value === 'string'
        ? recorded !== proposal.value
        : typeof recorded === 'number' && Math.abs(recorded - proposal.value) > TOLERANCE * Math.max(Math.abs(recorded), Math.abs(proposal.value));
    if (!differs) continue;
    const fileText = describeSetting(proposal.field, proposal.value);
    const caseText = describeSetting(proposal.field, recorded as number | 'dc' | 'ac');
    conflicts.push({
      field: proposal.field,
      label: proposal.label,
      fileValue: proposal.value,
      caseValue: recorded as number | 'dc' | 'ac',
      message:
        proposal.field === 'attenuationSetting'
          ? `The file says the channel was set to ${fileText}; the case records ${caseText}.`
          : `${proposal.label}: the file says ${fileText}; the case records ${caseText}.`,
    });
  }
  return conflicts;
}
