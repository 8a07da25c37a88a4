import { checkColumnOptions, type DataLayout } from './data-layout';
import { describeParse, scaleInPlace, type ParsedColumns } from './parse-result';
import { describeRowProblem, quoteCell } from './parse-messages';
import { COMMENT, Preamble } from './preamble';
import { readNumber } from './read-number';
import { SampleBuffer, type RowSink } from './sample-buffer';
import { CONTROL, detectLineEnd, splitCells } from './separators';
import { SettingsCollector } from './settings';
import type { CaptureParseError, CaptureParseOptions, ParseResult } from './types';

export { scaleValue, type ParsedColumns } from './parse-result';


/** A capture's control bytes (as `CONTROL`), by code, for the byte reader. */

export const MAX_LINE_CHARS = 1 << 20;
export const SLOT_NONE = -2;
export const SLOT_TIME = -1;
export const ROW_TAKEN = 0;
export const ROW_FAILED = 1;
const ROW_NO_TIME = 2;
const ROW_UNREAD = 3;

/**
 * Reads a CSV capture a chunk at a time, holding only the unfinished last line and the samples
 * (growing Float64Arrays, one per channel), never the text of the file.
 *
 * What it accepts, and the choices made where files disagree (each one made is listed in `notes`):
 * - Separators: comma, semicolon or tab, detected on the first line that has one (tab, else
 *   semicolon, else comma). With a semicolon or tab separator a comma inside a number is the
 *   decimal mark ("0,5;1,25"); with a comma separator only the point is.
 * - Preamble: key–value lines before the data (`Vertical Units,mV`, `Probe,10X`, `Sample Rate:
 *   1GSa/s`, comments `# key: value`) are kept in `metadata.raw`, and the ones understood fill
 *   the settings (attenuation setting, V/div, offset, sample rate, coupling, bandwidth limit,
 *   input resistance), the units and the start and increment of the time axis.
 * - Header: the line right above the data, a units row under it merged in; start/increment
 *   cells in it take their values from the row under it. Units in it are applied (s, ms, µs/us,
 *   ns, ps; V, mV, µV, kV), else the preamble's, else seconds and volts (said in a note).
 * - Data: the first row ending in two or more numbers; cells before them are metadata columns
 *   (label, value, unit). Among the data columns: time (by header, else the first), or a sample
 *   index, or none, time then being start + i·increment; every other one is a channel.
 * - Bad rows: a row whose time reads but a channel does not is an error with its line and
 *   column; a row with no time is an error only if samples follow it (else a footer, noted).
 *   An unterminated last line that does not read is taken as cut off and dropped (noted).
 * - Time must increase strictly from row to row; sampling need not be uniform.
 * - Line ends: LF, CRLF or CR. A leading byte order mark is dropped. Control characters
 *   (NUL and the like) mean a binary file and are refused.
 * - Errors come back from `finish()` as data; no method throws.
 */
export class CaptureParser {
  private readonly options: CaptureParseOptions;
  protected buffer: RowSink = new SampleBuffer();
  private readonly sinkFor: (channelCount: number) => RowSink;
  private readonly settings: SettingsCollector;
  protected readonly preamble: Preamble;
  private readonly notes: string[] = [];
  protected error: CaptureParseError | null = null;
  protected pending = '';
  protected lineEnd: '\n' | '\r' | null = null;
  private started = false;
  protected line = 0;
  protected layout: DataLayout | null = null;
  protected separatorCode = 0;
  protected slots = new Int16Array(0);
  protected lastColumn = 0;
  protected row = new Float64Array(0);
  protected exp10s: number[] = [];
  protected timeExp10 = 0;
  private rows = 0;
  private headerLine: number | null = null;
  private firstDataLine = 0;
  private footer: { error: CaptureParseError; count: number } | null = null;

