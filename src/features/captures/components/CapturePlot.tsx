import { lazy, Suspense, useEffect, useId, useMemo, useRef, useState } from 'react';
import { useQueries, useQuery } from '@tanstack/react-query';
import { captureOverlay, type CaptureOverlayResult } from '../../../../shared/diagnosis/capture-overlay';
import { diagnosisInputFromSetup } from '../../../../shared/diagnosis/from-case-setup';
import type { Attachment, CaseSetup } from '../../../../shared/schemas/case';
import type { DiagnosisResult } from '../../../../shared/schemas/diagnosis';
import { Alert } from '../../../components/ui/Alert';
import { captureTraceQueryOptions } from '../api/get-capture-trace';
import { readStoredAnalysis, type StoredAnalysis } from '../stored-analysis';
import type { EdgeMark, LevelLine, PlotCursor } from './CaptureCanvas';
import { CaptureCursorReadout } from './CaptureCursorReadout';
import { CaptureLegend } from './CaptureLegend';
import { CapturePlotControls } from './CapturePlotControls';
import { captureSummary, viewSummary } from './capture-summary';
import { CaptureSettings } from './CaptureSettings';
import { mergePlotData, withOtherTraces } from './plot-data';
import { SpectrumPlot } from './SpectrumPlot';
import { useUpdateCapture } from '../api/update-capture';
import { clampWindow, panWindow, zoomWindow, zoomWindowAt, type ViewWindow } from './view-window';
import { PlotDownloads } from '../../../components/charts/PlotDownloads';
import { captureReadingRows } from './capture-readings';

const CaptureCanvas = lazy(() => import('./CaptureCanvas'));

/** Our colours for the channels not analysed (never an instrument's channel colours). */
export const OTHER_TRACE_COLORS = ['var(--ft-caution)', 'var(--ft-muted)'];

export interface CapturePlotProps {
  attachment: Pick<Attachment, 'id' | 'originalName' | 'analysis'> & { captureRole?: Attachment['captureRole'] };
  /** The author (or a moderator) may switch the analysed channel and mark the capture before/after the fix. */
  canEdit?: boolean;
  /** The case's recorded setup and the engine's diagnosis of it, for the model overlay. */
  setup: CaseSetup;
  diagnosis: DiagnosisResult | null;
  height?: number;
}

