import { nearestAmplitudeReading } from '../../../shared/diagnosis/scoring';
import type { Hypothesis } from '../../../shared/schemas/diagnosis';
import { PREDICTED_ROWS, readingAgrees } from '../../lib/hypothesis-words';
import { showQuantity } from '../../lib/quantity';

export interface PredictedVsObservedProps {
  hypothesis: Hypothesis;
  /** What was observed, by the same keys as the prediction (the request's `observed`). */
  observed: Record<string, unknown> | null | undefined;
  dense?: boolean;
}

/** What the hypothesis says the scope shows, beside what it did show; rows within a bench reading's slack in teal. */
export function PredictedVsObserved({ hypothesis, observed, dense = false }: PredictedVsObservedProps) {
  const obs = (key: string) => {
    const v = observed?.[key];
    return typeof v === 'number' ? v : undefined;
  };
  const rows = PREDICTED_ROWS.filter((r) => hypothesis.predicted[r.key] !== undefined || obs(r.key) !== undefined);
  // a needle train (a passive probe into 50 Ω) is compared on the reading nearest what was seen
  const observedV = obs('amplitudeV');
  const reading = observedV !== undefined ? nearestAmplitudeReading(hypothesis.predicted, observedV) : undefined;
  const needleRead = reading && reading.kind !== 'level' ? reading : undefined;
  if (rows.length === 0) return null;
  const pad = dense ? 'py-0.5' : 'py-1';
  return (
    <table className={`w-full ${dense ? 'text-xs' : 'text-sm'}`}>
      <caption className="sr-only">Predicted against observed</caption>
      <thead className="text-xs text-muted">
        <tr>
          <th scope="col" className={`${pad} text-left font-semibold`}>
            On screen
          </th>
          <th scope="col" className={`${pad} text-right font-semibold`}>
            Predicted
          </th>
          <th scope="col" className={`${pad} text-right font-semibold`}>
            Observed
          </th>
        </tr>
      </thead>
      <tbody className="font-mono">
        {rows.map((r) => {
          const p = r.key === 'amplitudeV' && needleRead ? needleRead.valueV : hypothesis.predicted[r.key];
          const o = r.predictedOnly ? undefined : obs(r.key);
          const label = r.key === 'amplitudeV' && needleRead ? `Amplitude, read as ${needleRead.kind === 'needle' ? 'one needle' : "the needles' peak to peak"}` : r.label;
          const verdict = p !== undefined && o !== undefined ? readingAgrees(r.unit, p, o) : undefined;
          return (
            <tr key={r.key} className="border-t border-rule/70">
              <th scope="row" className={`${pad} text-left font-sans font-normal`}>
                {label}
              </th>
              <td className={`${pad} text-right ${verdict === true ? 'text-agree' : verdict === false ? 'text-caution' : ''}`}>
                {p !== undefined ? showQuantity(p, r.unit) : '—'}
                {verdict !== undefined && <span className="sr-only">{verdict ? ' (agrees)' : ' (disagrees)'}</span>}
              </td>
              <td className={`${pad} text-right ${r.predictedOnly ? 'font-sans text-muted' : ''}`}>{o !== undefined ? showQuantity(o, r.unit) : r.predictedOnly ? 'not recorded' : '—'}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
