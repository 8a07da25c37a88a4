import { checkColumnOptions, unitName, unitWord, type DataLayout } from './data-layout';
import { describeRowProblem, quoteCell } from './parse-messages';
import { COMMENT, Preamble } from './preamble';
import { readNumber } from './read-number';
import { SampleBuffer } from './sample-buffer';
import { splitCells } from './separators';
import { SettingsCollector } from './settings';
import type { CaptureChannel, CaptureColumn, CaptureParseError, CaptureParseOptions, ParseResult } from './types';

const MAX_LINE_CHARS = 1 << 20;
// C0 controls other than tab, LF, VT, FF, CR and the DOS end-of-file mark never occur in text.
const CONTROL = /[\u0000-\u0008\u000e-\u0019\u001b-\u001f]/u;
const SLOT_NONE = -2;
const SLOT_TIME = -1;

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
  private buffer = new SampleBuffer();
  private readonly settings: SettingsCollector;
  private readonly preamble: Preamble;
  private readonly notes: string[] = [];
  private error: CaptureParseError | null = null;
  private pending = '';
  private lineEnd: '\n' | '\r' | null = null;
  private started = false;
  private line = 0;
  private layout: DataLayout | null = null;
  private separatorCode = 0;
  private slots = new Int16Array(0);
  private lastColumn = 0;
  private row = new Float64Array(0);
  private exp10s: number[] = [];
  private timeExp10 = 0;
  private rows = 0;
  private headerLine: number | null = null;
  private firstDataLine = 0;
  private footer: { error: CaptureParseError; count: number } | null = null;

  constructor(options: CaptureParseOptions = {}) {
    this.options = { ...options };
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
    const time = layout.time;
    let timeS: number;
    if (time.kind === 'column') timeS = timeValue;
    else if (time.kind === 'index') timeS = time.startS + timeValue * time.intervalS;
    else timeS = row[0] === row[0] ? time.startS + this.rows * time.intervalS : Number.NaN;
    let allRead = timeS === timeS;
    for (let c = 0; c < row.length && allRead; c++) if (row[c] !== row[c]) allRead = false;
    if (allRead) {
      if (this.footer !== null) return this.fail(this.footer.error);
      const previousS = this.buffer.lastTimeS();
      if (timeS <= previousS) {
        return this.fail({
          message: `time is not increasing at line ${this.line}: ${timeS} s follows ${previousS} s`,
          line: this.line,
          expected: `a time later than ${previousS} s`,
        });
      }
      this.buffer.pushRow(timeS, row);
      this.rows++;
      if (layout.metadataColumns > 0 && start < end && text.charCodeAt(start) !== separator) {
        this.preamble.readMetadataCells(splitCells(text.slice(start, end), layout.separator).slice(0, layout.metadataColumns));
      }
      return;
    }
    this.rejectDataLine(text.slice(start, end), isFinal, timeS !== timeS);
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
    this.buffer = new SampleBuffer(layout.channels.length);
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
    const notes = [...layout.notes];
    if (layout.decimalComma) notes.push(`Read with '${layout.separator === '\t' ? 'tab' : layout.separator}' between columns and a comma as the decimal mark.`);
    const timesS = this.buffer.times();
    let timeUnit = layout.time.kind === 'column' ? layout.time.column.unit : 's';
    if (layout.time.kind === 'column' && layout.time.column.name !== null && notes.some((n) => n.includes('read as seconds'))) {
      const exp10 = this.settings.number('horizontalUnit');
      if (exp10 !== undefined && exp10 !== 0) {
        scaleInPlace(timesS, exp10);
        timeUnit = `1e${exp10} s`;
        notes.push(`…then rescaled: the metadata's '${this.settings.get('horizontalUnit')!.key}' says '${this.settings.get('horizontalUnit')!.text}'.`);
      }
    }
    const channels: CaptureChannel[] = [];
    const channelVolts: Float64Array[] = [];
    layout.channels.forEach((channel, slot) => {
      const volts = this.buffer.channel(slot);
      let unit = channel.unit;
      if (channel.unitSource === 'default') {
        const exp10 = this.settings.number('verticalUnit', channel.number);
        if (exp10 !== undefined) {
          if (exp10 !== 0) scaleInPlace(volts, exp10);
          unit = unitName(exp10);
          const applied = this.settings.get('verticalUnit', channel.number)!;
          notes.push(`'${channel.name}' read as ${unitWord(exp10)} from the file's '${applied.key}' = '${applied.text}'.`);
        } else notes.push(`'${channel.name}' read as volts: neither the header nor the preamble names a unit.`);
      }
      channels.push({ index: slot + 1, name: channel.name, unit, column: channel.column });
      channelVolts.push(volts);
    });
    const chosen = this.chooseChannel(channels);
    if ('error' in chosen) return { ok: false, error: chosen.error };
    const picked = channels[chosen.index - 1];
    if (channels.length > 1 || chosen.asked) {
      notes.push(
        `Analysed channel ${picked.index} ('${picked.name}', column ${picked.column + 1}) of ${channels.length}${chosen.asked ? ', as chosen' : ': the first signal column; choose another with the channel field'}.`,
      );
    }
    if (this.footer !== null) {
      notes.push(`Ignored ${this.footer.count} line(s) after the last sample, from line ${this.footer.error.line}.`);
    }
    notes.push(...this.notes);
    const metadata = this.settings.metadataFor(layout.channels[chosen.index - 1].number, notes);
    const time: CaptureColumn = layout.time.kind === 'rows' ? { index: -1, name: null, unit: 's' } : { ...layout.time.column, unit: layout.time.kind === 'index' ? 'sample' : timeUnit };
    return {
      ok: true,
      samples: { timesS, volts: channelVolts[chosen.index - 1] },
      time,
      voltage: { index: picked.column, name: layout.channels[chosen.index - 1].name.startsWith('column ') && this.headerLine === null ? null : picked.name, unit: picked.unit },
      channel: picked.index,
      channels,
      channelVolts,
      metadata,
      separator: layout.separator,
      decimalComma: layout.decimalComma,
      headerLine: this.headerLine,
      firstDataLine: this.firstDataLine,
      lineCount: this.line,
      notes,
    };
  }

  private chooseChannel(channels: CaptureChannel[]): { index: number; asked: boolean } | { error: CaptureParseError } {
    const list = channels.map((c) => `${c.index} '${c.name}'`).join(', ');
    const { channel, voltageColumnIndex } = this.options;
    if (voltageColumnIndex !== undefined) {
      const found = channels.find((c) => c.column === voltageColumnIndex);
      if (found) return { index: found.index, asked: true };
      const expected = `a number in column ${voltageColumnIndex + 1} (voltage)`;
      return { error: { message: `expected ${expected}, but the signal columns are ${channels.map((c) => c.column + 1).join(', ')}`, expected } };
    }
    if (channel === undefined) return { index: 1, asked: false };
    const text = String(channel).trim();
    if (/^\d+$/u.test(text)) {
      const index = Number(text);
      if (index >= 1 && index <= channels.length) return { index, asked: true };
      return { error: { message: `channel ${index} does not exist: the file has ${channels.length} signal column(s): ${list}`, expected: `a channel from 1 to ${channels.length}` } };
    }
    const lower = text.toLowerCase();
    const byName = channels.find((c) => c.name.toLowerCase() === lower) ?? channels.find((c) => c.name.toLowerCase().replace(/\s*[([].*$/u, '') === lower);
    if (byName) return { index: byName.index, asked: true };
    return { error: { message: `no signal column is named '${text}'; the file has ${list}`, expected: 'a channel number or a column name' } };
  }
}

function scaleInPlace(values: Float64Array, exp10: number): void {
  const factor = 10 ** Math.abs(exp10);
  for (let i = 0; i < values.length; i++) values[i] = exp10 < 0 ? values[i] / factor : values[i] * factor;
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
