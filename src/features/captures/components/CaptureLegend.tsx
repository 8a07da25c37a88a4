import type { CaptureOverlayResult } from '../../../../shared/diagnosis/capture-overlay';
import { SERIES_DRAW } from '../../../components/charts/chart-theme';

function Line({ color, width, dash, faint }: { color: string; width: number; dash?: number[]; faint?: boolean }) {
  return (
    <svg width="28" height="8" aria-hidden="true" className="shrink-0">
      <line x1="0" y1="4" x2="28" y2="4" stroke={color} strokeOpacity={faint ? 0.55 : 1} strokeWidth={width} strokeDasharray={dash?.join(' ')} />
    </svg>
  );
}

function Dots() {
  return (
    <svg width="28" height="10" aria-hidden="true" className="shrink-0">
      <circle cx="5" cy="5" r="3.5" fill="none" stroke="var(--ft-muted)" strokeWidth="1.25" />
      <circle cx="14" cy="5" r="2.5" fill="var(--ft-ink)" />
      <circle cx="23" cy="5" r="3.5" fill="none" stroke="var(--ft-muted)" strokeWidth="1.25" />
    </svg>
  );
}

/** What each mark on the capture plot is. */
export function CaptureLegend({
  overlay,
  hasLevels,
  hasEdges,
  channels,
}: {
  overlay: CaptureOverlayResult | null;
  hasLevels: boolean;
  hasEdges: boolean;
  /** With several channels: the analysed one (ink) and the others with their colours. */
  channels?: { analysed: string; others: { label: string; color: string }[] };
}) {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-muted" aria-label="Legend">
      <li className="flex items-center gap-1.5">
        <Line color="var(--ft-ink)" width={1.5} />
        {channels ? `${channels.analysed} (analysed)` : 'Capture'}
      </li>
      {channels?.others.map((o) => (
        <li key={o.label} className="flex items-center gap-1.5">
          <Line color={o.color} width={1.25} />
          {o.label}
        </li>
      ))}
      {overlay?.ok ? (
        <li className="flex items-center gap-1.5">
          <Line color="var(--ft-agree)" width={SERIES_DRAW.model.width} dash={SERIES_DRAW.model.dash} />
          {overlay.overlay.label}
        </li>
      ) : (
        overlay && <li>No model overlay: {overlay.reason}</li>
      )}
      {hasLevels && (
        <li className="flex items-center gap-1.5">
          <Line color="var(--ft-muted)" width={1} dash={[2, 4]} faint />
          Base, top and 10/50/90 % levels
        </li>
      )}
      {hasEdges && (
        <li className="flex items-center gap-1.5">
          <Dots />
          Measured edges (10, 50, 90 %)
        </li>
      )}
    </ul>
  );
}
