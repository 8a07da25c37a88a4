import { decimateMinMax, firstAfter } from '../../shared/capture/decimate';
import type { Actor } from '../../shared/auth/roles';
import type { Trace, TraceQuery } from '../../shared/schemas/trace';
import type { PlotStores } from '../captures/plot-stores';
import type { AppDeps } from '../deps';
import { AppError, notFound } from '../errors';
import { formatEngineering } from '../../shared/units/engineering';
import type { OpenStore } from '../captures/sample-store';
import { attachmentFile } from './attachments';

/**
 * A capture attachment's samples in a time window, min/max-decimated to the plot's pixel
 * columns, for a caller who may see its case. The window is clipped to the capture; one
 * sample either side of it is included so a zoomed line reaches the plot's edges instead of
 * stopping at the first sample inside.
 */
export async function attachmentTrace(deps: AppDeps, plots: PlotStores, actor: Actor, attachmentId: number, query: TraceQuery): Promise<Trace> {
  const file = await attachmentFile(deps, actor, attachmentId, 'file');
  if (file.kind !== 'capture') throw notFound('This attachment is a screenshot, not a waveform capture');
  const loaded = await plots.open(file.path);
  if (!loaded.ok) throw new AppError('invalid_input', `The stored capture cannot be read: ${loaded.message}`);
  try {
    return windowOf(loaded.store, query);
  } finally {
    loaded.store.close();
  }
}

function windowOf(store: OpenStore, query: TraceQuery): Trace {
  const channelCount = store.meta.channelCount;
  const channel = query.channel ?? 1;
  if (channel > channelCount) {
    throw new AppError('invalid_input', `The capture has ${channelCount} channel${channelCount === 1 ? '' : 's'}; there is no channel ${channel}`, [{ path: 'channel', message: 'no such channel' }]);
  }
  const timesS = store.timesS;
  const volts = store.channel(channel);
  const n = timesS.length;
  if (n === 0) return { timesS: [], volts: [], fromS: 0, toS: 0, totalPoints: 0, windowPoints: 0, startS: 0, endS: 0, channel, channelCount };
  const startS = timesS.get(0);
  const endS = timesS.get(n - 1);
  const fromS = Math.max(startS, query.fromS ?? startS);
  const toS = Math.min(endS, query.toS ?? endS);
  if (fromS > toS) {
    throw new AppError('invalid_input', `The window lies outside the capture, which runs from ${formatEngineering(startS, 's')} to ${formatEngineering(endS, 's')}`, [
      { path: query.fromS !== undefined && query.fromS > endS ? 'fromS' : 'toS', message: 'outside the capture' },
    ]);
  }
  const first = firstAfter(timesS, n, fromS, true);
  const afterLast = firstAfter(timesS, n, toS, false);
  const windowPoints = Math.max(0, afterLast - first);
  const lo = Math.max(0, first - 1);
  const hi = Math.min(n - 1, afterLast);
  const shown = decimateMinMax(timesS, volts, query.columns, timesS.get(lo), timesS.get(hi));
  return { timesS: Array.from(shown.timesS), volts: Array.from(shown.volts), fromS, toS, totalPoints: n, windowPoints, startS, endS, channel, channelCount };
}
