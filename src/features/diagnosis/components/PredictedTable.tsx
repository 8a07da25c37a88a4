import type { DiagnosisInput, Hypothesis, Predicted } from '../../../../shared/schemas/diagnosis';
import { showQuantity, type QuantityUnit } from '../../../lib/quantity';

const ROWS: { key: keyof Predicted; label: string; unit: QuantityUnit }[] = [
  { key: 'amplitudeV', label: 'Amplitude', unit: 'V' },
  { key: 'riseTimeS', label: 'Rise time', unit: 's' },
  { key: 'overshootPct', label: 'Overshoot', unit: '%' },
  { key: 'ringingFrequencyHz', label: 'Ringing', unit: 'Hz' },
  { key: 'frequencyHz', label: 'Frequency', unit: 'Hz' },
  { key: 'tiltPct', label: 'Tilt of the tops', unit: '%' },
  { key: 'humFrequencyHz', label: 'Hum', unit: 'Hz' },
  { key: 'spikeV', label: 'Edge spike', unit: 'V' },
];

/** Within 15 % (3 points for overshoot and tilt) reads as agreeing: a bench reading's usual slack (common practice, no source). */
function agrees(key: keyof Predicted, predicted: number, observed: number): boolean {
  if (key === 'overshootPct' || key === 'tiltPct') return Math.abs(predicted - observed) <= 3;
  return observed !== 0 && Math.abs(predicted / observed - 1) <= 0.15;
}

/** What the hypothesis says the scope shows, beside what it did show. */
export function PredictedTable({ hypothesis, observed }: { hypothesis: Hypothesis; observed: DiagnosisInput['observed'] }) {
  const obs = (observed ?? {}) as Partial<Record<string, number | null>>;
  const rows = ROWS.filter((r) => hypothesis.predicted[r.key] !== undefined || (obs[r.key] ?? null) !== null);
  if (rows.length === 0) return null;
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Predicted against observed</caption>
      <thead className="text-xs text-muted">
        <tr>
          <th scope="col" className="py-1 text-left font-semibold">
            On screen
          </th>
          <th scope="col" className="py-1 text-right font-semibold">
            Predicted
          </th>
          <th scope="col" className="py-1 text-right font-semibold">
            Observed
          </th>
        </tr>
      </thead>
      <tbody className="font-mono">
        {rows.map((r) => {
          const p = hypothesis.predicted[r.key];
          const o = obs[r.key] ?? undefined;
          const verdict = p !== undefined && o !== undefined ? agrees(r.key, p, o) : undefined;
          return (
            <tr key={r.key} className="border-t border-rule/70">
              <th scope="row" className="py-1 text-left font-sans font-normal">
                {r.label}
              </th>
              <td className={`py-1 text-right ${verdict === true ? 'text-agree' : verdict === false ? 'text-caution' : ''}`}>
                {p !== undefined ? showQuantity(p, r.unit) : '—'}
                {verdict !== undefined && <span className="sr-only">{verdict ? ' (agrees)' : ' (disagrees)'}</span>}
              </td>
              <td className="py-1 text-right">{o !== undefined ? showQuantity(o, r.unit) : '—'}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
