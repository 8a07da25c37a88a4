import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Trace } from '../../../../shared/schemas/trace';
import { api } from '../../../lib/api-client';

export interface TraceWindow {
  /** Pixel columns of the plot; the server returns at most two samples per column. */
  columns: number;
  /** A zoomed window, s; both undefined for the whole capture. */
  fromS?: number;
  toS?: number;
  /** Which channel, 1-based (default 1). */
  channel?: number;
}

/** Hierarchical keys: every trace of one attachment sits under ['captures', 'trace', id]. */
export const captureKeys = {
  all: ['captures'] as const,
  traces: (attachmentId: number) => ['captures', 'trace', attachmentId] as const,
  trace: (attachmentId: number, window: TraceWindow) => ['captures', 'trace', attachmentId, window] as const,
};

export function getCaptureTrace(attachmentId: number, window: TraceWindow, signal?: AbortSignal) {
  const params = new URLSearchParams({ columns: String(window.columns) });
  if (window.fromS !== undefined) params.set('fromS', String(window.fromS));
  if (window.toS !== undefined) params.set('toS', String(window.toS));
  if (window.channel !== undefined) params.set('channel', String(window.channel));
  return api<Trace>(`/api/attachments/${attachmentId}/trace?${params}`, { signal });
}

export const captureTraceQueryOptions = (attachmentId: number, window: TraceWindow) =>
  queryOptions({
    queryKey: captureKeys.trace(attachmentId, window),
    queryFn: ({ signal }) => getCaptureTrace(attachmentId, window, signal),
    // a stored capture never changes; a zoom keeps the old picture until the new window arrives
    staleTime: Infinity,
    placeholderData: keepPreviousData,
  });

export const useCaptureTrace = (attachmentId: number, window: TraceWindow) => useQuery(captureTraceQueryOptions(attachmentId, window));
