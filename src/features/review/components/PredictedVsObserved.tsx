import type { Case } from '../../../../shared/schemas/case';
import { causeLabel } from '../../../components/ui/CauseChip';
import { showQuantity, type QuantityUnit } from '../../../lib/quantity';

const QUANTITIES: { key: 'amplitudeV' | 'riseTimeS' | 'overshootPct' | 'ringingFrequencyHz'; label: string; unit: QuantityUnit }[] = [
  { key: 'amplitudeV', label: 'Amplitude', unit: 'V' },
  { key: 'riseTimeS', label: 'Rise time', unit: 's' },
  { key: 'overshootPct', label: 'Overshoot', unit: '%' },
  { key: 'ringingFrequencyHz', label: 'Ringing', unit: 'Hz' },
];

/**
 * What the engine's top hypothesis (and the stated cause, when it differs) predicts against what
 * the author observed, so the moderator sees by how much they differ, not only the verdict.
 */
export function PredictedVsObserved({ c }: { c: Case }) {
  const observed = c.setup.observed ?? {};
  const hyps = c.diagnosis?.hypotheses ?? [];
  const top = hyps[0];
  const stated = hyps.find((h) => h.cause === c.statedCause);
  const shown = [top, stated && stated !== top ? stated : undefined].filter((h) => h !== undefined);
  const rows = QUANTITIES.filter((q) => typeof observed[q.key] === 'number' && shown.some((h) => typeof h.predicted[q.key] === 'number'));
  if (!top || rows.length === 0) return <p className="text-sm text-muted">No observed value to compare with the engine's predictions.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Predicted against observed</caption>
        <thead className="text-xs text-muted">
          <tr>
            <th scope="col" className="pr-3 pb-1 font-semibold">Quantity</th>
            <th scope="col" className="pr-3 pb-1 font-semibold">Observed</th>
            {shown.map((h) => (
              <th scope="col" key={h.cause} className="pr-3 pb-1 font-semibold">
                {h === top ? 'Engine top' : 'Stated'}: {causeLabel(h.cause)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="font-mono text-xs">
          {rows.map((q) => {
            const obs = observed[q.key] as number;
            return (
              <tr key={q.key} className="border-t border-rule">
                <th scope="row" className="py-1 pr-3 font-sans text-sm font-normal">{q.label}</th>
                <td className="py-1 pr-3">{showQuantity(obs, q.unit)}</td>
                {shown.map((h) => {
                  const p = h.predicted[q.key];
                  const ratio = typeof p === 'number' && obs !== 0 && q.unit !== '%' ? p / obs : null;
                  return (
                    <td key={h.cause} className="py-1 pr-3">
                      {typeof p === 'number' ? showQuantity(p, q.unit) : '—'}
                      {ratio !== null && <span className="ml-1 text-muted">(×{Number(ratio.toPrecision(3))})</span>}
                    </td>
                  );
                })}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
