import { createReadStream } from 'node:fs';
import { analyzeCapture, type CaptureAnalysis as Measured } from '../../shared/capture/analyze';
import type { CaptureMetadata, CaptureParseOptions } from '../../shared/capture/types';
import { readCaptureStream } from './read-capture-stream';

/** The `POST /api/captures/analyze` answer: the measurements of one channel, the channels, the settings and the notes. */
export type CaptureAnalysis = Measured & {
  channel: number;
  channels: { index: number; name: string; unit: string }[];
  metadata: CaptureMetadata;
  notes: string[];
};

/**
 * Streams a capture file through the shared parser and measures the chosen channel (1-based
 * among the signal columns, or a column's name; the first when none is given). Errors come back
 * as data, with the reader's message.
 */
export async function analyzeCaptureFile(
  file: string,
  options: Pick<CaptureParseOptions, 'channel'> = {},
): Promise<{ ok: true; analysis: CaptureAnalysis } | { ok: false; message: string }> {
  const parsed = await readCaptureStream(createReadStream(file), options);
  if (!parsed.ok) return { ok: false, message: parsed.error.message };
  const measured = analyzeCapture(parsed.samples, { voltsPerDiv: parsed.metadata.voltsPerDiv, offsetV: parsed.metadata.offsetV });
  return {
    ok: true,
    analysis: {
      ...measured,
      channel: parsed.channel,
      channels: parsed.channels.map(({ index, name, unit }) => ({ index, name, unit })),
      metadata: parsed.metadata,
      notes: parsed.notes,
    },
  };
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
