import { Button } from '../../../components/ui/Button';

export interface CapturePlotControlsProps {
  zoomed: boolean;
  busy: boolean;
  status: string;
  onZoomIn: () => void;
  onZoomOut: () => void;
  onPan: (share: number) => void;
  onReset: () => void;
  onFirstEdge?: () => void;
  onClearCursors?: () => void;
}

const small = 'px-2! py-1! text-xs!';

/** Zoom, pan and cursor buttons: the keyboard and touch way to do what dragging and clicking do. */
export function CapturePlotControls(p: CapturePlotControlsProps) {
  return (
    <div className="flex flex-col gap-1.5">
      <div role="toolbar" aria-label="Plot view" className="flex flex-wrap items-center gap-1.5">
        <Button type="button" variant="secondary" className={small} onClick={p.onZoomIn}>
          Zoom in
        </Button>
        <Button type="button" variant="secondary" className={small} onClick={p.onZoomOut} disabled={!p.zoomed}>
          Zoom out
        </Button>
        <Button type="button" variant="secondary" className={small} onClick={() => p.onPan(-0.5)} disabled={!p.zoomed} aria-label="Pan earlier">
          ← Earlier
        </Button>
        <Button type="button" variant="secondary" className={small} onClick={() => p.onPan(0.5)} disabled={!p.zoomed} aria-label="Pan later">
          Later →
        </Button>
        <Button type="button" variant="secondary" className={small} onClick={p.onReset} disabled={!p.zoomed}>
          Show all
        </Button>
        {p.onFirstEdge && (
          <Button type="button" variant="quiet" className={small} onClick={p.onFirstEdge}>
            Cursors on the first edge
          </Button>
        )}
        {p.onClearCursors && (
          <Button type="button" variant="quiet" className={small} onClick={p.onClearCursors}>
            Clear cursors
          </Button>
        )}
      </div>
      <p className="font-mono text-[11px] text-muted" aria-live="polite" data-testid="plot-view">
        {p.status}
        {p.busy && <span className="ml-2">· fetching…</span>}
      </p>
    </div>
  );
}
