import { lazy, Suspense, useEffect, useMemo, useRef, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { Attachment } from '../../../../shared/schemas/case';
import { formatEngineering as eng } from '../../../../shared/units/engineering';
import { captureTraceQueryOptions } from '../api/get-capture-trace';
import { readStoredAnalysis, type StoredAnalysis } from '../stored-analysis';
import { mergePlotData, withOtherTraces } from './plot-data';

const CaptureCanvas = lazy(() => import('./CaptureCanvas'));

const ROWS: { label: string; show: (a: StoredAnalysis) => string }[] = [
  { label: 'Shape', show: (a) => (a.shape ? `${a.shape}${a.clipped ? ', clipped' : ''}` : '—') },
  { label: 'Amplitude', show: (a) => (a.amplitudeV === null ? '—' : eng(a.amplitudeV, 'V')) },
  { label: 'Rise time', show: (a) => (a.riseTimeS === null ? '—' : eng(a.riseTimeS, 's')) },
  { label: 'Overshoot', show: (a) => (a.overshootPct === null ? '—' : `${Number(a.overshootPct.toPrecision(3))} %`) },
  { label: 'Ringing', show: (a) => (a.ringingFrequencyHz === null ? 'none' : eng(a.ringingFrequencyHz, 'Hz')) },
  { label: 'Tilt', show: (a) => (a.tiltPct === null ? '—' : `${Number(a.tiltPct.toPrecision(3))} %`) },
  { label: 'Corner', show: (a) => (a.cornerPct === null ? '—' : `${Number(a.cornerPct.toPrecision(3))} %`) },
  { label: 'Period', show: (a) => (a.periodS === null ? '—' : eng(a.periodS, 's')) },
  { label: 'Noise', show: (a) => (a.noiseRmsV === null ? '—' : `${eng(a.noiseRmsV, 'V')} rms`) },
  { label: 'Hum', show: (a) => (a.humFrequencyHz === null ? 'none' : eng(a.humFrequencyHz, 'Hz')) },
];

/** The captures marked before and after the fix on one time axis, with their measurements side by side. */
export default function CaptureBeforeAfter({ before, after }: { before: Attachment; after: Attachment }) {
  const a = useMemo(() => readStoredAnalysis(before.analysis), [before.analysis]);
  const b = useMemo(() => readStoredAnalysis(after.analysis), [after.analysis]);
  const host = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    if (host.current) setWidth(Math.floor(host.current.clientWidth));
  }, []);
  const columns = 800;
  const beforeTrace = useQuery(captureTraceQueryOptions(before.id, { columns, channel: a.channel }));
  const afterTrace = useQuery(captureTraceQueryOptions(after.id, { columns, channel: b.channel }));
  const fromS = Math.min(beforeTrace.data?.startS ?? 0, afterTrace.data?.startS ?? 0);
  const toS = Math.max(beforeTrace.data?.endS ?? 1, afterTrace.data?.endS ?? 1);
  const data = useMemo(
    () => (afterTrace.data && beforeTrace.data ? withOtherTraces(mergePlotData(afterTrace.data, null, fromS, toS), [beforeTrace.data], fromS, toS) : null),
    [afterTrace.data, beforeTrace.data, fromS, toS],
  );
  const volts = [...(afterTrace.data?.volts ?? []), ...(beforeTrace.data?.volts ?? [])];
  const low = volts.length ? Math.min(...volts) : 0;
  const high = volts.length ? Math.max(...volts) : 1;
  const pad = (high - low || 1) * 0.06;
  return (
    <section aria-label="Before and after the fix" className="flex flex-col gap-2 rounded-md border border-rule p-3">
      <h3 className="font-serif text-base">Before and after the fix</h3>
      <ul className="flex flex-wrap gap-x-4 text-xs text-muted" aria-label="Legend">
        <li>
          <span className="mr-1 inline-block h-0.5 w-6 bg-caution align-middle" />
          before: <span className="font-mono">{before.originalName}</span>
        </li>
        <li>
          <span className="mr-1 inline-block h-0.5 w-6 bg-ink align-middle" />
          after: <span className="font-mono">{after.originalName}</span>
        </li>
      </ul>
      <div ref={host} className="min-w-0" style={{ minHeight: 220 }}>
        {data && width > 0 ? (
          <Suspense fallback={<p className="text-sm text-muted">Drawing…</p>}>
            <CaptureCanvas
              data={data}
              otherSeries={[{ label: 'Before the fix', color: 'var(--ft-caution)' }]}
              xRange={[fromS, toS]}
              yRange={[low - pad, high + pad]}
              levels={[]}
              edges={[]}
              cursors={{}}
              width={width}
              height={220}
              onSelectRange={() => undefined}
              onPick={() => undefined}
            />
          </Suspense>
        ) : (
          <p className="text-sm text-muted">Loading both traces…</p>
        )}
      </div>
      <table className="w-full text-left text-sm">
        <thead className="text-xs text-muted">
          <tr>
            <th className="py-1 font-normal">Measured</th>
            <th className="py-1 font-normal">Before the fix</th>
            <th className="py-1 font-normal">After the fix</th>
          </tr>
        </thead>
        <tbody>
          {ROWS.map((row) => (
            <tr key={row.label} className="border-t border-rule">
              <th scope="row" className="py-1 pr-2 font-normal text-muted">
                {row.label}
              </th>
              <td className="py-1 pr-2 font-mono">{row.show(a)}</td>
              <td className="py-1 font-mono">{row.show(b)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
