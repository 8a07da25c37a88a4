import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readCaptureStream } from '../../server/captures/read-capture-stream';
import { parseCaptureText } from '../../shared/capture/parse';

// Tests the node adapter around the shared parser: bytes in, decoded chunk by chunk.

/** A stream that yields `bytes` in pieces of the given sizes (then the rest). */
function streamOf(bytes: Buffer, sizes: number[] = []): Readable {
  const pieces: Buffer[] = [];
  let at = 0;
  for (const size of sizes) {
    if (at >= bytes.length) break;
    pieces.push(bytes.subarray(at, at + Math.max(1, size)));
    at += Math.max(1, size);
  }
  if (at < bytes.length) pieces.push(bytes.subarray(at));
  return Readable.from(pieces, { objectMode: false });
}

const CSV = 'Time (µs),CH1 (mV)\n0,1.5\n1,2.5\n2,3.5\n';

describe('readCaptureStream', () => {
  it('should read a UTF-8 file and apply the µs unit', async () => {
    const result = await readCaptureStream(streamOf(Buffer.from(CSV, 'utf8')));
    expect(result.ok && Array.from(result.samples.timesS)).toEqual([0, 1e-6, 2e-6]);
    expect(result.ok && result.time.unit).toBe('µs');
  });

  it('should decode a character split between chunks (µ is two bytes in UTF-8)', async () => {
    const bytes = Buffer.from(CSV, 'utf8');
    for (let cut = 1; cut < 20; cut++) {
      const result = await readCaptureStream(streamOf(bytes, [cut, 1, 1]));
      expect(result.ok && result.time.unit).toBe('µs');
    }
  });

  it('should give the same samples for any chunking of the bytes', async () => {
    const bytes = Buffer.from(CSV + Array.from({ length: 200 }, (_, k) => `${k + 3},${k}\n`).join(''), 'utf8');
    const whole = await readCaptureStream(streamOf(bytes));
    expect(whole.ok).toBe(true);
    await fc.assert(
      fc.asyncProperty(fc.array(fc.integer({ min: 1, max: 64 }), { maxLength: 40 }), async (sizes) => {
        const result = await readCaptureStream(streamOf(bytes, sizes));
        expect(result.ok && Array.from(result.samples.volts)).toEqual(whole.ok && Array.from(whole.samples.volts));
      }),
      { numRuns: 50 },
    );
  });

  it('should read UTF-16 with a byte order mark', async () => {
    const little = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(CSV, 'utf16le')]);
    const result = await readCaptureStream(streamOf(little, [3, 5, 7]));
    expect(result.ok && Array.from(result.samples.volts)).toEqual([1.5e-3, 2.5e-3, 3.5e-3]);
    expect(result.ok && result.notes.join()).toMatch(/UTF-16LE/);
  });

  it('should read a Latin-1 file whose header writes µ as one byte', async () => {
    const result = await readCaptureStream(streamOf(Buffer.from(CSV, 'latin1')));
    expect(result.ok && result.time.unit).toBe('µs');
    expect(result.ok && result.notes.join()).toMatch(/Latin-1/);
  });

  it('should refuse a binary file, naming the NUL byte', async () => {
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);
    const result = await readCaptureStream(streamOf(png));
    expect(result.ok).toBe(false);
    expect(!result.ok && result.error.message).toMatch(/binary content \(a NUL byte at byte 8\)/);
  });

  it('should refuse text that stops being UTF-8 after UTF-8 text', async () => {
    const bytes = Buffer.concat([Buffer.from(CSV, 'utf8'), Buffer.from([0x33, 0x2c, 0xff, 0xfe, 0x0a])]);
    const result = await readCaptureStream(streamOf(bytes, [CSV.length + 1]));
    expect(!result.ok && result.error.message).toMatch(/invalid utf-8 text/);
  });

  it('should turn a read error into a result', async () => {
    const failing = new Readable({
      read() {
        this.destroy(new Error('disk went away'));
      },
    });
    const result = await readCaptureStream(failing);
    expect(!result.ok && result.error.message).toMatch(/could not be read \(disk went away\)/);
  });

  it('should accept a stream that already yields strings', async () => {
    const result = await readCaptureStream(Readable.from(['0,1\n', '1,2\n']));
    expect(result.ok && Array.from(result.samples.volts)).toEqual([1, 2]);
  });

  it('should never reject, whatever the bytes', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 300 }), fc.array(fc.integer({ min: 1, max: 50 }), { maxLength: 5 }), async (bytes, sizes) => {
        const result = await readCaptureStream(streamOf(Buffer.from(bytes), sizes));
        expect(typeof result.ok).toBe('boolean');
      }),
      { numRuns: 300 },
    );
  });

  // the bytes reader (data rows read straight from the bytes) against the text reader, on rows of every kind
  it('should read rows from the bytes exactly as the text reader reads them', async () => {
    const cell = fc.oneof(
      fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }).map((v) => String(v)),
      fc.integer({ min: -99999, max: 99999 }).map((v) => (v / 1000).toFixed(3)),
      fc.double({ noNaN: true, noDefaultInfinity: true }).map((v) => v.toExponential(fc.sample(fc.integer({ min: 0, max: 17 }), 1)[0])),
      fc.constantFrom(' 1.5', '"2.25"', '-.5', '+3', '1e400', '0.1234567890123456789', '', 'x', '1,5', '\u0001', 'µ', '1.5 ', '7E+03', '-0', '00012', '2\r5', '3\r'),
    );
    // a row of one, two or three cells: the time alone, the time and the value, or a cell more
    const rows = fc.array(fc.tuple(cell, cell, fc.constantFrom(1, 2, 3)), { minLength: 1, maxLength: 40 });
    await fc.assert(
      fc.asyncProperty(rows, fc.array(fc.integer({ min: 1, max: 64 }), { maxLength: 20 }), fc.boolean(), async (cells, cuts, crlf) => {
        const end = crlf ? '\r\n' : '\n';
        // a first chunk of plain rows, so the reader has switched to bytes when the odd ones come
        const plain = Array.from({ length: 50 }, (_, k) => `${k},${k / 4}`);
        const text = ['t,v', ...plain, ...cells.map(([a, b, width], k) => [`${50 + k}`, a, b].slice(0, width).join(','))].join(end) + end;
        const fromText = parseCaptureText(text);
        const fromBytes = await readCaptureStream(streamOf(Buffer.from(text, 'utf8'), [Buffer.byteLength(plain.join(end)) + 8, ...cuts]));
        expect(fromBytes.ok).toBe(fromText.ok);
        if (fromText.ok && fromBytes.ok) {
          expect(Array.from(fromBytes.samples.volts)).toEqual(Array.from(fromText.samples.volts));
          expect(Array.from(fromBytes.samples.timesS)).toEqual(Array.from(fromText.samples.timesS));
          expect(fromBytes.notes).toEqual(fromText.notes);
        } else if (!fromText.ok && !fromBytes.ok && fromBytes.error.message !== fromText.error.message) {
          // the text reader looks for control characters in a whole chunk before reading its lines,
          // so it may name one on a later line than a bad row the bytes reader meets first
          expect(fromText.error.message).toMatch(/control character/);
          expect(fromBytes.error.line!).toBeLessThanOrEqual(fromText.error.line!);
        }
      }),
      { numRuns: 300, seed: 181 },
    );
  });
});
