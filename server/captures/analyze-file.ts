import { createReadStream } from 'node:fs';
import { analyzeCapture } from '../../shared/capture/analyze';
import { readCaptureStream } from './read-capture-stream';

export type CaptureAnalysis = ReturnType<typeof analyzeCapture>;

/** Streams a capture file through the shared parser and measures it; errors come back as data. */
export async function analyzeCaptureFile(file: string): Promise<{ ok: true; analysis: CaptureAnalysis } | { ok: false; message: string }> {
  const parsed = await readCaptureStream(createReadStream(file));
  if (!parsed.ok) return { ok: false, message: parsed.error.message };
  return { ok: true, analysis: analyzeCapture(parsed.samples) };
}
