import { CAUSE_LABELS, type HypothesisCause } from '../../../shared/schemas/diagnosis';
import { residualText } from '../../lib/hypothesis-words';

/**
 * Whether a hypothesis fits the observation (the engine's gate), with its residual as a plain
 * figure, and the recorded settings that rule it out when there are any.
 */
export function FitBadge({ fits, residual, compared = true, ruledOutBy = [] }: { fits: boolean; residual: number; compared?: boolean; ruledOutBy?: HypothesisCause[] }) {
  if (!compared) {
    return <span className="rounded-full border border-rule px-2 py-0.5 text-[11px] font-semibold text-muted">not tested: nothing observed</span>;
  }
  return (
    <span className="inline-flex flex-wrap items-baseline gap-x-2 gap-y-0.5 text-xs" data-fits={fits}>
      <span
        className={`rounded-full border px-2 py-0.5 text-[11px] font-semibold uppercase tracking-wide ${fits ? 'border-agree bg-agree-soft text-agree' : 'border-caution bg-caution-soft text-caution'}`}
      >
        {fits ? 'fits' : 'does not fit'}
      </span>
      <span className="text-muted" title="Root-sum-square of the log-ratios between predicted and observed values; 0 is a perfect match">
        residual <span className="font-mono text-ink">{residualText(residual)}</span>
      </span>
      {ruledOutBy.length > 0 && <span className="text-muted">ruled out by the record: {ruledOutBy.map((c) => CAUSE_LABELS[c]).join(', ')}</span>}
    </span>
  );
}
