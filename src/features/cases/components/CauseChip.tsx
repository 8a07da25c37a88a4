import { CAUSE_LABELS, type Cause } from '../../../../shared/schemas/diagnosis';

/** A cause as a chip: the engine's wording for its causes, "Other" otherwise. */
export function causeLabel(cause: string | null | undefined): string {
  if (!cause) return 'Undecided';
  if (cause === 'other') return 'Other cause';
  return CAUSE_LABELS[cause as Cause] ?? cause;
}

export function CauseChip({ cause, title, tone = 'plain' }: { cause: string | null; title?: string; tone?: 'plain' | 'agree' | 'caution' }) {
  const cls = tone === 'agree' ? 'border-agree bg-agree-soft' : tone === 'caution' ? 'border-caution bg-caution-soft' : 'border-rule bg-paper';
  return (
    <span title={title} className={`inline-block rounded-md border px-2 py-0.5 text-xs ${cls} ${cause ? '' : 'text-muted'}`}>
      {causeLabel(cause)}
    </span>
  );
}
