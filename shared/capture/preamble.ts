import { chooseLayout, type DataLayout } from './data-layout';
import { isUnitOnly } from './header-units';
import { readNumber } from './read-number';
import { detectSeparator, splitCells } from './separators';
import type { CaptureParseError, CaptureParseOptions } from './types';

/** Comment lines: skipped before the data and among it. */
export const COMMENT = /^\s*(?:#|\/\/|%|'|;)/u;
const SPACED_NUMBERS = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s+[-+]?\.?\d/u;
const MAX_PREAMBLE_LINES = 10_000;
// A run this long of lone numbers is a one-column file, not a preamble: stop reading early.
const SINGLE_NUMBER_LINES_TO_GIVE_UP = 64;

/** What a preamble line turned out to be: nothing to act on (null), the first data row, or the end. */
export type PreambleVerdict = null | { layout: DataLayout } | { error: CaptureParseError };

/**
 * The lines before the data: finds the first row with numbers in the time and voltage columns
 * (and with it the separator and the layout), keeps the header candidate (the last line of two
 * or more non-numeric cells, with a units row under it merged in), and remembers enough about
 * the other lines to say why a file without data rows has none.
 */
export class Preamble {
  private header: { line: number; cells: string[] } | null = null;
  private lines = 0;
  private singleNumberLines: number[] = [];
  private narrowRowLines: number[] = [];
  private narrowLayout: DataLayout | null = null;
  private spacedLine: number | null = null;

  constructor(private readonly options: CaptureParseOptions) {}

  /** Line of the header the layout came from, or null. */
  headerLine(): number | null {
    return this.header?.line ?? null;
  }

  read(line: string, lineNumber: number): PreambleVerdict {
    const trimmed = line.trim();
    if (trimmed === '') return null;
    if (++this.lines > MAX_PREAMBLE_LINES) {
      return { error: { message: `no numeric rows in the first ${MAX_PREAMBLE_LINES} lines`, line: lineNumber } };
    }
    const separator = detectSeparator(trimmed);
    if (separator === null) {
      if (!Number.isNaN(readNumber(trimmed, 0, trimmed.length, true, 0))) {
        this.singleNumberLines.push(lineNumber);
        if (this.singleNumberLines.length >= SINGLE_NUMBER_LINES_TO_GIVE_UP) return { error: this.noDataError(lineNumber) };
      } else if (SPACED_NUMBERS.test(trimmed)) this.spacedLine ??= lineNumber;
      return null;
    }
    const cells = splitCells(trimmed, separator);
    const layout = chooseLayout(separator, this.header?.cells ?? null, this.options);
    const isNumber = (index: number) =>
      index < cells.length && !Number.isNaN(readNumber(cells[index], 0, cells[index].length, layout.decimalComma, 0));
    if (isNumber(layout.time.index) && isNumber(layout.voltage.index)) return { layout };
    const numericCells = cells.filter((_, index) => isNumber(index)).length;
    if (numericCells >= 2) {
      this.narrowRowLines.push(lineNumber);
      this.narrowLayout ??= layout;
    }
    if (COMMENT.test(trimmed)) return null;
    if (numericCells > 0 || cells.length < 2) this.header = null;
    else if (this.header?.line === lineNumber - 1 && cells.every((cell) => cell === '' || isUnitOnly(cell))) {
      const header = this.header;
      header.cells = header.cells.map((name, index) => (cells[index] ? `${name} ${cells[index]}` : name));
      header.line = lineNumber;
    } else this.header = { line: lineNumber, cells };
    return null;
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
    const narrow = this.narrowRowLines;
    if (single.length > 0 && single.length >= narrow.length) {
      return {
        message: `only one column: line ${single[0]} holds a single number; a capture needs a time column and a voltage column`,
        line: single[0],
        expected: 'two columns: time and voltage',
      };
    }
    if (narrow.length > 0 && this.narrowLayout !== null) {
      const { time, voltage } = this.narrowLayout;
      const expected = `numbers in column ${time.index + 1} (time) and column ${voltage.index + 1} (voltage)`;
      return {
        message: `no numeric rows found with ${expected}; line ${narrow[0]} has numbers in other columns`,
        line: narrow[0],
        expected,
      };
    }
    return { message: lineCount === 0 ? 'the file is empty' : 'no numeric rows found' };
  }
}
