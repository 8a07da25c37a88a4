import { createReadStream } from 'node:fs';
import type { CaptureSamples } from '../../shared/capture/types';
import { readCaptureStream } from './read-capture-stream';

/** A stored capture's time axis and every channel (`samples` holds the first). */
export type CachedSamples = { ok: true; samples: CaptureSamples; channels: Float64Array[] } | { ok: false; message: string };

interface Entry {
  samples: CaptureSamples;
  channels: Float64Array[];
}

export interface SampleCacheOptions {
  /** Bytes of sample arrays kept at most (default 128 MiB: a few 50 MB captures). */
  budgetBytes?: number;
  /** Captures kept at most (default 8). */
  maxEntries?: number;
}

const bytesOf = (e: Entry) => e.samples.timesS.byteLength + e.channels.reduce((sum, c) => sum + c.byteLength, 0);

// The parser's buffers grow by doubling; trimming them keeps the cache's share honest.
function trimmed(timesS: Float64Array, channels: Float64Array[]): Entry {
  const wasted = timesS.buffer.byteLength > timesS.byteLength * 1.25;
  const kept = wasted ? channels.map((c) => c.slice()) : channels;
  const times = wasted ? timesS.slice() : timesS;
  return { samples: { timesS: times, volts: kept[0] }, channels: kept };
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
  const entries = new Map<string, Entry>();
  const reading = new Map<string, Promise<CachedSamples>>();
  let usedBytes = 0;

  const evict = () => {
    for (const [key, entry] of entries) {
      if (usedBytes <= budgetBytes && entries.size <= maxEntries) break;
      entries.delete(key);
      usedBytes -= bytesOf(entry);
    }
  };

  const read = async (key: string, file: string): Promise<CachedSamples> => {
    const parsed = await readCaptureStream(createReadStream(file));
    if (!parsed.ok) return { ok: false, message: parsed.error.message };
    const entry = trimmed(parsed.samples.timesS, parsed.channelVolts);
    // one capture larger than the whole budget is served but not kept
    if (bytesOf(entry) <= budgetBytes) {
      entries.set(key, entry);
      usedBytes += bytesOf(entry);
      evict();
    }
    return { ok: true, ...entry };
  };

  return {
    /** The samples of a stored capture file, read once and then served from memory. */
    async get(key: string, file: string): Promise<CachedSamples> {
      const hit = entries.get(key);
      if (hit) {
        entries.delete(key);
        entries.set(key, hit);
        return { ok: true, ...hit };
      }
      let pending = reading.get(key);
      if (!pending) {
        pending = read(key, file).finally(() => reading.delete(key));
        reading.set(key, pending);
      }
      return pending;
    },
    forget(key: string): void {
      const entry = entries.get(key);
      if (!entry) return;
      entries.delete(key);
      usedBytes -= bytesOf(entry);
    },
    stats: () => ({ entries: entries.size, usedBytes }),
  };
}

export type SampleCache = ReturnType<typeof createSampleCache>;
