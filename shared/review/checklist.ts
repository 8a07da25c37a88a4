import { hazardousLive } from '../safety/hazard';
import type { Case } from '../schemas/case';
import { CAUSE_LABELS, CAUSES, type Cause, type Hypothesis } from '../schemas/diagnosis';
import { captureSettingsCheck } from './capture-conflicts';

export type CheckState = 'pass' | 'attention' | 'not_needed';

export interface CheckItem {
  id: 'engine_agrees' | 'evidence' | 'lesson' | 'safety' | 'capture_settings';
  label: string;
  state: CheckState;
  detail: string;
}

const normal = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim();

/**
 * Whether the recorded setup touches mains, a hazardous-live voltage or a reference node that
 * far from earth (a peak value), whatever the engine says: a floor under its risks.
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

const ENGINE_LABEL = 'Engine agrees with the stated cause';
const pct = (x: number) => `${Math.round(x * 100)} %`;
const nameOf = (h: Hypothesis) => h.causes.map((k) => CAUSE_LABELS[k]).join(' + ');
const observedAnything = (c: Pick<Case, 'setup'>) =>
  Object.entries(c.setup.observed ?? {}).some(([k, v]) => k !== 'description' && v !== null && v !== undefined);

/**
 * "Engine agrees": the stated cause is one of the hypotheses that fit (alone or as a member of
 * a combined one). A faithful verdict says the setup explains the trace, so it does not back a
 * probing cause; neither does a ranking made with nothing observed.
 */
function engineCheck(c: Case): CheckItem {
  const attention = (detail: string): CheckItem => ({ id: 'engine_agrees', label: ENGINE_LABEL, state: 'attention', detail });
  const stated = c.statedCause;
  const d = c.diagnosis;
  if (!stated) return attention('No root cause is stated.');
  if (stated === 'other') return attention(`Stated cause is outside the engine's models (${c.statedCauseOther ?? 'other'}); judge it yourself.`);
  if (!d || d.hypotheses.length === 0) return attention('No diagnosis was computed for this setup.');
  if (!observedAnything(c)) return attention('Nothing observed is recorded, so the engine cannot test the stated cause; ask for what the scope showed.');
  const label = CAUSE_LABELS[stated];
  if (d.verdict === 'faithful') return attention(`Stated ${label}, but the engine finds the trace true: the recorded setup explains what was seen.`);
  const fitting = d.hypotheses.filter((h) => h.fits && h.cause !== 'faithful');
  const backing = fitting.find((h) => h.causes.includes(stated));
  if (backing) {
    const alone = backing.causes.length === 1 ? '' : ` (as part of ${nameOf(backing)})`;
    return {
      id: 'engine_agrees',
      label: ENGINE_LABEL,
      state: 'pass',
      detail: `${label} fits the observation${alone}: residual ${backing.residual.toFixed(2)}, ${pct(backing.likelihood)} likely.`,
    };
  }
  const own = d.hypotheses.find((h) => h.causes.length === 1 && h.cause === stated);
  const ownText = own ? ` Its residual is ${own.residual.toFixed(2)}, outside the fit.` : '';
  if (d.verdict === 'unexplained') return attention(`Stated ${label}, but nothing the engine models fits this observation.${ownText}`);
  const others = fitting.map(nameOf).join('; ');
  return attention(`Stated ${label} does not fit the observation.${ownText} What fits: ${others || 'nothing'}.`);
}

/** The review desk's checklist, filled in from the case itself (shared by server and client). */
export function reviewChecklist(c: Case): CheckItem[] {
  const engine = engineCheck(c);
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
  const risks = c.diagnosis?.risks ?? [];
  const needed = risks.length > 0 || caseNeedsSafetyNote(c);
  const note = c.safetyNote?.trim() ?? '';
  const why = risks.length > 0 ? `The engine raises ${risks.length === 1 ? 'a risk' : `${risks.length} risks`}: ${risks.map((r) => r.message).join(' ')}` : 'Mains, a voltage above our warning level or a reference node that far from earth is recorded.';
  const safety: CheckItem = {
    id: 'safety',
    label: 'Safety note present where needed',
    state: !needed ? 'not_needed' : note ? 'pass' : 'attention',
    detail: !needed ? 'The engine raises no risk for this setup.' : note ? `Safety note: “${note}”` : `${why} The Safety note is empty: ask the author how the circuit was probed safely.`,
  };
  const { conflicts: _conflicts, ...captureSettings } = captureSettingsCheck(c);
  return [engine, evidence, lesson, safety, captureSettings];
}

export const isKnownCause = (c: string | null): c is Cause => c !== null && (CAUSES as readonly string[]).includes(c);
