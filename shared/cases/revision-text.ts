import type { CaseCreateInput, CaseSetup } from '../schemas/case';
import { CAUSE_LABELS, type Cause } from '../schemas/diagnosis';
import { formatEngineering } from '../units/engineering';

// Unit from a field name's suffix: tipCapacitanceF → F, sourceResistanceOhm → Ω …
const UNIT_SUFFIXES: [RegExp, string][] = [[/Ohm$/, 'Ω'], [/Hz$/, 'Hz'], [/F$/, 'F'], [/S$/, 's'], [/V$/, 'V'], [/M$/, 'm']];
const show = (key: string, value: number) => {
  const unit = UNIT_SUFFIXES.find(([re]) => re.test(key))?.[1];
  return unit ? formatEngineering(value, unit) : String(value);
};

const flatten = (prefix: string, value: unknown, out: string[]) => {
  if (value === null || value === undefined || value === '') return;
  if (typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value as Record<string, unknown>).sort(([a], [b]) => a.localeCompare(b))) flatten(`${prefix}.${k}`, v, out);
    return;
  }
  out.push(`${prefix}: ${Array.isArray(value) ? value.join(', ') : typeof value === 'number' ? show(prefix, value) : String(value)}`);
};

/** A plain-text rendering of a revision, one fact per line, so a line diff reads like a change log. */
export function revisionText(s: CaseCreateInput): string {
  const setupLines: string[] = [];
  flatten('setup', (s.setup ?? {}) as CaseSetup, setupLines);
  const cause = s.statedCause === 'other' ? `other: ${s.statedCauseOther ?? ''}` : s.statedCause ? CAUSE_LABELS[s.statedCause as Cause] : '';
  return [
    `Title: ${s.title}`,
    `Summary: ${s.summary}`,
    `Tags: ${(s.tags ?? []).join(', ')}`,
    ...setupLines,
    `Stated cause: ${cause}`,
    `Fix: ${s.fix ?? ''}`,
    `Lesson: ${s.lessonSummary ?? ''}`,
    `Lesson detail: ${s.lessonDetail ?? ''}`,
    ...(s.safetyNote ? [`Safety note: ${s.safetyNote}`] : []),
    'Narrative:',
    s.narrative ?? '',
  ].join('\n');
}
