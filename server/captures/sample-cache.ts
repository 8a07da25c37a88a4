import { createReadStream } from 'node:fs';
import type { CaptureSamples } from '../../shared/capture/types';
import { readCaptureStream } from './read-capture-stream';

export type CachedSamples = { ok: true; samples: CaptureSamples } | { ok: false; message: string };

export interface SampleCacheOptions {
  /** Bytes of sample arrays kept at most (default 128 MiB: a few 50 MB captures). */
  budgetBytes?: number;
  /** Captures kept at most (default 8). */
  maxEntries?: number;
}

const bytesOf = (s: CaptureSamples) => s.timesS.byteLength + s.volts.byteLength;

// The parser's buffers grow by doubling; trimming them keeps the cache's share honest.
function trimmed(s: CaptureSamples): CaptureSamples {
  const wasted = s.timesS.buffer.byteLength > s.timesS.byteLength * 1.25;
  return wasted ? { timesS: s.timesS.slice(), volts: s.volts.slice() } : s;
}

/**
 * Parsed captures kept in memory, least recently used evicted first, so that zooming and
 * panning a plot re-decimates from memory instead of re-reading the CSV each time. Keyed by
 * the stored file name, which never changes content (a new upload gets a new name). Two
 * requests for a capture that is still being read share one read.
 */
export function createSampleCache(options: SampleCacheOptions = {}) {
  const budgetBytes = options.budgetBytes ?? 128 * 1024 * 1024;
  const maxEntries = options.maxEntries ?? 8;
  const entries = new Map<string, CaptureSamples>();
  const reading = new Map<string, Promise<CachedSamples>>();
  let usedBytes = 0;

  const evict = () => {
    for (const [key, samples] of entries) {
      if (usedBytes <= budgetBytes && entries.size <= maxEntries) break;
      entries.delete(key);
      usedBytes -= bytesOf(samples);
    }
  };

  const read = async (key: string, file: string): Promise<CachedSamples> => {
    const parsed = await readCaptureStream(createReadStream(file));
    if (!parsed.ok) return { ok: false, message: parsed.error.message };
    const samples = trimmed(parsed.samples);
    // one capture larger than the whole budget is served but not kept
    if (bytesOf(samples) <= budgetBytes) {
      entries.set(key, samples);
      usedBytes += bytesOf(samples);
      evict();
    }
    return { ok: true, samples };
  };

  return {
    /** The samples of a stored capture file, read once and then served from memory. */
    async get(key: string, file: string): Promise<CachedSamples> {
      const hit = entries.get(key);
      if (hit) {
        entries.delete(key);
        entries.set(key, hit);
        return { ok: true, samples: hit };
      }
      let pending = reading.get(key);
      if (!pending) {
        pending = read(key, file).finally(() => reading.delete(key));
        reading.set(key, pending);
      }
      return pending;
    },
    forget(key: string): void {
      const samples = entries.get(key);
      if (!samples) return;
      entries.delete(key);
      usedBytes -= bytesOf(samples);
    },
    stats: () => ({ entries: entries.size, usedBytes }),
  };
}

export type SampleCache = ReturnType<typeof createSampleCache>;
