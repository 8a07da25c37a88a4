import type { CaseSetup } from '../schemas/case';
import type { SymptomNumbers } from './symptom-query';

/**
 * The numbers of a case that make two cases alike, SI units: the setup that shaped the
 * measurement and what the scope showed. Absent when the case does not record them.
 */
export interface CaseNumbers {
  probeAttenuation?: number;
  channelSetting?: number;
  tipCapacitanceF?: number;
  groundLeadM?: number;
  bandwidthHz?: number;
  inputResistanceOhm?: number;
  sourceResistanceOhm?: number;
  expectedAmplitudeV?: number;
  frequencyHz?: number;
  /** Shown ÷ expected amplitude. */
  amplitudeRatio?: number;
  riseTimeS?: number;
  ringingFrequencyHz?: number;
  overshootPct?: number;
  sampleRateHz?: number;
  /** The frequency the screen showed (an alias when it differs from the signal's). */
  shownFrequencyHz?: number;
  tiltPct?: number;
  humFrequencyHz?: number;
}

const positive = (v: number | null | undefined) => (typeof v === 'number' && Number.isFinite(v) && v > 0 ? v : undefined);

/** The comparable numbers of a recorded setup; an empty object for a case with none. */
export function caseNumbersOf(setup: CaseSetup | null | undefined): CaseNumbers {
  const s = setup ?? {};
  const expected = positive(s.signal?.expectedAmplitudeV);
  const shown = positive(s.observed?.amplitudeV);
  const bandwidths = [s.probe?.bandwidthHz, s.scope?.bandwidthHz, s.scope?.bandwidthLimitOn ? s.scope?.bandwidthLimitHz : undefined].map(positive).filter((v) => v !== undefined);
  const n: CaseNumbers = {
    probeAttenuation: positive(s.probe?.attenuation ?? s.probe?.nominalAttenuation),
    channelSetting: positive(s.scope?.attenuationSetting),
    tipCapacitanceF: positive(s.probe?.tipCapacitanceF),
    groundLeadM: positive(s.probe?.groundLeadM),
    bandwidthHz: bandwidths.length ? Math.min(...bandwidths) : undefined,
    inputResistanceOhm: positive(s.scope?.inputResistanceOhm),
    sourceResistanceOhm: positive(s.circuit?.sourceResistanceOhm),
    expectedAmplitudeV: expected,
    frequencyHz: positive(s.signal?.frequencyHz),
    amplitudeRatio: expected && shown ? shown / expected : undefined,
    riseTimeS: positive(s.observed?.riseTimeS),
    ringingFrequencyHz: positive(s.observed?.ringingFrequencyHz),
    overshootPct: typeof s.observed?.overshootPct === 'number' ? s.observed.overshootPct : undefined,
    sampleRateHz: positive(s.scope?.sampleRateHz),
    shownFrequencyHz: positive(s.observed?.frequencyHz),
    tiltPct: typeof s.observed?.tiltPct === 'number' ? s.observed.tiltPct : undefined,
    humFrequencyHz: positive(s.observed?.humFrequencyHz),
  };
  return Object.fromEntries(Object.entries(n).filter(([, v]) => v !== undefined)) as CaseNumbers;
}

/**
 * How far apart one number is in two cases, in units of "a decade": |log10(a/b)| for the
 * quantities that span decades; overshoot compares the level it reaches, ln((1+a)/(1+b))/0.2,
 * so 15 % and 35 % are one unit apart; tilt the level a top ends at, ln((1−a)/(1−b))/0.2.
 */
function gap(key: keyof CaseNumbers, a: number, b: number): number {
  if (key === 'overshootPct') return Math.abs(Math.log(Math.max(0.01, 1 + a / 100) / Math.max(0.01, 1 + b / 100))) / 0.2;
  if (key === 'tiltPct') return Math.abs(Math.log(Math.max(0.01, 1 - a / 100) / Math.max(0.01, 1 - b / 100))) / 0.2;
  return Math.abs(Math.log10(a / b));
}

/**
 * Similarity of two cases' numbers in [0, 1]: e^(−d) with d the root-mean-square gap over
 * the numbers both record, scaled down by how many of their numbers they share.
 * 0 when they share none.
 */
export function numbersSimilarity(a: CaseNumbers, b: CaseNumbers): number {
  const keysA = Object.keys(a) as (keyof CaseNumbers)[];
  const shared = keysA.filter((k) => b[k] !== undefined);
  if (shared.length === 0) return 0;
  const d = Math.sqrt(shared.reduce((sum, k) => sum + gap(k, a[k]!, b[k]!) ** 2, 0) / shared.length);
  const coverage = shared.length / Math.max(keysA.length, Object.keys(b).length);
  return Math.exp(-d) * Math.sqrt(coverage);
}

/**
 * How well a case's numbers fit the numbers a symptom query stated, in [0, 1]: a Gaussian in
 * decades (σ = 0.15, so 120 MHz against 100 MHz still fits well and against 240 MHz does not),
 * averaged over the stated numbers; undefined when the query stated none the case records.
 */
export function symptomNumbersFit(query: SymptomNumbers, c: CaseNumbers): number | undefined {
  // a loop, no arrays: a search runs this for every case filed under an inferred cause
  let sum = 0;
  let count = 0;
  for (const k in query) {
    const key = k as keyof SymptomNumbers;
    const stated = query[key];
    const recorded = c[key];
    if (stated === undefined || recorded === undefined) continue;
    sum += Math.exp(-((gap(key, stated, recorded) / 0.15) ** 2) / 2);
    count++;
  }
  return count === 0 ? undefined : sum / count;
}
