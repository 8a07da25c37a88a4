import { checkColumnOptions, type DataLayout } from './data-layout';
import { describeRowProblem, quoteCell } from './parse-messages';
import { COMMENT, Preamble } from './preamble';
import { readNumber } from './read-number';
import { SampleBuffer } from './sample-buffer';
import type { CaptureParseError, CaptureParseOptions, ParseResult } from './types';

const MAX_LINE_CHARS = 1 << 20;
// C0 controls other than tab, LF, VT, FF, CR and the DOS end-of-file mark never occur in text.
const CONTROL = /[\u0000-\u0008\u000e-\u0019\u001b-\u001f]/u;

/**
 * Reads a CSV capture (time, voltage) a chunk at a time, holding only the unfinished last line
 * and the samples (two growing Float64Arrays), never the text of the file.
 *
 * What it accepts, and the choices made where files disagree:
 * - Separators: comma, semicolon or tab, detected on the first data row (tab, else semicolon,
 *   else comma). With a semicolon or tab separator a comma inside a number is the decimal mark
 *   ("0,5;1,25"), as spreadsheets in decimal-comma locales write them; with a comma separator
 *   only the point is. Thousands separators are refused rather than guessed at.
 * - Header: optional, in any words; the last non-numeric line of two or more cells before the
 *   data. A units row right under it ("(ms),(mV)") is merged into it. Units in it are applied
 *   (s, ms, µs/us, ns, ps; V, mV, µV, kV). The first time-like and the first voltage-like
 *   columns are read unless the caller picks columns; without a header, columns 1 and 2.
 * - Preamble: anything before the first row with numbers in both columns (comments starting
 *   with #, //, %, ' or ;, and key,value lines) is skipped. Comments and blank lines are also
 *   skipped among the data.
 * - Bad rows: a row whose time is a number but whose voltage is not is an error with its line
 *   number. A row with no number in the time column is an error only if samples follow it, so
 *   a footer after the data is ignored (and noted). An unterminated last line that does not
 *   read is taken as cut off and dropped (and noted).
 * - Time must increase strictly from row to row; sampling need not be uniform.
 * - Line ends: LF, CRLF or CR. A leading byte order mark is dropped. Control characters
 *   (NUL and the like) mean a binary file and are refused.
 * - Errors come back from `finish()` as data; no method throws.
 */
export class CaptureParser {
  private readonly options: CaptureParseOptions;
  private readonly buffer = new SampleBuffer();
  private readonly preamble: Preamble;
  private readonly notes: string[] = [];
  private error: CaptureParseError | null = null;
  private pending = '';
  private lineEnd: '\n' | '\r' | null = null;
  private started = false;
  private line = 0;
  private layout: DataLayout | null = null;
  private separatorCode = 0;
  private timeIndex = 0;
  private voltageIndex = 1;
  private headerLine: number | null = null;
  private firstDataLine = 0;
  private footer: { error: CaptureParseError; count: number } | null = null;

  constructor(options: CaptureParseOptions = {}) {
    this.options = { ...options };
    this.preamble = new Preamble(this.options);
    const problem = checkColumnOptions(this.options);
    if (problem !== null) this.error = { message: problem };
  }

  /** True once the file is known to be unreadable; a caller may stop feeding it. */
  get failed(): boolean {
    return this.error !== null;
  }

  /** Feeds the next piece of text; pieces may split lines, numbers or CRLF pairs anywhere. */
  push(chunk: string): void {
    if (this.error !== null || typeof chunk !== 'string' || chunk.length === 0) return;
    try {
      this.consume(chunk);
    } catch (cause) {
      this.fail({ message: `the capture reader stopped unexpectedly (${String(cause)})` });
    }
  }

  /** Reads the last line, if the file did not end with a line break, and reports. */
  finish(): ParseResult {
    try {
      if (this.error === null && this.pending !== '') {
        const last = this.pending;
        this.pending = '';
        this.readLine(last, 0, last.length, true);
      }
      return this.result();
    } catch (cause) {
      return { ok: false, error: { message: `the capture reader stopped unexpectedly (${String(cause)})` } };
    }
  }

  private consume(chunk: string): void {
    if (!this.started) {
      this.started = true;
      if (chunk.charCodeAt(0) === 0xfeff) chunk = chunk.slice(1);
    }
    const control = chunk.search(CONTROL);
    if (control >= 0) {
      const before = chunk.slice(0, control).split(this.lineEnd ?? '\n').length - 1;
      const code = chunk.charCodeAt(control).toString(16).padStart(2, '0');
      this.fail({
        message: `line ${this.line + 1 + before}: control character 0x${code}; this looks like a binary file, not a CSV capture`,
        line: this.line + 1 + before,
        expected: 'text',
      });
      return;
    }
    if (this.lineEnd === null) {
      chunk = this.pending + chunk;
      this.pending = '';
      this.lineEnd = detectLineEnd(chunk);
      if (this.lineEnd === null) return this.keepPending(chunk);
    }
    const end = this.lineEnd;
    let start = 0;
    if (this.pending !== '') {
      const at = chunk.indexOf(end);
      if (at < 0) return this.keepPending(this.pending + chunk);
      const line = this.pending + chunk.slice(0, at);
      this.pending = '';
      this.readLine(line, 0, line.length, false);
      start = at + 1;
    }
    while (this.error === null) {
      const at = chunk.indexOf(end, start);
      if (at < 0) break;
      this.readLine(chunk, start, at, false);
      start = at + 1;
    }
    if (this.error === null && start < chunk.length) this.keepPending(chunk.slice(start));
  }

