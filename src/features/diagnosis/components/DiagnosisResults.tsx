import { Link } from 'react-router-dom';
import type { DiagnosisInput, DiagnosisResult, Hypothesis } from '../../../../shared/schemas/diagnosis';
import { Alert } from '../../../components/ui/Alert';
import { SafetyCaution } from '../../../components/ui/SafetyCaution';
import { VerdictSummary } from '../../../components/ui/VerdictSummary';
import { hypothesisName } from '../../../lib/hypothesis-words';
import { FIELDS } from '../form/diagnose-fields';
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
  // the lead and every other hypothesis that fits with some weight stay open; the rest fold away
  const open = (h: Hypothesis, i: number) => i === 0 || (h.fits && h.likelihood >= FOLD_BELOW);
  const shown = result.hypotheses.filter(open);
  const folded = result.hypotheses.filter((h, i) => !open(h, i));
  const observedAny = hasObservation(input);
  const recordNext = whatToRecordNext(result, input);
  return (
    <section id="diagnosis-results" aria-labelledby="diagnosis-results-title" className="flex min-w-0 scroll-mt-4 flex-col gap-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="diagnosis-results-title" className="text-xl">
          Verdict and causes
        </h2>
        {top && top.cause !== 'faithful' && (
          <Link to={`/cases?cause=${encodeURIComponent(top.cause)}`} className="text-sm font-semibold text-agree underline underline-offset-2">
            Find matching cases
          </Link>
        )}
      </div>
      <VerdictSummary result={result} observedAny={observedAny} recordNext={recordNext} />
      <ServerCheck server={server} />
      {unreadable.length > 0 && (
        <Alert tone="caution" title={`${unreadable.length === 1 ? 'One value cannot' : `${unreadable.length} values cannot`} be read and ${unreadable.length === 1 ? 'is' : 'are'} left out`}>
          {unreadable.map(fieldLabel).join(', ')}. The message under each field says what was expected.
        </Alert>
      )}
      <SafetyCaution risks={result.risks ?? []} />
      <ol className="flex flex-col gap-3" aria-label="Causes, most likely first">
        {shown.map((h, i) => (
          <li key={`${h.causes.join('+')}-${i === 0}`}>
            <HypothesisCard rank={i + 1} hypothesis={h} input={input} lead={i === 0} />
          </li>
        ))}
      </ol>
      {folded.length > 0 && (
        <details className="rounded-lg border border-rule bg-sheet px-4 py-3">
          <summary className="cursor-pointer text-sm font-semibold">
            Unlikely here ({folded.length}): {folded.map(hypothesisName).join(', ')}
          </summary>
          <ol className="mt-3 flex flex-col gap-3">
            {folded.map((h, i) => (
              <li key={h.causes.join('+')}>
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

/** For an unexplained trace: what the engine had to assume, then what the observation leaves out. */
function whatToRecordNext(result: DiagnosisResult, input: DiagnosisInput): string[] {
  const assumed = result.assumptions.map((a) => fieldLabel(a.field));
  const observed = (input.observed ?? {}) as Record<string, unknown>;
  const unobserved = FIELDS.filter((f) => f.key.startsWith('observed.') && (observed[f.key.slice('observed.'.length)] ?? null) === null).map((f) => f.label);
  return [...new Set([...assumed, ...unobserved])];
}
