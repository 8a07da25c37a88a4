import { chooseLayout, type DataLayout } from './data-layout';
import { isUnitOnly } from './header-units';
import { readNumber } from './read-number';
import { detectSeparator, splitCells } from './separators';
import { isParameterKey, isPreambleKey, readSettingKey, type SettingsCollector } from './settings';
import type { CaptureParseError, CaptureParseOptions, CaptureSeparator } from './types';

/** Comment lines: skipped before the data and among it. */
export const COMMENT = /^\s*(?:#|\/\/|%|'|;)/u;
const SPACED_NUMBERS = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s+[-+]?\.?\d/u;
const KEY_COLON_VALUE = /^([^:=]{1,60}?)\s*[:=]\s*(.+)$/u;
const MAX_PREAMBLE_LINES = 10_000;
// A run this long of lone numbers is a one-column file, not a preamble: stop reading early.
const SINGLE_NUMBER_LINES_TO_GIVE_UP = 64;

/** What a preamble line turned out to be: nothing to act on (null), the first data row, or the end. */
export type PreambleVerdict = null | { layout: DataLayout } | { error: CaptureParseError };

interface Header {
  line: number;
  cells: string[];
  /** Columns headed by a start or increment key, whose values come in the next row. */
  parameterColumns: number[];
  valuesRead: boolean;
}

/**
 * The lines before the data: collects key–value settings (`Vertical Units,mV`, `Sample Rate:
 * 1 GSa/s`), keeps the header candidate (the last line of two or more non-numeric cells, with a
 * units row under it merged in, and start/increment values under parameter columns taken as
 * settings), and finds the first data row: a row ending in a run of two or more numbers (the
 * data columns; cells before the run are metadata beside the data), or a lone number when the
 * file gives a sample interval. Remembers enough about the other lines to say why a file without
 * data rows has none.
 */
export class Preamble {
  private header: Header | null = null;
  private lines = 0;
  private singleNumberLines: number[] = [];
  private textLines: number[] = [];
  private keyLines = 0;
  private spacedLine: number | null = null;
  private separator: CaptureSeparator | null = null;
  private lastLine = 0;

  constructor(
    private readonly options: CaptureParseOptions,
    private readonly settings: SettingsCollector,
  ) {}

  /** Line of the header the layout came from, or null. */
  headerLine(): number | null {
    return this.header?.line ?? null;
  }

  decimalComma(): boolean {
    return this.separator !== null && this.separator !== ',';
  }

  read(line: string, lineNumber: number): PreambleVerdict {
    const trimmed = line.trim();
    if (trimmed === '') return null;
    if (++this.lines > MAX_PREAMBLE_LINES) {
      return { error: { message: `no data rows in the first ${MAX_PREAMBLE_LINES} lines`, line: lineNumber } };
    }
    if (COMMENT.test(trimmed)) {
      const body = trimmed.replace(/^(?:#|\/\/|%|'|;)\s*/u, '');
      const kv = KEY_COLON_VALUE.exec(body);
      if (kv) this.settings.add(kv[1], kv[2]);
      return null;
    }
    const separator = detectSeparator(trimmed);
    if (separator === null) return this.readSingleCell(trimmed, lineNumber);
    this.separator ??= separator;
    const decimalComma = separator !== ',';
    const cells = splitCells(trimmed, separator);
    while (cells.length > 1 && cells[cells.length - 1] === '') cells.pop();
    const values = cells.map((cell) => readNumber(cell, 0, cell.length, decimalComma, 0));
    const isNumber = (index: number) => !Number.isNaN(values[index]);

    const lastLine = this.lastLine;
    this.lastLine = lineNumber;
    const header = this.header;
    if (header !== null && !header.valuesRead && header.line === lineNumber - 1 && header.parameterColumns.length > 0) {
      header.valuesRead = true;
      for (const column of header.parameterColumns) if (cells[column]) this.settings.add(header.cells[column], cells[column]);
      this.mergeUnits(header, cells, lineNumber, header.parameterColumns);
      return null;
    }

    let run = 0;
    while (run < cells.length && isNumber(cells.length - 1 - run)) run++;
    const textBeforeRun = cells.length - run;
    const keyThenNumbers = textBeforeRun === 1 && cells[0] !== '' && isPreambleKey(cells[0]);
    const oneColumnData = run === 1 && cells.length === 1;
    if ((run >= 2 && !keyThenNumbers) || (oneColumnData && this.hasInterval())) {
      const dataColumns = Array.from({ length: run }, (_, k) => textBeforeRun + k);
      if (textBeforeRun > 0) this.readMetadataCells(cells.slice(0, textBeforeRun));
      // a header is the line right above the data (or above its units row), not any text line before it
      if (this.header !== null && this.header.line !== lastLine) {
        this.settings.add(this.header.cells[0], this.header.cells.slice(1).filter((c) => c !== '').join(' '));
        this.header = null;
      }
      const headerCells = this.header?.cells ?? null;
      const result = chooseLayout(
        separator,
        decimalComma,
        headerCells,
        dataColumns.filter((column) => !this.header?.parameterColumns.includes(column)),
        dataColumns.map((column) => values[column]),
        this.settings,
        this.options,
        lineNumber,
      );
      if ('error' in result) return result;
      return { layout: result };
    }

    const nonEmpty = cells.filter((cell) => cell !== '');
    const numericCells = cells.filter((_, index) => isNumber(index)).length;
    if (numericCells === 0 && nonEmpty.length >= 2 && readSettingKey(cells[0]) === null) {
      // a header candidate; the one it replaces was a key–value line after all
      if (header !== null && header.line === lineNumber - 1 && cells.every((cell) => cell === '' || isUnitOnly(cell))) {
        this.mergeUnits(header, cells, lineNumber, []);
        return null;
      }
      if (header !== null) this.settings.add(header.cells[0], header.cells.slice(1).filter((c) => c !== '').join(' '));
      this.header = { line: lineNumber, cells, parameterColumns: cells.flatMap((cell, index) => (index > 0 && isParameterKey(cell) ? [index] : [])), valuesRead: false };
      this.textLines.push(lineNumber);
      return null;
    }
    if (cells[0] !== '' && !isNumber(0)) {
      this.keyLines++;
      this.settings.add(cells[0], cells[1] ?? '', cells.slice(2).filter((c) => c !== '').join(' '));
    } else this.textLines.push(lineNumber);
    if (numericCells > 0 && this.header !== null) {
      this.settings.add(this.header.cells[0], this.header.cells.slice(1).filter((c) => c !== '').join(' '));
      this.header = null;
    }
    return null;
  }

  private hasInterval(): boolean {
    return this.settings.number('interval') !== undefined || this.settings.number('sampleRate') !== undefined;
  }

  private readSingleCell(trimmed: string, lineNumber: number): PreambleVerdict {
    const lastLine = this.lastLine;
    this.lastLine = lineNumber;
    const decimalComma = this.separator !== ',';
    const value = readNumber(trimmed, 0, trimmed.length, decimalComma, 0);
    if (!Number.isNaN(value)) {
      if (this.hasInterval()) {
        const header = this.header?.line === lastLine ? this.header.cells : null;
        const result = chooseLayout(this.separator ?? ',', decimalComma, header, [0], [value], this.settings, this.options, lineNumber);
        return 'error' in result ? result : { layout: result };
      }
      this.singleNumberLines.push(lineNumber);
      if (this.singleNumberLines.length >= SINGLE_NUMBER_LINES_TO_GIVE_UP) return { error: this.noDataError(lineNumber) };
      return null;
    }
    if (SPACED_NUMBERS.test(trimmed)) {
      this.spacedLine ??= lineNumber;
      return null;
    }
    const kv = KEY_COLON_VALUE.exec(trimmed);
    if (kv) {
      this.keyLines++;
      this.settings.add(kv[1], kv[2]);
    } else if (this.header === null && /^[\p{L}][\p{L}\p{N} ()[\]_/.-]*$/u.test(trimmed)) {
      // a one-word header over a one-column file ("CH1")
      this.header = { line: lineNumber, cells: [trimmed], parameterColumns: [], valuesRead: false };
    }
    return null;
  }

  private mergeUnits(header: Header, cells: string[], lineNumber: number, skip: number[]): void {
    header.cells = header.cells.map((name, index) => (cells[index] && !skip.includes(index) ? `${name} (${cells[index].replace(/^[([{]\s*|\s*[)\]}]$/gu, '')})` : name));
    header.line = lineNumber;
  }

  /** Label, value, unit cells in front of a data row. */
  readMetadataCells(cells: string[]): void {
    const [label, value, ...rest] = cells;
    if (label && value && Number.isNaN(readNumber(label, 0, label.length, this.decimalComma(), 0))) {
      this.settings.add(label, value, rest.filter((c) => c !== '').join(' '));
    }
  }

  /** Why no data row was found, from what the other lines looked like. */
  noDataError(lineCount: number): CaptureParseError {
    if (this.spacedLine !== null) {
      return {
        message: `line ${this.spacedLine}: columns separated by spaces are not supported; separate them with commas, semicolons or tabs`,
        line: this.spacedLine,
        expected: 'a comma, semicolon or tab between columns',
      };
    }
    const single = this.singleNumberLines;
    if (single.length > 0) {
      return {
        message: `only one column: line ${single[0]} holds a single number and the file gives no sample interval; a capture needs a time column and a voltage column, or 'Sample Interval', 'Increment' or 'Sample Rate' in the preamble`,
        line: single[0],
        expected: 'two columns: time and voltage',
      };
    }
    if (lineCount === 0) return { message: 'the file is empty' };
    const saw: string[] = [];
    if (this.keyLines > 0) saw.push(`${this.keyLines} key–value line(s)`);
    if (this.textLines.length > 0) saw.push(`text without numbers on line(s) ${this.textLines.slice(0, 5).join(', ')}${this.textLines.length > 5 ? '…' : ''}`);
    return {
      message: `no numeric rows found in ${lineCount} line(s)${saw.length ? ` (saw ${saw.join('; ')})` : ''}; expected rows with numbers in two or more columns (time and voltage), separated by commas, semicolons or tabs`,
      expected: 'rows of numbers',
    };
  }
}
