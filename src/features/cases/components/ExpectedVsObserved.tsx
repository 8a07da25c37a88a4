import type { CaseSetup } from '../../../../shared/schemas/case';
import { showQuantity, type QuantityUnit } from '../../../lib/quantity';

const SIGNAL_KIND: Record<string, string> = { square: 'square wave', sine: 'sine wave', pulse: 'pulse', dc: 'DC level', other: 'other' };

/** What the circuit does beside what the scope showed, quantity by quantity. */
export function ExpectedVsObserved({ setup }: { setup: CaseSetup }) {
  const e = setup.signal ?? {};
  const o = setup.observed ?? {};
  const rows: [string, number | null | undefined, number | null | undefined, QuantityUnit][] = [
    ['Amplitude', e.expectedAmplitudeV, o.amplitudeV, 'V'],
    ['Low level', e.baseV, undefined, 'V'],
    ['Frequency', e.frequencyHz, o.frequencyHz, 'Hz'],
    ['Rise time', e.riseTimeS, o.riseTimeS, 's'],
    ['Overshoot', undefined, o.overshootPct, '%'],
    ['Ringing', undefined, o.ringingFrequencyHz, 'Hz'],
    ['Tilt', undefined, o.tiltPct, '%'],
    ['Hum', undefined, o.humFrequencyHz, 'Hz'],
  ];
  const shown = rows.filter(([, a, b]) => (a ?? null) !== null || (b ?? null) !== null);
  const show = (v: number | null | undefined, unit: QuantityUnit) => (v === null || v === undefined ? '—' : showQuantity(v, unit));
  return (
    <div>
      {e.kind && <p className="mb-2 text-sm text-muted">Expected: a {SIGNAL_KIND[e.kind] ?? e.kind}.</p>}
      {shown.length > 0 ? (
        <table className="w-full text-sm">
          <thead className="text-xs text-muted">
            <tr>
              <th className="py-1 text-left font-semibold">Quantity</th>
              <th className="py-1 text-right font-semibold">Expected</th>
              <th className="py-1 text-right font-semibold">Observed</th>
            </tr>
          </thead>
          <tbody>
            {shown.map(([label, a, b, unit]) => (
              <tr key={label} className="border-t border-rule/60">
                <th scope="row" className="py-1 text-left font-normal">
                  {label}
                </th>
                <td className="py-1 text-right font-mono">{show(a, unit)}</td>
                <td className="py-1 text-right font-mono">{show(b, unit)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <p className="text-sm text-muted">No values recorded.</p>
      )}
      {o.clipped != null && <p className="mt-2 text-sm">{o.clipped ? 'The trace was clipped at the edge of the screen.' : 'The trace stayed on the screen (not clipped).'}</p>}
      {o.description && <p className="mt-2 text-sm">{o.description}</p>}
    </div>
  );
}
