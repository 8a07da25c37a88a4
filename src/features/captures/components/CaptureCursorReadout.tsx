import { formatEngineering as eng } from '../../../../shared/units/engineering';
import type { PlotCursor } from './CaptureCanvas';

const at = (c: PlotCursor) => `${eng(c.tS, 's', 4)}, ${eng(c.v, 'V', 4)}`;

/** What the two cursors read: each position, and Δt, 1/Δt and ΔV between them. */
export function CaptureCursorReadout({ cursors }: { cursors: { a?: PlotCursor; b?: PlotCursor } }) {
  const { a, b } = cursors;
  if (!a) return null;
  const dtS = b ? b.tS - a.tS : null;
  return (
    <dl aria-label="Cursor readings" aria-live="polite" className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 rounded-md border border-rule bg-paper/50 px-3 py-2 font-mono text-xs sm:grid-cols-[auto_1fr_auto_1fr]">
      <dt className="font-sans text-muted">Cursor A</dt>
      <dd>{at(a)}</dd>
      <dt className="font-sans text-muted">Cursor B</dt>
      <dd>{b ? at(b) : <span className="font-sans text-muted">click the trace again</span>}</dd>
      {b && dtS !== null && (
        <>
          <dt className="font-sans text-muted">Δt</dt>
          <dd data-testid="cursor-dt">
            {eng(dtS, 's', 4)}
            {dtS !== 0 && <span className="text-muted"> (1/Δt = {eng(1 / Math.abs(dtS), 'Hz', 4)})</span>}
          </dd>
          <dt className="font-sans text-muted">ΔV</dt>
          <dd data-testid="cursor-dv">{eng(b.v - a.v, 'V', 4)}</dd>
        </>
      )}
    </dl>
  );
}