function useWidth() {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(Math.floor(el.clientWidth));
    const observer = new ResizeObserver(([entry]) => setWidth(Math.floor(entry.contentRect.width)));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

function levelLines(a: StoredAnalysis): LevelLine[] {
  if (a.baseV === null || a.topV === null || a.referenceLevels === null) return [];
  const r = a.referenceLevels;
  return [
    { label: 'top', v: a.topV, state: true },
    { label: '90 %', v: r.highV, state: false },
    { label: '50 %', v: r.midV, state: false },
    { label: '10 %', v: r.lowV, state: false },
    { label: 'base', v: a.baseV, state: true },
  ];
}

function edgeMarks(a: StoredAnalysis): EdgeMark[] {
  const r = a.referenceLevels;
  if (!r) return [];
  // instants are named by reference level, so t10 sits on the 10 % level for a fall too
  return a.edges.map((e) => ({ t10S: e.t10S, t50S: e.t50S, t90S: e.t90S, v10: r.lowV, v50: r.midV, v90: r.highV }));
}

function overlayFor(setup: CaseSetup, diagnosis: DiagnosisResult | null, a: StoredAnalysis, extent: { startS: number; endS: number }): CaptureOverlayResult {
  const top = diagnosis?.hypotheses[0];
  if (!top) return { ok: false, reason: 'the case has no diagnosis yet' };
  if (!(top.likelihood > 0) || (diagnosis!.hypotheses[1] && diagnosis!.hypotheses[1].likelihood === top.likelihood)) {
    return { ok: false, reason: 'the engine ranks no single cause first for this case' };
  }
  return captureOverlay(diagnosisInputFromSetup(setup), top, a, extent);
}

/**
 * A capture drawn from the server's min/max-decimated trace: zoom by dragging (the window is
 * then fetched again at full resolution), pan, two cursors, the IEEE 181 levels and measured
 * edges, and the engine's top hypothesis overlaid, dashed, at the first rising edge.
 */
export default function CapturePlot({ attachment, setup, diagnosis, height = 300, canEdit = false }: CapturePlotProps) {
  const analysis = useMemo(() => readStoredAnalysis(attachment.analysis), [attachment.analysis]);
  const { ref, width } = useWidth();
  // a few column counts only, so a window being resized does not refetch every pixel
  const columns = Math.min(4000, Math.max(200, Math.ceil(width / 200) * 200));
  const [view, setView] = useState<ViewWindow | null>(null);
  const [cursors, setCursors] = useState<{ a?: PlotCursor; b?: PlotCursor }>({});
  const summaryId = useId();

  const overview = useQuery({ ...captureTraceQueryOptions(attachment.id, { columns, channel: analysis.channel }), enabled: width > 0 });
  const zoomed = useQuery({ ...captureTraceQueryOptions(attachment.id, { columns, fromS: view?.fromS, toS: view?.toS, channel: analysis.channel }), enabled: width > 0 && view !== null });
  // every other channel on the same axis, fetched for the same window
  const others = analysis.channels.filter((c) => c.index !== analysis.channel).slice(0, 4);
  const otherOverviews = useQueries({ queries: others.map((c) => ({ ...captureTraceQueryOptions(attachment.id, { columns, channel: c.index }), enabled: width > 0 })) });
  const otherZoomed = useQueries({
    queries: others.map((c) => ({ ...captureTraceQueryOptions(attachment.id, { columns, fromS: view?.fromS, toS: view?.toS, channel: c.index }), enabled: width > 0 && view !== null })),
  });
  const otherSeries = useMemo(() => others.map((c, k) => ({ label: c.name, color: OTHER_TRACE_COLORS[k % OTHER_TRACE_COLORS.length] })), [others.map((c) => c.name).join()]);
  const update = useUpdateCapture();
  const whole = overview.data;
  // until a window arrives, draw what is at hand: an earlier window that covers it, else the overview
  const zoomedFits = Boolean(view && zoomed.data && (!zoomed.isPlaceholderData || (zoomed.data.fromS <= view.fromS && zoomed.data.toS >= view.toS)));
  const shown = view && zoomedFits ? zoomed.data : whole;
  const exact = view ? Boolean(zoomed.data && !zoomed.isPlaceholderData) : Boolean(whole);
  const extent = useMemo(() => (whole ? { startS: whole.startS, endS: whole.endS } : null), [whole]);

  const overlay = useMemo(() => (extent ? overlayFor(setup, diagnosis, analysis, extent) : null), [setup, diagnosis, analysis, extent]);
  const levels = useMemo(() => levelLines(analysis), [analysis]);
  const edges = useMemo(() => edgeMarks(analysis), [analysis]);
  const xRange = useMemo<[number, number]>(() => (view ? [view.fromS, view.toS] : extent ? [extent.startS, extent.endS] : [0, 1]), [view, extent]);
  const yRange = useMemo<[number, number]>(() => {
    const values = [...(whole?.volts ?? []), ...otherOverviews.flatMap((q) => q.data?.volts ?? []), ...levels.map((l) => l.v), ...(overlay?.ok ? overlay.overlay.volts : [])];
    if (values.length === 0) return [0, 1];
    let low = Math.min(...values);
    let high = Math.max(...values);
    if (!(high > low)) [low, high] = [low - 0.5, high + 0.5];
    const pad = (high - low) * 0.06;
    return [low - pad, high + pad];
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [whole, levels, overlay, otherOverviews.map((q) => q.data?.volts.length ?? 0).join()]);
  const otherTraces = (view ? otherZoomed : otherOverviews).map((q, k) => q.data ?? otherOverviews[k].data).filter((t) => t !== undefined);
  const otherKey = otherTraces.map((t) => `${t.channel}:${t.fromS}:${t.toS}:${t.timesS.length}`).join();
  const data = useMemo(
    () => (shown ? withOtherTraces(mergePlotData(shown, overlay?.ok ? overlay.overlay : null, xRange[0], xRange[1]), otherTraces.length === others.length ? otherTraces : [], xRange[0], xRange[1]) : null),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [shown, overlay, xRange, otherKey],
  );

  const apply = (next: ViewWindow | null) => {
    if (!extent) return;
    setView(next === null ? null : clampWindow(next, extent.startS, extent.endS, analysis.sampleIntervalS));
  };
  const current: ViewWindow = { fromS: xRange[0], toS: xRange[1] };
  // cursors before each recent click, so the two clicks of a double-click (show all) place none
  const picks = useRef<{ at: number; before: typeof cursors }[]>([]);
  const showAllFromPlot = () => {
    const recent = picks.current.find((p) => Date.now() - p.at < 800);
    if (recent) setCursors(recent.before);
    picks.current = [];
    apply(null);
  };
  const pick = (c: PlotCursor) =>
    setCursors((prev) => {
      picks.current = [...picks.current.filter((p) => Date.now() - p.at < 800), { at: Date.now(), before: prev }];
      if (!prev.a) return { a: c };
      if (!prev.b) return { ...prev, b: c };
      return Math.abs(c.tS - prev.a.tS) <= Math.abs(c.tS - prev.b.tS) ? { ...prev, a: c } : { ...prev, b: c };
    });
  const firstEdge = analysis.edges[0];
  const onFirstEdge =
    firstEdge && analysis.referenceLevels
      ? () => {
          const r = analysis.referenceLevels!;
          setCursors({ a: { tS: firstEdge.t10S, v: r.lowV }, b: { tS: firstEdge.t90S, v: r.highV } });
          const marginS = Math.max(firstEdge.durationS * 4, (analysis.sampleIntervalS ?? 0) * 20);
          apply({ fromS: Math.min(firstEdge.t10S, firstEdge.t90S) - marginS, toS: Math.max(firstEdge.t10S, firstEdge.t90S) + marginS * 2 });
        }
      : undefined;

  const error = overview.error ?? zoomed.error;
  const summary = captureSummary(analysis, overlay);
  return (
    // named by aria-label, not a caption: the file name is already the heading of the list item above
    <figure className="flex min-w-0 flex-col gap-2" aria-label={`Capture ${attachment.originalName}`} aria-describedby={summaryId}>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm">
        {analysis.channels.length > 1 && (
          <label className="flex items-center gap-2">
            <span className="text-muted">Analysed channel</span>
            {canEdit ? (
              <select
                aria-label="Analysed channel"
                className="rounded border border-rule bg-paper px-2 py-1 font-mono text-sm"
                value={analysis.channel}
                disabled={update.isPending}
                onChange={(e) => update.mutate({ attachmentId: attachment.id, channel: Number(e.target.value) })}
              >
                {analysis.channels.map((c) => (
                  <option key={c.index} value={c.index}>
                    {c.index}: {c.name}
                  </option>
                ))}
              </select>
            ) : (
              <span className="font-mono">{analysis.channels.find((c) => c.index === analysis.channel)?.name}</span>
            )}
          </label>
        )}
        {canEdit ? (
          <label className="flex items-center gap-2">
            <span className="text-muted">Taken</span>
            <select
              aria-label="Taken before or after the fix"
              className="rounded border border-rule bg-paper px-2 py-1 text-sm"
              value={attachment.captureRole ?? ''}
              disabled={update.isPending}
              onChange={(e) => update.mutate({ attachmentId: attachment.id, role: e.target.value === '' ? null : (e.target.value as 'before' | 'after') })}
            >
              <option value="">not marked</option>
              <option value="before">before the fix</option>
              <option value="after">after the fix</option>
            </select>
          </label>
        ) : (
          attachment.captureRole && <span className="text-muted">Taken {attachment.captureRole} the fix</span>
        )}
        {update.error && <span className="text-caution">{update.error.message}</span>}
      </div>
      <CaptureLegend overlay={overlay} hasLevels={levels.length > 0} hasEdges={edges.length > 0} channels={analysis.channels.length > 1 ? { analysed: analysis.channels.find((c) => c.index === analysis.channel)?.name ?? '', others: otherSeries } : undefined} />
      <CapturePlotControls
        zoomed={view !== null}
        busy={overview.isFetching || zoomed.isFetching}
        status={extent ? viewSummary({ fromS: xRange[0], toS: xRange[1] }, view !== null, exact ? shown : undefined) : 'Loading the trace…'}
        onZoomIn={() => apply(zoomWindow(current, 0.5))}
        onZoomOut={() => apply(zoomWindow(current, 2))}
        onPan={(share) => view && apply(panWindow(view, share))}
        onReset={() => apply(null)}
        onFirstEdge={onFirstEdge}
        onClearCursors={cursors.a ? () => setCursors({}) : undefined}
      />
      <div className="grid min-w-0 gap-3 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
      <div ref={ref} role="img" aria-label={`Plot of the capture ${attachment.originalName}. ${summary}`} className="min-w-0" style={{ minHeight: height }}>
        {error ? (
          <Alert tone="caution" title="The trace cannot be drawn">
            {error.message}
          </Alert>
        ) : data && width > 0 ? (
          <Suspense fallback={<p className="flex items-center justify-center text-sm text-muted" style={{ height }}>Drawing the capture…</p>}>
            <CaptureCanvas
              data={data}
              otherSeries={otherSeries}
              xRange={xRange}
              yRange={yRange}
              levels={levels}
              edges={edges}
              cursors={cursors}
              width={width}
              height={height}
              onSelectRange={(fromS, toS) => apply({ fromS, toS })}
              onPick={pick}
              onZoom={(factor, anchorS) => apply(zoomWindowAt(current, factor, anchorS))}
              onShowAll={showAllFromPlot}
            />
          </Suspense>
        ) : (
          <p className="flex items-center justify-center text-sm text-muted" style={{ height }}>
            Loading the trace…
          </p>
        )}
      </div>
      <SpectrumPlot analysis={analysis} name={attachment.originalName.replace(/\.[^.]+$/, '')} />
      </div>
      <CaptureSettings analysis={attachment.analysis ?? {}} setup={setup} />
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-xs text-muted">
          Drag across the plot to zoom into that stretch, or scroll or pinch over it (or use the buttons); double-click to see it all. Click or tap the trace to place cursor A,
          then B (a further click moves the nearer one).
        </p>
        <PlotDownloads plot={ref} name={`${attachment.originalName.replace(/\.[^.]+$/, '')} capture`} rows={() => captureReadingRows(analysis, current, cursors)} csvLabel="Download CSV (readings)" />
      </div>
      <CaptureCursorReadout cursors={cursors} />
      <p id={summaryId} className="text-sm text-muted">
        {summary}
      </p>
    </figure>
  );
}
