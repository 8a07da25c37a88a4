import { settingConflicts, type SettingConflict } from '../capture/case-fill';
import type { Case } from '../schemas/case';

/** One item of the review checklist, in the shape `reviewChecklist` returns. */
export interface CaptureConflictCheck {
  id: 'capture_settings';
  label: string;
  state: 'pass' | 'attention' | 'not_needed';
  detail: string;
  conflicts: (SettingConflict & { attachmentId: number; originalName: string })[];
}

/**
 * Review checklist item: do the settings recorded in the case's capture files (the channel's
 * attenuation setting, V/div, coupling…) agree with the setup the author recorded? An exported
 * capture records the channel's settings, not the probe that was on it, so a disagreement is
 * exactly what an attenuation-mismatch case turns on, or a slip in the write-up.
 */
export function captureSettingsCheck(c: Pick<Case, 'setup' | 'attachments'>): CaptureConflictCheck {
  const label = 'Capture settings agree with the recorded setup';
  const captures = c.attachments.filter((a) => a.kind === 'capture' && a.analysis);
  const withSettings = captures.filter((a) => a.analysis && typeof a.analysis.metadata === 'object' && a.analysis.metadata !== null);
  if (withSettings.length === 0) {
    return { id: 'capture_settings', label, state: 'not_needed', detail: captures.length ? 'The capture files record no settings.' : 'No capture is attached.', conflicts: [] };
  }
  const conflicts = withSettings.flatMap((a) =>
    settingConflicts(a.analysis!, c.setup.scope as Record<string, unknown> | null | undefined).map((conflict) => ({ ...conflict, attachmentId: a.id, originalName: a.originalName })),
  );
  if (conflicts.length === 0) return { id: 'capture_settings', label, state: 'pass', detail: 'The settings in the capture files match the recorded setup (or fill fields it leaves empty).', conflicts };
  return {
    id: 'capture_settings',
    label,
    state: 'attention',
    detail: conflicts.map((x) => `${x.originalName}: ${x.message}`).join(' '),
    conflicts,
  };
}
