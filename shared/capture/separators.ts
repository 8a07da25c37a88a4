import type { CaptureSeparator } from './types';

/**
 * The separator a line uses: a tab if it has one, else a semicolon, else a comma. That order
 * lets a semicolon file keep commas as decimal marks ("0,5;1,25") and a tab file either mark.
 */
export function detectSeparator(line: string): CaptureSeparator | null {
  if (line.includes('\t')) return '\t';
  if (line.includes(';')) return ';';
  if (line.includes(',')) return ',';
  return null;
}

/**
 * Splits a preamble or header line into cells, keeping separators inside double quotes
 * ("Time, s") and dropping the quotes. Data rows do not come through here: they are read in
 * place by the parser, since quoting numbers is rare and splitting allocates.
 */
export function splitCells(line: string, separator: CaptureSeparator): string[] {
  if (!line.includes('"')) return line.split(separator).map((cell) => cell.trim());
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const char = line[i];
    if (char === '"') {
      if (quoted && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else quoted = !quoted;
    } else if (char === separator && !quoted) {
      cells.push(cell.trim());
      cell = '';
    } else cell += char;
  }
  cells.push(cell.trim());
  return cells;
}

// C0 controls other than tab, LF, VT, FF, CR and the DOS end-of-file mark never occur in text.
export const CONTROL = /[\u0000-\u0008\u000e-\u0019\u001b-\u001f]/u;

/** LF (with or without CR before it), or CR alone as old Mac tools wrote; null until known. */
export function detectLineEnd(text: string): '\n' | '\r' | null {
  const lf = text.indexOf('\n');
  const cr = text.indexOf('\r');
  if (cr >= 0 && (lf < 0 || cr < lf)) {
    if (cr + 1 >= text.length) return null;
    return text.charCodeAt(cr + 1) === 10 ? '\n' : '\r';
  }
  return lf >= 0 ? '\n' : null;
}