  private keepPending(text: string): void {
    if (text.length > MAX_LINE_CHARS) {
      this.fail({
        message: `line ${this.line + 1} is longer than ${MAX_LINE_CHARS} characters; this is not a CSV capture`,
        line: this.line + 1,
      });
    } else this.pending = text;
  }

  private readLine(text: string, start: number, end: number, isFinal: boolean): void {
    this.line++;
    if (this.lineEnd === '\r') {
      if (start < end && text.charCodeAt(start) === 10) start++;
    } else if (end > start && text.charCodeAt(end - 1) === 13) end--;
    if (this.layout !== null) this.readDataLine(text, start, end, isFinal);
    else this.readPreambleLine(text.slice(start, end), isFinal);
  }

  /** The hot path: finds the two cells in place and reads them without slicing. */
  private readDataLine(text: string, start: number, end: number, isFinal: boolean): void {
    const layout = this.layout!;
    const separator = this.separatorCode;
    const timeIndex = this.timeIndex;
    const voltageIndex = this.voltageIndex;
    const lastIndex = timeIndex > voltageIndex ? timeIndex : voltageIndex;
    let column = 0;
    let cellStart = start;
    let timeStart = -1;
    let timeEnd = -1;
    let voltageStart = -1;
    let voltageEnd = -1;
    for (let i = start; ; i++) {
      if (i === end || text.charCodeAt(i) === separator) {
        if (column === timeIndex) {
          timeStart = cellStart;
          timeEnd = i;
        } else if (column === voltageIndex) {
          voltageStart = cellStart;
          voltageEnd = i;
        }
        if (column === lastIndex || i === end) break;
        column++;
        cellStart = i + 1;
      }
    }
    const timeS =
      timeStart < 0 ? Number.NaN : readNumber(text, timeStart, timeEnd, layout.decimalComma, layout.timeExp10);
    const volts =
      voltageStart < 0
        ? Number.NaN
        : readNumber(text, voltageStart, voltageEnd, layout.decimalComma, layout.voltageExp10);
    if (timeS === timeS && volts === volts) {
      if (this.footer !== null) return this.fail(this.footer.error);
      const previousS = this.buffer.lastTimeS();
      if (timeS <= previousS) {
        return this.fail({
          message: `time is not increasing at line ${this.line}: ${timeS} s follows ${previousS} s`,
          line: this.line,
          expected: `a time later than ${previousS} s`,
        });
      }
      this.buffer.push(timeS, volts);
      return;
    }
    this.rejectDataLine(text.slice(start, end), isFinal, Number.isNaN(timeS));
  }

  private rejectDataLine(line: string, isFinal: boolean, timeMissing: boolean): void {
    if (line.trim() === '' || COMMENT.test(line)) return;
    if (isFinal) {
      this.notes.push(`dropped the unterminated last line ${this.line} (${quoteCell(line)}), taken as cut off`);
      return;
    }
    const error = describeRowProblem(line, this.line, this.layout!);
    if (!timeMissing) return this.fail(error);
    if (this.footer === null) this.footer = { error, count: 0 };
    this.footer.count++;
  }

  private readPreambleLine(line: string, isFinal: boolean): void {
    const verdict = this.preamble.read(line, this.line);
    if (verdict === null) return;
    if ('error' in verdict) return this.fail(verdict.error);
    this.startData(verdict.layout, line, isFinal);
  }

  private startData(layout: DataLayout, line: string, isFinal: boolean): void {
    this.layout = layout;
    this.separatorCode = layout.separator.charCodeAt(0);
    this.timeIndex = layout.time.index;
    this.voltageIndex = layout.voltage.index;
    this.headerLine = this.preamble.headerLine();
    this.firstDataLine = this.line;
    this.readDataLine(line, 0, line.length, isFinal);
  }

  private fail(error: CaptureParseError): void {
    this.error ??= error;
    this.pending = '';
  }

  private result(): ParseResult {
    if (this.error !== null) return { ok: false, error: this.error };
    const layout = this.layout;
    if (layout === null) return { ok: false, error: this.preamble.noDataError(this.line) };
    if (this.buffer.length < 2) {
      return {
        ok: false,
        error: {
          message: `only one sample (line ${this.firstDataLine}); a capture needs at least 2`,
          line: this.firstDataLine,
          expected: 'at least 2 samples',
        },
      };
    }
    const notes = [...this.notes];
    if (this.footer !== null) {
      notes.push(`ignored ${this.footer.count} line(s) after the last sample, from line ${this.footer.error.line}`);
    }
    return {
      ok: true,
      samples: this.buffer.samples(),
      time: layout.time,
      voltage: layout.voltage,
      separator: layout.separator,
      decimalComma: layout.decimalComma,
      headerLine: this.headerLine,
      firstDataLine: this.firstDataLine,
      lineCount: this.line,
      notes,
    };
  }
}

/** LF (with or without CR before it), or CR alone as old Mac tools wrote; null until known. */
function detectLineEnd(text: string): '\n' | '\r' | null {
  const lf = text.indexOf('\n');
  const cr = text.indexOf('\r');
  if (cr >= 0 && (lf < 0 || cr < lf)) {
    if (cr + 1 >= text.length) return null;
    return text.charCodeAt(cr + 1) === 10 ? '\n' : '\r';
  }
  return lf >= 0 ? '\n' : null;
}

/** Parses a whole capture held in memory (small files, tests, the client's paste box). */
export function parseCaptureText(text: string, options?: CaptureParseOptions): ParseResult {
  const parser = new CaptureParser(options);
  parser.push(text);
  return parser.finish();
}
