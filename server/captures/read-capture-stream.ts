import { isAscii } from 'node:buffer';
import type { Readable } from 'node:stream';
import { ByteCaptureParser } from '../../shared/capture/parse-bytes';
import type { CaptureParseError, CaptureParseOptions, ParseResult } from '../../shared/capture/types';

type Encoding = 'utf-8' | 'utf-16le' | 'utf-16be' | 'latin1';

const SNIFF_BYTES = 4;

/**
 * Turns the bytes of an upload into text a chunk at a time. The encoding comes from a byte
 * order mark (UTF-8, UTF-16 LE/BE), else UTF-8 is assumed; a file that breaks UTF-8 before any
 * non-ASCII byte has been read is taken as Latin-1 (older bench software writes "µs" as the
 * single byte 0xB5), one that breaks it later is refused, since its earlier text was already
 * read as UTF-8. NUL bytes outside UTF-16 mean a binary file.
 */
class ChunkDecoder {
  private encoding: Encoding | null = null;
  private decoder: TextDecoder | null = null;
  private head: Buffer | null = null;
  private offset = 0;
  private sawNonAscii = false;
  error: string | null = null;
  note: string | null = null;

  write(bytes: Buffer): string {
    if (this.encoding === null) {
      // a copy: the caller may reuse the chunk's memory for the next one
      this.head = this.head === null ? Buffer.from(bytes) : Buffer.concat([this.head, bytes]);
      if (this.head.length < SNIFF_BYTES) return '';
      bytes = this.head;
      this.head = null;
      this.choose(bytes);
    }
    return this.decode(bytes, true);
  }

  /** Counts bytes of plain ASCII rows read elsewhere, so later byte positions stay right. */
  skip(length: number): void {
    this.offset += length;
  }

  get encodingName(): Encoding | null {
    return this.encoding;
  }

  /** True for an encoding whose ASCII bytes are the characters themselves (not UTF-16). */
  get byteCompatible(): boolean {
    return this.encoding === 'utf-8' || this.encoding === 'latin1';
  }

  /**
   * Checks bytes that the caller reads itself (see `feedCaptureStream`): no NUL, and valid text
   * in the encoding (the decoding is done only when a byte is not ASCII). False once they are not.
   */
  check(bytes: Buffer): boolean {
    if (this.error !== null) return false;
    if (isAscii(bytes)) {
      const nul = bytes.indexOf(0);
      if (nul >= 0) this.error = `binary content (a NUL byte at byte ${this.offset + nul}); a capture must be a CSV text file`;
      this.offset += bytes.length;
      return this.error === null;
    }
    this.decode(bytes, true);
    return this.error === null;
  }

  end(): string {
    if (this.encoding === null) {
      const bytes = this.head ?? Buffer.alloc(0);
      this.head = null;
      this.choose(bytes);
      return this.decode(bytes, false);
    }
    return this.decode(Buffer.alloc(0), false);
  }

  private choose(bytes: Buffer): void {
    if (bytes[0] === 0xff && bytes[1] === 0xfe) this.encoding = 'utf-16le';
    else if (bytes[0] === 0xfe && bytes[1] === 0xff) this.encoding = 'utf-16be';
    else this.encoding = 'utf-8';
    if (this.encoding !== 'utf-8') this.note = `read as ${this.encoding.toUpperCase()} (byte order mark)`;
    this.decoder = new TextDecoder(this.encoding, { fatal: true });
  }

  private decode(bytes: Buffer, more: boolean): string {
    if (this.error !== null) return '';
    const start = this.offset;
    this.offset += bytes.length;
    if (this.encoding !== 'utf-16le' && this.encoding !== 'utf-16be') {
      const nul = bytes.indexOf(0);
      if (nul >= 0) {
        this.error = `binary content (a NUL byte at byte ${start + nul}); a capture must be a CSV text file`;
        return '';
      }
    }
    if (this.encoding === 'latin1') return bytes.toString('latin1');
    try {
      const text = this.decoder!.decode(bytes, { stream: more });
      if (!this.sawNonAscii && !isAscii(bytes)) this.sawNonAscii = true;
      return text;
    } catch {
      if (!more && bytes.length === 0) return ''; // a character cut off at the very end: the last line is dropped anyway
      if (this.encoding === 'utf-8' && !this.sawNonAscii) {
        this.encoding = 'latin1';
        this.note = 'read as Latin-1: the file is not UTF-8';
        return bytes.toString('latin1');
      }
      this.error = `invalid ${this.encoding} text in bytes ${start}–${start + bytes.length}; save the capture as UTF-8 CSV`;
      return '';
    }
  }
}

/**
 * Bytes of the stream that another reader has taken the rows of (see `BackHalfSplit`): they are
 * counted, not read.
 */
export class SkippedBytes {
  constructor(readonly length: number) {}
}

/**
 * Feeds a capture from a byte stream (an upload on disk, a socket) to a parser chunk by chunk,
 * so the file never sits in memory as text. Until the data rows start the bytes are decoded to
 * text; from then on, while the file is ASCII-compatible (UTF-8 or Latin-1) with LF line ends,
 * the parser reads the rows straight from the bytes. Stops reading as soon as the file is
 * known to be unreadable. Never rejects: returns the decoder's or the reader's error, if any.
 */
export async function feedCaptureStream(stream: NodeJS.ReadableStream | Readable | AsyncIterable<Buffer | SkippedBytes>, parser: ByteCaptureParser): Promise<{ error: CaptureParseError | null; note: string | null }> {
  const decoder = new ChunkDecoder();
  const decodeLine = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length).toString(decoder.encodingName === 'latin1' ? 'latin1' : 'utf8');
  let bytesMode = false;
  try {
    for await (const chunk of stream as AsyncIterable<Buffer | string | SkippedBytes>) {
      if (chunk instanceof SkippedBytes) decoder.skip(chunk.length);
      else if (typeof chunk === 'string') parser.push(chunk);
      else if (bytesMode) {
        if (decoder.check(chunk)) parser.pushBytes(chunk, decodeLine);
      } else {
        parser.push(decoder.write(chunk));
        if (parser.acceptsBytes && decoder.byteCompatible && isAscii(chunk)) {
          bytesMode = true;
          const pending = parser.takePending();
          if (pending !== '') parser.pushBytes(Buffer.from(pending, decoder.encodingName === 'latin1' ? 'latin1' : 'utf8'), decodeLine);
        }
      }
      if (decoder.error !== null || parser.failed) break;
    }
    if (decoder.error === null && !parser.failed) {
      const rest = decoder.end();
      if (!bytesMode) parser.push(rest);
    }
  } catch (cause) {
    return { error: { message: `the file could not be read (${cause instanceof Error ? cause.message : String(cause)})` }, note: null };
  }
  if (decoder.error !== null) return { error: { message: decoder.error, expected: 'text' }, note: null };
  return { error: null, note: decoder.note };
}

/**
 * Reads a CSV capture from a byte stream into samples in memory (small files, tests); the
 * server reads uploads into a store on disk instead (`readCaptureToStore`). Never rejects: read
 * errors, binary content and bad text come back as `{ ok: false, error }`.
 */
export async function readCaptureStream(
  stream: NodeJS.ReadableStream | Readable,
  options?: CaptureParseOptions,
): Promise<ParseResult> {
  const parser = new ByteCaptureParser(options);
  const fed = await feedCaptureStream(stream, parser);
  if (fed.error !== null) return { ok: false, error: fed.error };
  const result = parser.finish();
  if (result.ok && fed.note !== null) result.notes.push(fed.note);
  return result;
}
