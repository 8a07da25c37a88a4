import { rm } from 'node:fs/promises';
import { analyzeCapture, type CaptureAnalysis as Measured } from '../../shared/capture/analyze';
import type { CaptureMetadata, CaptureParseOptions } from '../../shared/capture/types';
import { readCaptureToStore, savePlotStore, scratchDirFor, type ReadTuning } from './capture-store';

/** The `POST /api/captures/analyze` answer: the measurements of one channel, the channels, the settings and the notes. */
export type CaptureAnalysis = Measured & {
  channel: number;
  channels: { index: number; name: string; unit: string }[];
  metadata: CaptureMetadata;
  notes: string[];
};

/**
 * Measures the chosen channel of a capture file (1-based among the signal columns, or a
 * column's name; the first when none is given) in passes with constant memory: one streaming
 * parse into binary columns beside the file (a large file's back half read by a second thread,
 * `tuning.splitMinBytes` setting how large), then the analysis reading those a block at a time.
 * With `plotDir`, the compact samples for plots are also kept there. Errors come back as data,
 * with the reader's message.
 */
export async function analyzeCaptureFile(
  file: string,
  options: Pick<CaptureParseOptions, 'channel'> = {},
  output: { plotDir?: string } = {},
  tuning: ReadTuning = {},
): Promise<{ ok: true; analysis: CaptureAnalysis } | { ok: false; message: string }> {
  const dir = scratchDirFor(file, 'samples');
  try {
    const parsed = await readCaptureToStore(file, dir, options, tuning);
    if (!parsed.ok) return parsed;
    const { columns, store } = parsed;
    try {
      const measured = analyzeCapture(
        { timesS: store.timesS, volts: store.channel(columns.channel) },
        { voltsPerDiv: columns.metadata.voltsPerDiv, offsetV: columns.metadata.offsetV },
      );
      if (output.plotDir !== undefined) await savePlotStore(store, output.plotDir);
      return {
        ok: true,
        analysis: {
          ...measured,
          channel: columns.channel,
          channels: columns.channels.map(({ index, name, unit }) => ({ index, name, unit })),
          metadata: columns.metadata,
          notes: columns.notes,
        },
      };
    } finally {
      store.close();
    }
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
/** Reads the optional `channel` form field: a whole number stays a number, anything else a name. */
export function channelField(value: unknown): { channel?: number | string } | { error: string } {
  if (value === undefined || value === null || (typeof value === 'string' && value.trim() === '')) return {};
  if (typeof value !== 'string') return { error: 'channel must be a channel number (1, 2…) or a column name' };
  const text = value.trim();
  if (text.length > 100) return { error: 'channel must be a channel number (1, 2…) or a column name of at most 100 characters' };
  if (/^\d+$/u.test(text)) {
    const index = Number(text);
    return index >= 1 ? { channel: index } : { error: 'channel numbers start at 1' };
  }
  return { channel: text };
}
