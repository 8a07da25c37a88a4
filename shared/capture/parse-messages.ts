import type { DataLayout } from './data-layout';
import { readNumber } from './read-number';
import type { CaptureParseError } from './types';

const MAX_SHOWN_CHARS = 40;

/** A cell as shown in a message: quoted, and shortened when long. */
export function quoteCell(cell: string): string {
  const shown = cell.length > MAX_SHOWN_CHARS ? `${cell.slice(0, MAX_SHOWN_CHARS)}…` : cell;
  return `'${shown}'`;
}

/**
 * Says what is wrong with a data row that did not read, naming the first of its two columns
 * that failed (time, sample index or a channel): "line 17: expected a number in column 2 (voltage), got 'abc'". Only called on
 * the rare bad row, so it may split the line.
 */
export function describeRowProblem(line: string, lineNumber: number, layout: DataLayout): CaptureParseError {
  const cells = line.split(layout.separator);
  const time = layout.time;
  const columns = [
    ...(time.kind === 'rows' ? [] : [{ what: time.kind === 'index' ? 'sample index' : 'time', index: time.column.index, exp10: time.kind === 'column' ? time.exp10 : 0 }]),
    ...layout.channels.map((channel) => ({ what: layout.channels.length > 1 ? `voltage, '${channel.name}'` : 'voltage', index: channel.column, exp10: channel.exp10 })),
  ].sort((a, b) => a.index - b.index);
  for (const { what, index, exp10 } of columns) {
    const expected = `a number in column ${index + 1} (${what})`;
    if (index >= cells.length) {
      const count = cells.length === 1 ? 'only one column' : `only ${cells.length} columns`;
      return { message: `line ${lineNumber}: expected ${expected}, but the row has ${count}`, line: lineNumber, expected };
    }
    const cell = cells[index];
    if (Number.isNaN(readNumber(cell, 0, cell.length, layout.decimalComma, exp10))) {
      const got = cell.trim() === '' ? 'an empty cell' : quoteCell(cell.trim());
      return { message: `line ${lineNumber}: expected ${expected}, got ${got}`, line: lineNumber, expected };
    }
  }
  return { message: `line ${lineNumber} cannot be read`, line: lineNumber };
}
