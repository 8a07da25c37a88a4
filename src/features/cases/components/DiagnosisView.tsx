import { MathText } from '../../../components/ui/MathText';
import type { ReactNode } from 'react';
import type { CaseSetup } from '../../../../shared/schemas/case';
import type { DiagnosisResult, Hypothesis } from '../../../../shared/schemas/diagnosis';
import { formatEngineering } from '../../../../shared/units/engineering';
import { FitBadge } from '../../../components/ui/FitBadge';
import { LikelihoodBar } from '../../../components/ui/LikelihoodBar';
import { PredictedVsObserved } from '../../../components/ui/PredictedVsObserved';
import { VerdictSummary } from '../../../components/ui/VerdictSummary';
import { hypothesisName } from '../../../lib/hypothesis-words';
import { SETUP_FIELD_LABELS } from './field-labels';

type Observed = NonNullable<CaseSetup['observed']>;

/** Whether anything the scope showed is recorded (the words alone give the engine nothing to test). */
export function observedAnything(observed: Observed | null | undefined): boolean {
  return Object.entries(observed ?? {}).some(([k, v]) => k !== 'description' && v !== null && v !== undefined);
}

function HypothesisDetail({ h, observed }: { h: Hypothesis; observed: Observed }) {
  return (
    <>
      <div className="mt-2">
        <PredictedVsObserved hypothesis={h} observed={observed} dense />
      </div>
      <p className="mt-2 text-sm">
        <MathText text={h.explanation} />
      </p>
      {h.confirm && (
        <p className="mt-1 text-sm">
          <span className="font-semibold">Confirm at the bench: </span>
          {h.confirm}
        </p>
      )}
      <p className="mt-1 text-sm">
        <span className="font-semibold">Fix: </span>
        {h.fix}
      </p>
    </>
  );
}

function assumptionValue(value: number | string, unit: string) {
  if (typeof value === 'string') return value;
  if (unit === '' || unit === 'x') return `${Number(value.toPrecision(4))}${unit}`;
  return formatEngineering(value, unit);
}

/** What to record when nothing fits: the values the engine had to assume, then the unobserved quantities. */
function recordNext(result: DiagnosisResult, observed: Observed): string[] {
  const assumed = result.assumptions.map((a) => SETUP_FIELD_LABELS[a.field] ?? a.field);
  const unobserved = Object.entries(OBSERVED_LABELS)
    .filter(([k]) => (observed[k as keyof Observed] ?? null) === null)
    .map(([, label]) => label);
  return [...new Set([...assumed, ...unobserved])];
}

const OBSERVED_LABELS: Record<string, string> = {
  amplitudeV: 'observed amplitude',
  riseTimeS: 'observed rise time',
  overshootPct: 'overshoot',
  ringingFrequencyHz: 'ringing frequency',
  frequencyHz: 'observed frequency',
  tiltPct: 'tilt',
  humFrequencyHz: 'hum frequency',
};

export interface DiagnosisViewProps {
  result: DiagnosisResult;
  observed: Observed | null | undefined;
  /** How many hypotheses to list; the first is opened. */
  limit?: number;
  /** Shown right under the verdict (the live panel puts the risks there). */
  afterVerdict?: ReactNode;
}

/** The engine's verdict, then its ranked hypotheses: fit, likelihood, predicted against observed, the test, the fix, what it assumed. */
export function DiagnosisView({ result, observed, limit = 6, afterVerdict }: DiagnosisViewProps) {
  const obs = observed ?? {};
  const judged = observedAnything(obs);
  const shown = result.hypotheses.slice(0, limit);
  if (shown.length === 0) return <p className="text-sm text-muted">The engine has nothing to rank yet.</p>;
  return (
    <div className="flex flex-col gap-3">
      <VerdictSummary result={result} observedAny={judged} recordNext={recordNext(result, obs)} compact />
      {afterVerdict}
      <ol className="flex flex-col gap-2" aria-label="Hypotheses, most likely first">
        {shown.map((h, i) => (
          <li key={h.causes.join('+')} data-testid={`hypothesis-${h.causes.join('+')}`} className="rounded-md border border-rule bg-paper/50 p-2.5">
            <details open={i === 0}>
              <summary className="cursor-pointer list-none">
                <span className="block text-sm font-semibold">
                  {i + 1}. {hypothesisName(h)}
                </span>
                <span className="mt-1 block">
                  <FitBadge fits={h.fits} residual={h.residual} compared={judged} ruledOutBy={h.ruledOutBy} />
                </span>
                <LikelihoodBar value={h.likelihood} strong={i === 0} />
              </summary>
              <HypothesisDetail h={h} observed={obs} />
            </details>
          </li>
        ))}
      </ol>
      {result.assumptions.length > 0 && (
        <details className="text-xs">
          <summary className="cursor-pointer font-semibold">The engine assumed {result.assumptions.length} value{result.assumptions.length === 1 ? '' : 's'}</summary>
          <ul className="mt-1 flex flex-col gap-1">
            {result.assumptions.map((a) => (
              <li key={a.field}>
                {SETUP_FIELD_LABELS[a.field] ?? a.field} <span className="font-mono">= {assumptionValue(a.value, a.unit)}</span>
                <span className="text-muted"> — {a.why}</span>
              </li>
            ))}
          </ul>
        </details>
      )}
    </div>
  );
}