  /** @param sinkFor where the rows go (default: growing arrays in memory, for `finish`); another sink is read with `finishColumns`. */
  constructor(options: CaptureParseOptions = {}, sinkFor: (channelCount: number) => RowSink = (count) => new SampleBuffer(count)) {
    this.options = { ...options };
    this.sinkFor = sinkFor;
    this.settings = new SettingsCollector(() => this.preamble.decimalComma());
    this.preamble = new Preamble(this.options, this.settings);
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
      const columns = this.finishColumns();
      if (!columns.ok) return columns;
      const buffer = this.buffer as SampleBuffer;
      const timesS = buffer.times();
      if (columns.timeExp10 !== 0) scaleInPlace(timesS, columns.timeExp10);
      const channelVolts = columns.channels.map((_, slot) => {
        const volts = buffer.channel(slot);
        if (columns.channelExp10s[slot] !== 0) scaleInPlace(volts, columns.channelExp10s[slot]);
        return volts;
      });
      const { rows: _rows, timeExp10: _t, channelExp10s: _c, ...rest } = columns;
      return { ...rest, samples: { timesS, volts: channelVolts[columns.channel - 1] }, channelVolts };
    } catch (cause) {
      return { ok: false, error: { message: `the capture reader stopped unexpectedly (${String(cause)})` } };
    }
  }

  /** As `finish`, for a parser given its own sink: the rows stay there, unscaled. */
  finishColumns(): ParsedColumns | { ok: false; error: CaptureParseError } {
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

  protected keepPending(text: string): void {
    if (text.length > MAX_LINE_CHARS) {
      this.fail({
        message: `line ${this.line + 1} is longer than ${MAX_LINE_CHARS} characters; this is not a CSV capture`,
        line: this.line + 1,
      });
    } else this.pending = text;
  }

  protected readLine(text: string, start: number, end: number, isFinal: boolean): void {
    this.line++;
    if (this.lineEnd === '\r') {
      if (start < end && text.charCodeAt(start) === 10) start++;
    } else if (end > start && text.charCodeAt(end - 1) === 13) end--;
    if (this.layout !== null) this.readDataLine(text, start, end, isFinal);
    else this.readPreambleLine(text.slice(start, end), isFinal);
  }

  /** The hot path: finds the cells in place and reads them without slicing. */
  private readDataLine(text: string, start: number, end: number, isFinal: boolean): void {
    const layout = this.layout!;
    const separator = this.separatorCode;
    const slots = this.slots;
    const lastColumn = this.lastColumn;
    const row = this.row;
    const exp10s = this.exp10s;
    const decimalComma = layout.decimalComma;
    row.fill(Number.NaN);
    let timeValue = Number.NaN;
    let column = 0;
    let cellStart = start;
    for (let i = start; ; i++) {
      if (i === end || text.charCodeAt(i) === separator) {
        const slot = slots[column];
        if (slot === SLOT_TIME) timeValue = readNumber(text, cellStart, i, decimalComma, this.timeExp10);
        else if (slot >= 0) row[slot] = readNumber(text, cellStart, i, decimalComma, exp10s[slot]);
        if (column === lastColumn || i === end) break;
        column++;
        cellStart = i + 1;
      }
    }
    const taken = this.takeRow(timeValue);
    if (taken === ROW_TAKEN) {
      if (layout.metadataColumns > 0 && start < end && text.charCodeAt(start) !== separator) {
        this.preamble.readMetadataCells(splitCells(text.slice(start, end), layout.separator).slice(0, layout.metadataColumns));
      }
    } else if (taken !== ROW_FAILED) this.rejectDataLine(text.slice(start, end), isFinal, taken === ROW_NO_TIME);
  }

  /** Stores one row once every cell read; says why not otherwise. */
  protected takeRow(timeValue: number): number {
    const layout = this.layout!;
    const row = this.row;
    const time = layout.time;
    let timeS: number;
    if (time.kind === 'column') timeS = timeValue;
    else if (time.kind === 'index') timeS = time.startS + timeValue * time.intervalS;
    else timeS = row[0] === row[0] ? time.startS + this.rows * time.intervalS : Number.NaN;
    let allRead = timeS === timeS;
    for (let c = 0; c < row.length && allRead; c++) if (row[c] !== row[c]) allRead = false;
    if (!allRead) return timeS !== timeS ? ROW_NO_TIME : ROW_UNREAD;
    if (this.footer !== null) {
      this.fail(this.footer.error);
      return ROW_FAILED;
    }
    const previousS = this.buffer.lastTimeS();
    if (timeS <= previousS) {
      this.fail({
        message: `time is not increasing at line ${this.line}: ${timeS} s follows ${previousS} s`,
        line: this.line,
        expected: `a time later than ${previousS} s`,
      });
      return ROW_FAILED;
    }
    this.buffer.pushRow(timeS, row);
    this.rows++;
    return ROW_TAKEN;
  }

  private rejectDataLine(line: string, isFinal: boolean, timeMissing: boolean): void {
    if (line.trim() === '' || COMMENT.test(line)) return;
    if (isFinal) {
      this.notes.push(`dropped the unterminated last line ${this.line} (${quoteCell(line)}), taken as cut off`);
      return;
    }
    const error = describeRowProblem(line, this.line, this.layout!);
    if (this.layout!.metadataColumns > 0 && line.trim() !== '' && !timeMissing) return this.fail(error);
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
    this.useLayout(layout);
    this.headerLine = this.preamble.headerLine();
    this.firstDataLine = this.line;
    this.readDataLine(line, 0, line.length, isFinal);
  }

  /** Sets up the row reader for a layout (and its sink). */
  protected useLayout(layout: DataLayout): void {
    this.layout = layout;
    this.separatorCode = layout.separator.charCodeAt(0);
    const columns = layout.channels.map((channel) => channel.column);
    if (layout.time.kind !== 'rows') columns.push(layout.time.column.index);
    this.lastColumn = Math.max(...columns);
    this.slots = new Int16Array(this.lastColumn + 1).fill(SLOT_NONE);
    layout.channels.forEach((channel, slot) => (this.slots[channel.column] = slot));
    if (layout.time.kind !== 'rows') this.slots[layout.time.column.index] = SLOT_TIME;
    this.timeExp10 = layout.time.kind === 'column' ? layout.time.exp10 : 0;
    this.exp10s = layout.channels.map((channel) => channel.exp10);
    this.row = new Float64Array(layout.channels.length);
    this.buffer = this.sinkFor(layout.channels.length);
  }

  /**
   * The layout another reader may continue the data rows with from a later line (see
   * `PlainRowReader`): set while rows without metadata cells and with LF line ends are being
   * read and no footer has begun; null otherwise, and for rows timed by their count (a reader
   * elsewhere cannot know it).
   */
  get continuableLayout(): DataLayout | null {
    const layout = this.layout;
    if (layout === null || this.error !== null || this.lineEnd !== '\n' || this.footer !== null) return null;
    return layout.metadataColumns === 0 && layout.time.kind !== 'rows' ? layout : null;
  }

  /** True while the header is still being read: no layout yet, and no error. */
  get readingHeader(): boolean {
    return this.layout === null && this.error === null;
  }

  /** True when nothing of a line is held over: what was read so far ended with a line end. */
  get atLineStart(): boolean {
    return this.pending === '';
  }

  /**
   * Counts `rows` rows, one line each, that another reader (`PlainRowReader`, on another thread)
   * took into this parser's sink from the line after the last one read here; the caller has
   * appended them to the sink.
   */
  rowsTakenElsewhere(rows: number): void {
    this.rows += rows;
    this.line += rows;
  }

  protected fail(error: CaptureParseError): void {
    this.error ??= error;
    this.pending = '';
  }

  private result(): ParsedColumns | { ok: false; error: CaptureParseError } {
    return describeParse({
      error: this.error,
      layout: this.layout,
      noDataError: () => this.preamble.noDataError(this.line),
      rows: this.buffer.length,
      firstDataLine: this.firstDataLine,
      settings: this.settings,
      footer: this.footer,
      notes: this.notes,
      headerLine: this.headerLine,
      line: this.line,
      options: this.options,
    });
  }
}

/** Parses a whole capture held in memory (small files, tests, the client's paste box). */
export function parseCaptureText(text: string, options?: CaptureParseOptions): ParseResult {
  const parser = new CaptureParser(options);
  parser.push(text);
  return parser.finish();
}
