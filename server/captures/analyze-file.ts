import { rm } from 'node:fs/promises';
import { analysisSteps, type AnalyzeOptions, type CaptureAnalysis as Measured } from '../../shared/capture/analyze';
import type { CaptureMetadata, CaptureParseOptions } from '../../shared/capture/types';
import { wholeRecordMeasures, type WholeRecordMeasures } from '../../shared/capture/whole-record';
import { measureWholeRecordBeside, onSecondThread } from './back-half';
import type { WholeRecordTask } from './back-half-worker';
import { readCaptureToStore, savePlotStore, scratchDirFor, type ReadTuning } from './capture-store';
import type { OpenStore } from './sample-store';

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
 * `tuning.splitMinBytes` setting how large), then the analysis reading those a block at a time
 * (on a large capture, its measures that need no edges taken by the second thread meanwhile).
 * With `plotDir`, the compact samples for plots are also kept there. Errors come back as data,
 * with the reader's message.
 */
export async function analyzeCaptureFile(
  file: string,
  options: Pick<CaptureParseOptions, 'channel'> = {},
  output: { plotDir?: string } = {},
  tuning: ReadTuning & AnalysisTuning = {},
): Promise<{ ok: true; analysis: CaptureAnalysis } | { ok: false; message: string }> {
  const dir = scratchDirFor(file, 'samples');
  try {
    const parsed = await readCaptureToStore(file, dir, options, tuning);
    if (!parsed.ok) return parsed;
    const { columns, store } = parsed;
    try {
      const measured = await measureStore(store, dir, columns.channel, { voltsPerDiv: columns.metadata.voltsPerDiv, offsetV: columns.metadata.offsetV }, tuning);
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

/**
 * A capture of at least this many samples has its whole-record measures taken by the second
 * thread (our threshold: below it they take a few ms, about what handing them over costs).
 */
export const BESIDE_MIN_POINTS = 1 << 18;

/** Whether, and for tests by what, the whole-record measures are taken on another thread. */
export interface AnalysisTuning {
  besideMinPoints?: number;
  beside?: (task: WholeRecordTask) => Promise<WholeRecordMeasures>;
}

/**
 * `analyzeCapture` on one channel of a store, with the whole-record measures (interval, rails,
 * noise, spectrum) taken by the second thread while this one finds the levels and edges. A
 * second thread that cannot start or fails leaves them to this one, with the same result.
 */
async function measureStore(store: OpenStore, dir: string, channel: number, options: AnalyzeOptions, tuning: AnalysisTuning): Promise<Measured> {
  const samples = { timesS: store.timesS, volts: store.channel(channel) };
  const beside = samples.volts.length >= (tuning.besideMinPoints ?? BESIDE_MIN_POINTS) ? onSecondThread(() => (tuning.beside ?? measureWholeRecordBeside)({ dir, channel })) : null;
  try {
    const steps = analysisSteps(samples, options);
    let step = steps.next();
    while (!step.done) step = steps.next((await beside) ?? wholeRecordMeasures(step.value.timesS, step.value.volts));
    return step.value;
  } finally {
    // its reads of the store end before the store is removed
    await beside;
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
