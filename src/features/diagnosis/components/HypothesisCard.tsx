import { useId, useState } from 'react';
import { CAUSE_LABELS, type DiagnosisInput, type Hypothesis } from '../../../../shared/schemas/diagnosis';
import { LikelihoodBar } from '../../../components/ui/LikelihoodBar';
import { estimateLabel, estimateValue } from '../form/labels';
import { HypothesisPlot } from './HypothesisPlot';
import { PredictedTable } from './PredictedTable';

export interface HypothesisCardProps {
  rank: number;
  hypothesis: Hypothesis;
  input: DiagnosisInput;
  /** The top card opens with its plot; the others draw it on demand. */
  lead?: boolean;
}

/** One ranked cause: how likely, what it predicts against what was seen, why, and the fix. */
export function HypothesisCard({ rank, hypothesis: h, input, lead = false }: HypothesisCardProps) {
  const [plotShown, setPlotShown] = useState(lead);
  const titleId = useId();
  const plotId = useId();
  const estimates = Object.entries(h.estimates ?? {});
  return (
    <article
      aria-labelledby={titleId}
      data-testid={`hypothesis-${h.cause}`}
      className={`flex min-w-0 flex-col gap-3 rounded-lg border bg-sheet p-4 ${lead ? 'border-agree shadow-[0_0_0_1px_var(--ft-agree)]' : 'border-rule'}`}
    >
      <header className="flex flex-col gap-1.5">
        <h3 id={titleId} className="text-base">
          <span className="mr-1.5 font-mono text-sm text-muted">{rank}.</span>
          {CAUSE_LABELS[h.cause]}
        </h3>
        <LikelihoodBar value={h.likelihood} strong={lead} />
      </header>
      <PredictedTable hypothesis={h} observed={input.observed} />
      <p className="text-sm leading-relaxed">{h.explanation}</p>
      <p className={`rounded-md px-3 py-2 text-sm ${lead ? 'bg-agree-soft' : 'bg-paper'}`}>
        <span className="font-semibold">Fix: </span>
        {h.fix}
      </p>
      {estimates.length > 0 && (
        <details className="text-sm">
          <summary className="cursor-pointer font-semibold">Estimates ({estimates.length})</summary>
          <dl className="mt-2 grid grid-cols-[minmax(0,1fr)_auto] gap-x-4 gap-y-1">
            {estimates.map(([k, v]) => (
              <div key={k} className="contents">
                <dt className="text-muted">{estimateLabel(k)}</dt>
                <dd className="text-right font-mono">{estimateValue(k, v)}</dd>
              </div>
            ))}
          </dl>
        </details>
      )}
      <div>
        <button
          type="button"
          aria-expanded={plotShown}
          aria-controls={plotId}
          onClick={() => setPlotShown((s) => !s)}
          className="text-sm font-semibold text-agree underline underline-offset-2"
        >
          {plotShown ? 'Hide the plot' : 'Show the plot'}
        </button>
        <div id={plotId} className="mt-2">
          {plotShown && <HypothesisPlot input={input} hypothesis={h} />}
        </div>
      </div>
    </article>
  );
}
