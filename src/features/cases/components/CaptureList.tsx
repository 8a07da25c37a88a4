import type { ReactNode } from 'react';
import type { Attachment } from '../../../../shared/schemas/case';
import { showQuantity, type QuantityUnit } from '../../../lib/quantity';
import { fileSize } from './file-size';

const FIGURES: { key: string; label: string; unit: QuantityUnit | 'count' }[] = [
  { key: 'amplitudeV', label: 'Amplitude', unit: 'V' },
  { key: 'baseV', label: 'Base level', unit: 'V' },
  { key: 'topV', label: 'Top level', unit: 'V' },
  { key: 'riseTimeS', label: 'Rise time', unit: 's' },
  { key: 'fallTimeS', label: 'Fall time', unit: 's' },
  { key: 'overshootPct', label: 'Overshoot', unit: '%' },
  { key: 'ringingFrequencyHz', label: 'Ringing', unit: 'Hz' },
  { key: 'periodS', label: 'Period', unit: 's' },
  { key: 'tiltPct', label: 'Tilt', unit: '%' },
  { key: 'cornerPct', label: 'Corner', unit: '%' },
  { key: 'settleTimeConstantS', label: 'Settling τ', unit: 's' },
  { key: 'noiseRmsV', label: 'Noise rms', unit: 'V' },
  { key: 'humFrequencyHz', label: 'Hum', unit: 'Hz' },
  { key: 'sampleIntervalS', label: 'Sample interval', unit: 's' },
  { key: 'points', label: 'Samples', unit: 'count' },
];

/** Waveform captures with what the capture analysis measured, each with its plot when the page supplies one. */
export function CaptureList({ captures, renderPlot }: { captures: Attachment[]; renderPlot?: (capture: Attachment) => ReactNode }) {
  if (captures.length === 0) return null;
  return (
    <ul className="flex flex-col gap-3" aria-label="Captures">
      {captures.map((c) => {
        const a = c.analysis ?? {};
        const figures = FIGURES.filter((f) => typeof a[f.key] === 'number');
        return (
          <li key={c.id} className="rounded-md border border-rule bg-paper/50 p-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <a href={c.url} className="font-mono text-sm underline underline-offset-2" download>
                {c.originalName}
              </a>
              <span className="font-mono text-xs text-muted">{fileSize(c.sizeBytes)}</span>
            </div>
            {renderPlot && <div className="mt-3">{renderPlot(c)}</div>}
            {figures.length > 0 ? (
              <dl className="mt-2 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-3">
                {figures.map((f) => {
                  const v = a[f.key] as number;
                  return (
                    <div key={f.key} className="flex justify-between gap-2 border-t border-rule/60 pt-1">
                      <dt className="text-muted">{f.label}</dt>
                      <dd className="font-mono">{f.unit === 'count' ? v.toLocaleString('en') : showQuantity(v, f.unit)}</dd>
                    </div>
                  );
                })}
              </dl>
            ) : (
              <p className="mt-1 text-xs text-muted">No analysis figures for this capture.</p>
            )}
            {typeof a.shape === 'string' && (
              <p className="mt-1 text-sm">
                Shape <span className="font-mono">{a.shape}</span>
                {a.clipped === true && <span className="text-caution"> · clipped at the rails</span>}
              </p>
            )}
            {Array.isArray(a.notes) && a.notes.length > 0 && (
              <details className="mt-1 text-xs text-muted">
                <summary className="cursor-pointer">How the file was read ({a.notes.length} note{a.notes.length === 1 ? '' : 's'})</summary>
                <ul className="mt-1 list-disc pl-5">
                  {(a.notes as string[]).map((n) => (
                    <li key={n}>{n}</li>
                  ))}
                </ul>
              </details>
            )}
          </li>
        );
      })}
    </ul>
  );
}
