import { describeSetting, settingConflicts, settingProposals } from '../../../../shared/capture/case-fill';
import type { CaseSetup } from '../../../../shared/schemas/case';

/**
 * The settings the capture file recorded for its analysed channel, each checked against the
 * case's recorded scope setup: a disagreement (the file says 1X, the case 10X) is shown in amber.
 */
export function CaptureSettings({ analysis, setup }: { analysis: Record<string, unknown>; setup: CaseSetup }) {
  const settings = settingProposals(analysis);
  if (settings.length === 0) return null;
  const conflicts = settingConflicts(analysis, setup.scope as Record<string, unknown> | null | undefined);
  return (
    <section aria-label="Settings in the capture file" className="text-sm">
      <h4 className="text-xs font-semibold uppercase tracking-wide text-muted">Settings in the file</h4>
      <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
        {settings.map((s) => {
          const conflict = conflicts.find((c) => c.field === s.field);
          return (
            <li key={s.field} className={conflict ? 'text-caution' : undefined}>
              {s.label} <span className="font-mono">{describeSetting(s.field, s.value)}</span>
            </li>
          );
        })}
      </ul>
      {conflicts.length > 0 && (
        <ul role="alert" aria-label="Conflicts with the recorded setup" className="mt-2 rounded-md border border-caution/60 bg-caution-soft px-3 py-2 text-caution">
          {conflicts.map((c) => (
            <li key={c.field}>{c.message}</li>
          ))}
        </ul>
      )}
    </section>
  );
}
