import type { AmplitudeBars as Bars, CurveRole } from '../../../../shared/diagnosis/curves';
import { formatEngineering } from '../../../../shared/units/engineering';

const FILL: Record<CurveRole, string> = {
  reference: 'bg-muted/40',
  model: 'bg-agree',
  observed: 'bg-ink',
};

/**
 * Amplitudes as horizontal bars. A ratio beyond 100 would leave one bar invisible on a
 * linear scale, so wide ranges switch to a logarithmic one, and say so.
 */
export function AmplitudeBars({ plot }: { plot: Bars }) {
  const values = plot.bars.map((b) => b.valueV);
  const max = Math.max(...values);
  const min = Math.min(...values.filter((v) => v > 0));
  const log = max / min > 100;
  const floor = log ? Math.log10(min) - 1 : 0;
  const share = (v: number) => (log ? (Math.log10(Math.max(v, min)) - floor) / (Math.log10(max) - floor) : v / max);
  return (
    <figure className="flex flex-col gap-2" aria-label={`${plot.title}. ${plot.summary}`}>
      <figcaption className="text-sm font-semibold">{plot.title}</figcaption>
      <dl className="flex flex-col gap-1.5">
        {plot.bars.map((b) => (
          <div key={b.label} className="grid grid-cols-[minmax(0,9rem)_1fr] items-center gap-2 sm:grid-cols-[11rem_1fr]">
            <dt className="text-xs text-muted">{b.label}</dt>
            <dd className="flex min-w-0 items-center gap-2">
              <span className="h-3 rounded-sm" style={{ width: `${Math.max(1, share(b.valueV) * 70)}%` }}>
                <span className={`block h-full rounded-sm ${FILL[b.role]}`} />
              </span>
              <span className="shrink-0 font-mono text-xs">{formatEngineering(b.valueV, 'V')}</span>
            </dd>
          </div>
        ))}
      </dl>
      <p className="text-sm text-muted">
        {plot.summary}
        {log && ' Bars on a logarithmic scale.'}
      </p>
    </figure>
  );
}
