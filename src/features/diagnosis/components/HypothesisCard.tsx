import { MathText } from '../../../components/ui/MathText';
import { useId, useState } from 'react';
import type { DiagnosisInput, Hypothesis } from '../../../../shared/schemas/diagnosis';
import { FitBadge } from '../../../components/ui/FitBadge';
import { LikelihoodBar } from '../../../components/ui/LikelihoodBar';
import { PredictedVsObserved } from '../../../components/ui/PredictedVsObserved';
import { hypothesisName } from '../../../lib/hypothesis-words';
import { estimateLabel, estimateValue } from '../form/labels';
import { hasObservation } from '../form/read-form';
import { HypothesisPlot } from './HypothesisPlot';

export interface HypothesisCardProps {
  rank: number;
  hypothesis: Hypothesis;
  input: DiagnosisInput;
  /** The top card opens with its plot; the others draw it on demand. */
  lead?: boolean;
}

/** One ranked hypothesis: how likely, whether it fits, what it predicts against what was seen, why, the test and the fix. */
export function HypothesisCard({ rank, hypothesis: h, input, lead = false }: HypothesisCardProps) {
  const [plotShown, setPlotShown] = useState(lead);
  const titleId = useId();
  const plotId = useId();
  const estimates = Object.entries(h.estimates ?? {});
  const compared = hasObservation(input);
  const combined = h.causes.length > 1;
  const edge = lead ? (h.fits || !compared ? 'border-agree shadow-[0_0_0_1px_var(--ft-agree)]' : 'border-caution') : 'border-rule';
  return (
    <article
      aria-labelledby={titleId}
      data-testid={`hypothesis-${h.causes.join('+')}`}
      data-fits={h.fits}
      className={`flex min-w-0 flex-col gap-3 rounded-lg border bg-sheet p-4 ${edge}`}
    >
      <header className="flex flex-col gap-1.5">
        <h3 id={titleId} className="text-base">
          <span className="mr-1.5 font-mono text-sm text-muted">{rank}.</span>
          {hypothesisName(h)}
        </h3>
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <FitBadge fits={h.fits} residual={h.residual} compared={compared} ruledOutBy={h.ruledOutBy} />
          {combined && <span className="text-xs text-muted">Two causes at once</span>}
        </div>
        <LikelihoodBar value={h.likelihood} strong={lead} />
      </header>
      <PredictedVsObserved hypothesis={h} observed={input.observed} />
      <p className="text-sm leading-relaxed">
        <MathText text={h.explanation} />
      </p>
      {h.confirm && (
        <p className="rounded-md border border-rule px-3 py-2 text-sm">
          <span className="font-semibold">Confirm at the bench: </span>
          {h.confirm}
        </p>
      )}
      <p className={`rounded-md px-3 py-2 text-sm ${lead && h.fits ? 'bg-agree-soft' : 'bg-paper'}`}>
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
          {plotShown && (
            <>
              {combined && <p className="mb-1 text-xs text-muted">The plot shows the first of the two causes.</p>}
              <HypothesisPlot input={input} hypothesis={h} />
            </>
          )}
        </div>
      </div>
    </article>
  );
}
