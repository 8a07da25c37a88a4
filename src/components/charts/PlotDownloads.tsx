import type { RefObject } from 'react';
import { downloadCsv, downloadPlotPng, fileNameFor, type toCsv } from './plot-export';

const link = 'rounded-md border border-rule px-2 py-0.5 text-xs font-semibold hover:border-ink';

/**
 * "Download PNG" of the plot drawn inside `plot`, and "Download CSV" of the numbers behind it
 * (`rows`, a header row first), both named after the plot.
 */
export function PlotDownloads({ plot, name, rows, csvLabel = 'Download CSV' }: { plot: RefObject<Element | null>; name: string; rows: () => Parameters<typeof toCsv>[0]; csvLabel?: string }) {
  return (
    <div className="flex flex-wrap items-center gap-1.5" role="group" aria-label={`Download ${name}`}>
      <button type="button" className={link} onClick={() => plot.current && void downloadPlotPng(plot.current, fileNameFor(name, 'png'))}>
        Download PNG
      </button>
      <button type="button" className={link} onClick={() => downloadCsv(rows(), fileNameFor(name, 'csv'))}>
        {csvLabel}
      </button>
    </div>
  );
}
