import type { CaseSetup } from '../../../../shared/schemas/case';
import { CAUSE_LABELS, type DiagnosisResult, type Hypothesis } from '../../../../shared/schemas/diagnosis';
import { LikelihoodBar } from '../../../components/ui/LikelihoodBar';
import { showQuantity, type QuantityUnit } from '../../../lib/quantity';
import { formatEngineering } from '../../../../shared/units/engineering';
import { SETUP_FIELD_LABELS } from './field-labels';

const QUANTITIES: { key: 'amplitudeV' | 'riseTimeS' | 'overshootPct' | 'ringingFrequencyHz'; label: string; unit: QuantityUnit }[] = [
  { key: 'amplitudeV', label: 'Amplitude', unit: 'V' },
  { key: 'riseTimeS', label: 'Rise time', unit: 's' },
  { key: 'overshootPct', label: 'Overshoot', unit: '%' },
  { key: 'ringingFrequencyHz', label: 'Ringing', unit: 'Hz' },
];

type Observed = NonNullable<CaseSetup['observed']>;

/** Within 15 % (or 3 points of overshoot) reads as agreeing; common practice for a bench reading, no source. */
function agrees(key: string, predicted: number, observed: number): boolean {
  if (key === 'overshootPct') return Math.abs(predicted - observed) <= 3;
  return observed !== 0 && Math.abs(predicted / observed - 1) <= 0.15;
}

function PredictedVsObserved({ h, observed }: { h: Hypothesis; observed: Observed }) {
  const rows = QUANTITIES.filter((q) => h.predicted[q.key] !== undefined || (observed[q.key] ?? null) !== null);
  if (rows.length === 0) return null;
  return (
    <table className="mt-2 w-full text-xs">
      <thead className="text-muted">
        <tr>
          <th className="py-0.5 text-left font-semibold">Quantity</th>
          <th className="py-0.5 text-right font-semibold">Predicted</th>
          <th className="py-0.5 text-right font-semibold">Observed</th>
        </tr>
      </thead>
      <tbody className="font-mono">
        {rows.map((q) => {
          const p = h.predicted[q.key];
          const o = observed[q.key] ?? undefined;
          const tone = p !== undefined && o !== undefined ? (agrees(q.key, p, o) ? 'text-agree' : 'text-caution') : '';
          return (
            <tr key={q.key} className="border-t border-rule/60">
              <th scope="row" className="py-0.5 text-left font-sans font-normal">
                {q.label}
              </th>
              <td className={`py-0.5 text-right ${tone}`}>{p !== undefined ? showQuantity(p, q.unit) : '—'}</td>
              <td className="py-0.5 text-right">{o !== undefined ? showQuantity(o, q.unit) : '—'}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

function HypothesisDetail({ h, observed }: { h: Hypothesis; observed: Observed }) {
  return (
    <>
      <PredictedVsObserved h={h} observed={observed} />
      <p className="mt-2 text-sm">{h.explanation}</p>
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

export interface DiagnosisViewProps {
  result: DiagnosisResult;
  observed: Observed | null | undefined;
  /** How many hypotheses to list; the first is opened. */
  limit?: number;
}

/** The engine's ranked hypotheses: likelihood bars, predicted against observed, the fix, what it assumed. */
export function DiagnosisView({ result, observed, limit = 6 }: DiagnosisViewProps) {
  const obs = observed ?? {};
  const shown = result.hypotheses.slice(0, limit);
  if (shown.length === 0) return <p className="text-sm text-muted">The engine has nothing to rank yet.</p>;
  return (
    <div className="flex flex-col gap-3">
      <ol className="flex flex-col gap-2" aria-label="Hypotheses, most likely first">
        {shown.map((h, i) => (
          <li key={h.cause} className="rounded-md border border-rule bg-paper/50 p-2.5">
            <details open={i === 0}>
              <summary className="cursor-pointer list-none">
                <span className="flex items-baseline justify-between gap-2 text-sm font-semibold">
                  <span>
                    {i + 1}. {CAUSE_LABELS[h.cause]}
                  </span>
                </span>
                <LikelihoodBar value={h.likelihood} strong={i === 0} />
              </summary>
              <HypothesisDetail h={h} observed={obs} />
            </details>
          </li>
        ))}
      </ol>
      {(result.risks ?? []).filter((r) => r.level === 'caution').map((r) => (
        <p key={r.id} className="rounded-md border-l-4 border-caution bg-caution-soft px-3 py-2 text-xs">
          {r.message}
        </p>
      ))}
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
