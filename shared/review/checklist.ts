import { hazardousLive } from '../safety/hazard';
import type { Case } from '../schemas/case';
import { CAUSE_LABELS, CAUSES, type Cause } from '../schemas/diagnosis';

export type CheckState = 'pass' | 'attention' | 'not_needed';

export interface CheckItem {
  id: 'engine_agrees' | 'evidence' | 'lesson' | 'safety';
  label: string;
  state: CheckState;
  detail: string;
}

const normal = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim();
const SAFETY_WORDS = /(isolat|differential|protective earth|ground clip|mains|hazard|safety|insulat|measurement categor|\bcat ?(ii|iii|iv)\b|licensed|local code)/i;

/**
 * Whether the case's setup reaches the IEC 61010-1 hazardous-live limits or touches mains:
 * the highest voltage present, or a reference node that far from earth (a peak value).
 */
export function caseNeedsSafetyNote(c: Pick<Case, 'setup'>): boolean {
  const circuit = c.setup.circuit;
  if (circuit?.mainsConnected) return true;
  const v = circuit?.highestVoltageV;
  const ref = circuit?.referenceV;
  return (
    (typeof v === 'number' && hazardousLive({ highestVoltageV: v }).hazardous) ||
    (typeof ref === 'number' && hazardousLive({ highestVoltageV: ref, kind: 'peak' }).hazardous)
  );
}

/** The review desk's checklist, filled in from the case itself (shared by server and client). */
export function reviewChecklist(c: Case): CheckItem[] {
  const top = c.diagnosis?.hypotheses[0];
  const stated = c.statedCause;
  let engine: CheckItem;
  if (!stated) engine = { id: 'engine_agrees', label: 'Engine agrees with the stated cause', state: 'attention', detail: 'No root cause is stated.' };
  else if (stated === 'other') engine = { id: 'engine_agrees', label: 'Engine agrees with the stated cause', state: 'attention', detail: `Stated cause is outside the engine's models (${c.statedCauseOther ?? 'other'}); judge it yourself.` };
  else if (!top) engine = { id: 'engine_agrees', label: 'Engine agrees with the stated cause', state: 'attention', detail: 'No diagnosis was computed for this setup.' };
  else if (c.diagnosis!.hypotheses[1] && top.likelihood - c.diagnosis!.hypotheses[1].likelihood < 1e-3)
    engine = { id: 'engine_agrees', label: 'Engine agrees with the stated cause', state: 'attention', detail: 'The recorded setup does not single out one cause; ask for the setup values and the observation.' };
  else {
    const statedH = c.diagnosis!.hypotheses.find((h) => h.cause === stated);
    const agrees = top.cause === stated;
    const pct = (x: number) => `${Math.round(x * 100)} %`;
    const gap = statedH?.residual !== undefined ? ` Its predictions differ from the observation by a log-ratio residual of ${statedH.residual.toFixed(2)}.` : '';
    engine = {
      id: 'engine_agrees',
      label: 'Engine agrees with the stated cause',
      state: agrees ? 'pass' : 'attention',
      detail: agrees
        ? `Engine's top cause is ${CAUSE_LABELS[top.cause]} (${pct(top.likelihood)}).${gap}`
        : `Stated ${CAUSE_LABELS[stated as Cause]} (${pct(statedH?.likelihood ?? 0)}), but the engine ranks ${CAUSE_LABELS[top.cause]} first (${pct(top.likelihood)}).${gap}`,
    };
  }
  const captures = c.attachments.filter((a) => a.kind === 'capture').length;
  const shots = c.attachments.length - captures;
  const evidence: CheckItem = {
    id: 'evidence',
    label: 'Capture or screenshot attached',
    state: c.attachments.length ? 'pass' : 'attention',
    detail: c.attachments.length ? `${captures} capture(s), ${shots} screenshot(s).` : 'Nothing attached: ask for the screenshot or the capture.',
  };
  const lessonText = c.lessonSummary?.trim() ?? '';
  const lessonOk = lessonText.length >= 12 && normal(lessonText) !== normal(c.title) && normal(lessonText) !== normal(c.summary);
  const lesson: CheckItem = {
    id: 'lesson',
    label: 'Lesson is actionable',
    state: lessonOk ? 'pass' : 'attention',
    detail: !lessonText ? 'No lesson written.' : lessonOk ? `“${lessonText}”` : 'The lesson only repeats the title or summary, or is too short to act on.',
  };
  const needed = caseNeedsSafetyNote(c);
  const text = [c.narrative, c.fix, c.lessonSummary, c.lessonDetail].filter(Boolean).join('\n');
  const safety: CheckItem = {
    id: 'safety',
    label: 'Safety note present where needed',
    state: !needed ? 'not_needed' : SAFETY_WORDS.test(text) ? 'pass' : 'attention',
    detail: !needed
      ? 'No mains connection, hazardous-live voltage or reference node away from earth recorded.'
      : SAFETY_WORDS.test(text)
        ? 'The write-up addresses safe probing of the hazardous circuit.'
        : 'Mains, a hazardous-live voltage or a reference node far from earth recorded, but the write-up says nothing about safe probing.',
  };
  return [engine, evidence, lesson, safety];
}

export const isKnownCause = (c: string | null): c is Cause => c !== null && (CAUSES as readonly string[]).includes(c);
