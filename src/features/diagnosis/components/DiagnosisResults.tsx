import { Link } from 'react-router-dom';
import { CAUSE_LABELS, type DiagnosisInput, type DiagnosisResult } from '../../../../shared/schemas/diagnosis';
import { Alert } from '../../../components/ui/Alert';
import { SafetyCaution } from '../../../components/ui/SafetyCaution';
import { assumptionValue, fieldLabel } from '../form/labels';
import { hasObservation } from '../form/read-form';
import type { DiagnoseFormState } from '../hooks/use-diagnose-form';
import { HypothesisCard } from './HypothesisCard';
import { ServerCheck } from './ServerCheck';

/** Causes under this share are folded away: they are listed for completeness, not for reading. */
const FOLD_BELOW = 0.01;

export interface DiagnosisResultsProps {
  result: DiagnosisResult;
  input: DiagnosisInput;
  server: DiagnoseFormState['server'];
  unreadable: string[];
}

/** Ranked causes with their numbers and plots, the risks, and what the engine assumed. */
export function DiagnosisResults({ result, input, server, unreadable }: DiagnosisResultsProps) {
  const top = result.hypotheses[0];
  const shown = result.hypotheses.filter((h, i) => i === 0 || h.likelihood >= FOLD_BELOW);
  const folded = result.hypotheses.slice(shown.length);
  const hazards = (result.risks ?? []).filter((r) => r.level === 'hazard');
  const cautions = (result.risks ?? []).filter((r) => r.level === 'caution');
  return (
    <section id="diagnosis-results" aria-labelledby="diagnosis-results-title" className="flex min-w-0 scroll-mt-4 flex-col gap-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="diagnosis-results-title" className="text-xl">
          Likely causes
        </h2>
        {top && (
          <Link to={`/cases?cause=${encodeURIComponent(top.cause)}`} className="text-sm font-semibold text-agree underline underline-offset-2">
            Find matching cases
          </Link>
        )}
      </div>
      <ServerCheck server={server} />
      {unreadable.length > 0 && (
        <Alert tone="caution" title={`${unreadable.length === 1 ? 'One value cannot' : `${unreadable.length} values cannot`} be read and ${unreadable.length === 1 ? 'is' : 'are'} left out`}>
          {unreadable.map(fieldLabel).join(', ')}. The message under each field says what was expected.
        </Alert>
      )}
      {hazards.length > 0 && <SafetyCaution reasons={hazards.map((r) => r.message)} />}
      {cautions.map((r) => (
        <Alert key={r.id} tone="caution">
          {r.message}
        </Alert>
      ))}
      {!hasObservation(input) && (
        <Alert tone="info" title="Nothing observed yet">
          The causes are ranked by how far each would move the trace for this setup. Fill in what the scope showed to rank them against it.
        </Alert>
      )}
      <ol className="flex flex-col gap-3" aria-label="Causes, most likely first">
        {shown.map((h, i) => (
          <li key={`${h.cause}-${i === 0}`}>
            <HypothesisCard rank={i + 1} hypothesis={h} input={input} lead={i === 0} />
          </li>
        ))}
      </ol>
      {folded.length > 0 && (
        <details className="rounded-lg border border-rule bg-sheet px-4 py-3">
          <summary className="cursor-pointer text-sm font-semibold">
            Unlikely here ({folded.length}): {folded.map((h) => CAUSE_LABELS[h.cause]).join(', ')}
          </summary>
          <ol className="mt-3 flex flex-col gap-3">
            {folded.map((h, i) => (
              <li key={h.cause}>
                <HypothesisCard rank={shown.length + i + 1} hypothesis={h} input={input} />
              </li>
            ))}
          </ol>
        </details>
      )}
      {result.assumptions.length > 0 && (
        <section aria-labelledby="diagnosis-assumed-title" className="rounded-lg border border-rule bg-sheet p-4">
          <h3 id="diagnosis-assumed-title" className="text-base">
            What the engine assumed
          </h3>
          <p className="mt-0.5 text-xs text-muted">Values the form leaves blank take a typical figure. Enter the real one to replace it.</p>
          <ul className="mt-2 flex flex-col gap-1.5 text-sm">
            {result.assumptions.map((a) => (
              <li key={a.field}>
                <span className="mr-1.5 rounded-full border border-rule px-1.5 text-[11px] font-semibold uppercase tracking-wide text-muted">assumed</span>
                {fieldLabel(a.field)} <span className="font-mono">= {assumptionValue(a)}</span>
                <span className="text-muted"> — {a.why}</span>
              </li>
            ))}
          </ul>
        </section>
      )}
    </section>
  );
}
