import { CAUSE_LABELS, type Cause } from '../../../shared/schemas/diagnosis';

/** A cause in the engine's wording; "Other cause" for causes outside its models. */
export function causeLabel(cause: string | null | undefined): string {
  if (!cause) return 'Undecided';
  if (cause === 'other') return 'Other cause';
  return CAUSE_LABELS[cause as Cause] ?? cause;
}

const TONES = {
  plain: 'border-rule bg-paper',
  agree: 'border-agree bg-agree-soft',
  caution: 'border-caution bg-caution-soft',
} as const;

/** A cause as a small chip, optionally prefixed with whose cause it is ("Stated", "Engine"). */
export function CauseChip({ cause, prefix, tone = 'plain', title }: { cause: string | null; prefix?: string; tone?: keyof typeof TONES; title?: string }) {
  return (
    <span title={title} className={`inline-flex items-baseline gap-1 rounded-md border px-2 py-0.5 text-xs ${TONES[tone]}`}>
      {prefix && <span className="text-muted">{prefix}</span>}
      <span className={cause ? 'font-semibold' : 'text-muted'}>{causeLabel(cause)}</span>
    </span>
  );
}
