import type { CaseCreateInput, CaseSetup } from '../schemas/case';
import { CAUSE_LABELS, type Cause } from '../schemas/diagnosis';

const flatten = (prefix: string, value: unknown, out: string[]) => {
  if (value === null || value === undefined || value === '') return;
  if (typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value as Record<string, unknown>).sort(([a], [b]) => a.localeCompare(b))) flatten(`${prefix}.${k}`, v, out);
    return;
  }
  out.push(`${prefix}: ${Array.isArray(value) ? value.join(', ') : String(value)}`);
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
    'Narrative:',
    s.narrative ?? '',
  ].join('\n');
}
