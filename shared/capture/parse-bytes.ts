import type { DataLayout } from './data-layout';
import type { RowSink } from './sample-buffer';
import { CaptureParser, MAX_LINE_CHARS, ROW_FAILED, ROW_TAKEN, SLOT_NONE, SLOT_TIME } from './parse';
import { readNumberBytes } from './read-number';
import { CONTROL } from './separators';

/** A capture's control bytes (as `CONTROL`), by code. */
const CONTROL_BYTE = Array.from({ length: 32 }, (_, c) => CONTROL.test(String.fromCharCode(c)));

/**
 * A `CaptureParser` that also takes bytes: once the data rows start (and the file is UTF-8 or
 * Latin-1 with LF line ends), the rows are read straight from the bytes of the file, without
 * decoding it to text first. Every line that is not a plain data row goes back to the text reader.
 */
export class ByteCaptureParser extends CaptureParser {
  private pendingBytes: Uint8Array | null = null;
  private decodeBytes: ((bytes: Uint8Array) => string) | null = null;

  /**
   * True once data rows are being read with LF line ends: from then on the caller may hand over
   * bytes (`pushBytes`) instead of text, after taking back the unfinished line (`takePending`).
   */
  get acceptsBytes(): boolean {
    return this.layout !== null && this.lineEnd === '\n' && this.error === null;
  }

  override get atLineStart(): boolean {
    return this.pendingBytes === null && super.atLineStart;
  }

  /** The unfinished last line pushed as text, handed back so it can be pushed again as bytes. */
  takePending(): string {
    const text = this.pending;
    this.pending = '';
    return text;
  }

  /**
   * Feeds the next bytes of an ASCII-compatible text (UTF-8 or Latin-1, as `decode` reads it)
   * once `acceptsBytes`: data rows are read straight from the bytes, any other line is decoded
   * and read as text.
   */
  pushBytes(bytes: Uint8Array, decode: (bytes: Uint8Array) => string): void {
    if (this.error !== null || bytes.length === 0) return;
    this.decodeBytes = decode;
    try {
      let start = 0;
      if (this.pendingBytes !== null) {
        // only the line cut between chunks is joined, not the whole chunk
        const at = bytes.indexOf(10);
        const head = at < 0 ? bytes : bytes.subarray(0, at + 1);
        const joined = new Uint8Array(this.pendingBytes.length + head.length);
        joined.set(this.pendingBytes);
        joined.set(head, this.pendingBytes.length);
        this.pendingBytes = null;
        if (at < 0) {
          if (joined.length > MAX_LINE_CHARS) this.keepPending('x'.repeat(MAX_LINE_CHARS + 1));
          else this.pendingBytes = joined;
          return;
        }
        this.line++;
        const end = joined.length - 1;
        this.readDataBytes(joined, 0, end, decode);
        start = at + 1;
      }
      start = this.readLines(bytes, start, decode);
      if (this.error === null && start < bytes.length) {
        if (bytes.length - start > MAX_LINE_CHARS) this.keepPending('x'.repeat(MAX_LINE_CHARS + 1));
        else this.pendingBytes = new Uint8Array(bytes.subarray(start)); // a copy (a Buffer's slice is a view): the caller may reuse the chunk
      }
    } catch (cause) {
      this.fail({ message: `the capture reader stopped unexpectedly (${String(cause)})` });
    }
  }

  /**
   * Reads the whole lines of `bytes` from `start` on; returns where the unfinished last one
   * starts. The loop is a function of its own: optimised in the middle of a chunk, a function
   * that also held the chunk's tail (run once per chunk, after the loop) was thrown back to the
   * interpreter at that tail, chunk after chunk, and the next chunk's lines ran slow until it
   * was optimised again.
   */
  private readLines(bytes: Uint8Array, start: number, decode: (bytes: Uint8Array) => string): number {
    const length = bytes.length;
    const plainRows = this.layout!.metadataColumns === 0;
    while (this.error === null) {
      if (plainRows) {
        const next = this.readPlainRow(bytes, start, length);
        if (next >= 0) {
          start = next;
          continue;
        }
      }
      // a loop, not indexOf: the builtin's call costs more than the twenty-odd bytes of a row
      let at = start;
      while (at < length && bytes[at] !== 10) at++;
      if (at === length) break;
      this.line++;
      this.readDataBytes(bytes, start, at, decode);
      start = at + 1;
    }
    return start;
  }

  /**
   * The common row read in one pass, its line end found where its last cell ends: every column
   * read, each a plain number (as `plainNumber` takes it), the last one followed by LF or CRLF.
   * Finding the line end first and then reading the cells went over every byte twice.
   *
   * @returns where the next line starts; −1 when the row is anything else (another column after
   *   the last one read, a cell `plainNumber` gives up on, a row not taken, the chunk's end), for
   *   the line-by-line path to read it again from `start`, as if this had not been tried
   */
  protected readPlainRow(bytes: Uint8Array, start: number, length: number): number {
    const separator = this.separatorCode;
    const slots = this.slots;
    const lastColumn = this.lastColumn;
    const row = this.row;
    const exp10s = this.exp10s;
    const decimalComma = this.layout!.decimalComma;
    for (let c = 0; c < row.length; c++) row[c] = Number.NaN;
    let timeValue = Number.NaN;
    for (let column = 0, i = start; ; column++) {
      const slot = slots[column];
      if (slot === SLOT_NONE) return -1;
      const cellEnd = plainNumber(bytes, i, length, separator, decimalComma, slot === SLOT_TIME ? this.timeExp10 : exp10s[slot], true);
      if (cellEnd < 0 || cellEnd === length) return -1;
      if (slot === SLOT_TIME) timeValue = plainValue[0];
      else row[slot] = plainValue[0];
      const code = bytes[cellEnd];
      if (column < lastColumn) {
        if (code !== separator) return -1;
        i = cellEnd + 1;
        continue;
      }
      let next = cellEnd + 1;
      if (code === 13) {
        if (next === length || bytes[next] !== 10) return -1;
        next++;
      } else if (code !== 10) return -1;
      this.line++;
      const taken = this.takeRow(timeValue);
      if (taken === ROW_TAKEN || taken === ROW_FAILED) return next;
      this.line--;
      return -1;
    }
  }

  /**
   * `readDataLine` over the bytes of one line, `lineEnd` at its LF (a CR before it is dropped);
   * any line that is not plain data is decoded and read as text, CR included, so that the text
   * reader drops the same one CR it drops from every line.
   */
  private readDataBytes(bytes: Uint8Array, start: number, lineEnd: number, decode: (bytes: Uint8Array) => string): void {
    const end = lineEnd > start && bytes[lineEnd - 1] === 13 ? lineEnd - 1 : lineEnd;
    const layout = this.layout!;
    const separator = this.separatorCode;
    const slots = this.slots;
    const lastColumn = this.lastColumn;
    const row = this.row;
    const exp10s = this.exp10s;
    const decimalComma = layout.decimalComma;
    for (let c = 0; c < row.length; c++) row[c] = Number.NaN; // a loop: fill() is a call per line
    let timeValue = Number.NaN;
    let control = false;
    for (let column = 0, i = start; ; column++) {
      const slot = slots[column];
      let cellEnd = -1;
      let value = Number.NaN;
      if (slot !== SLOT_NONE) {
        cellEnd = plainNumber(bytes, i, end, separator, decimalComma, slot === SLOT_TIME ? this.timeExp10 : exp10s[slot], false);
        if (cellEnd >= 0) value = plainValue[0];
      }
      if (cellEnd < 0) {
        // not a plain number (or no number wanted): find the cell's end the slow way, watching for control bytes
        cellEnd = i;
        for (; cellEnd < end && bytes[cellEnd] !== separator; cellEnd++) if (bytes[cellEnd] < 32 && CONTROL_BYTE[bytes[cellEnd]]) control = true;
        if (slot !== SLOT_NONE) value = readNumberBytes(bytes, i, cellEnd, decimalComma, slot === SLOT_TIME ? this.timeExp10 : exp10s[slot]);
      }
      if (slot === SLOT_TIME) timeValue = value;
      else if (slot >= 0) row[slot] = value;
      if (column === lastColumn || cellEnd >= end) {
        for (let k = cellEnd + 1; k < end && !control; k++) if (bytes[k] < 32 && CONTROL_BYTE[bytes[k]]) control = true;
        break;
      }
      i = cellEnd + 1;
    }
    const plain = !control && (layout.metadataColumns === 0 || start === end || bytes[start] === separator);
    if (plain) {
      const taken = this.takeRow(timeValue);
      if (taken === ROW_TAKEN || taken === ROW_FAILED) return;
    }
    // the rare line: metadata cells, a footer, a bad row, a control character; the text reader has the words for it
    this.line--;
    const text = decode(bytes.subarray(start, lineEnd));
    const found = text.search(CONTROL);
    if (found >= 0) {
      this.line++;
      const code = text.charCodeAt(found).toString(16).padStart(2, '0');
      return this.fail({ message: `line ${this.line}: control character 0x${code}; this looks like a binary file, not a CSV capture`, line: this.line, expected: 'text' });
    }
    this.readLine(text, 0, text.length, false);
  }


  override finishColumns() {
    if (this.error === null && this.pendingBytes !== null) {
      this.pending = this.decodeBytes!(this.pendingBytes);
      this.pendingBytes = null;
    }
    return super.finishColumns();
  }
}

/**
 * Reads the data rows of a capture from a line after its header, given the layout the reader of
 * the header found (`continuableLayout`): only plain rows, the ones `readPlainRow` takes, each
 * later than the last. It stops before the first other line (a footer, a bad row, text, a time
 * that does not increase), leaving it to the reader that knows the file's line numbers and words.
 * With it a second thread reads the back half of a large file while the first reads the front.
 */
export class PlainRowReader extends ByteCaptureParser {
  constructor(layout: DataLayout, sink: RowSink) {
    super({}, () => sink);
    this.useLayout(layout);
  }

  /**
   * Reads the whole plain rows of `bytes` from `start`; returns where it stopped: at the first
   * row it does not take, or where an unfinished row begins at the end of `bytes`.
   */
  readRows(bytes: Uint8Array, start: number): number {
    const length = bytes.length;
    while (this.error === null) {
      const next = this.readPlainRow(bytes, start, length);
      // a row refused by takeRow (a time that does not increase) sets the error: stop before it
      if (next < 0 || this.error !== null) return start;
      start = next;
    }
    return start;
  }
}

/** Exact powers of ten (every one up to 1e22 is a double). */
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/**
 * The value the last `plainNumber` read. A double returned from a call that is not inlined is
 * a fresh heap number: twenty million of them for a 10M-row file, and a scavenge every few ms.
 */
const plainValue = new Float64Array(1);

/**
 * The common cell, read in the same pass that finds its end: an optional sign, digits with one
 * decimal mark, an optional exponent, and right after it the separator or the end of the line.
 * Converted exactly as `readNumber` converts it (at most 15 significant digits and a power of
 * ten up to 1e22: one correctly rounded multiply or divide). Anything else (blanks, quotes, long
 * mantissas, huge exponents) gives −1 and is left to `readNumberBytes`.
 *
 * @param lineEnds whether a CR or LF also ends the cell (the row read in one pass, `end` then being the chunk's end)
 * @returns where the cell ends (the separator, the line's end or a line break), its value in `plainValue`; −1 when it gave up
 */
function plainNumber(bytes: Uint8Array, i: number, end: number, separator: number, decimalComma: boolean, scaleExp10: number, lineEnds: boolean): number {
  const first = i < end ? bytes[i] : -1;
  const negative = first === 45;
  if (negative || first === 43) i++;
  // digits in tight loops of their own: this is the parser's innermost work
  let mantissa = 0;
  let digit = 0;
  const integerStart = i;
  while (i < end && (digit = bytes[i] - 48) >= 0 && digit <= 9) {
    mantissa = mantissa * 10 + digit;
    i++;
  }
  let digits = i - integerStart;
  let exp10 = 0;
  let code = i < end ? bytes[i] : -1;
  if (code === 46 || (decimalComma && code === 44)) {
    const fractionStart = ++i;
    while (i < end && (digit = bytes[i] - 48) >= 0 && digit <= 9) {
      mantissa = mantissa * 10 + digit;
      i++;
    }
    exp10 = fractionStart - i;
    digits += i - fractionStart;
    code = i < end ? bytes[i] : -1;
  }
  // more than 15 significant digits (leading zeros add nothing to the mantissa) is readNumber's case
  if (digits === 0 || mantissa >= 1e15) return -1;
  if (code === 101 || code === 69) {
    code = ++i < end ? bytes[i] : -1;
    const exponentNegative = code === 45;
    if (exponentNegative || code === 43) code = ++i < end ? bytes[i] : -1;
    let exponent = 0;
    let exponentDigits = 0;
    for (; i < end && code >= 48 && code <= 57; code = ++i < end ? bytes[i] : -1) {
      if (++exponentDigits > 4) return -1;
      exponent = exponent * 10 + (code - 48);
    }
    if (exponentDigits === 0) return -1;
    exp10 += exponentNegative ? -exponent : exponent;
  }
  if (i < end && code !== separator && !(lineEnds && (code === 10 || code === 13))) return -1;
  const totalExp10 = exp10 + scaleExp10;
  if (totalExp10 < -22 || totalExp10 > 22) return -1;
  const value = mantissa === 0 ? 0 : totalExp10 < 0 ? mantissa / POW10[-totalExp10] : mantissa * POW10[totalExp10];
  plainValue[0] = negative ? -value : value;
  return i;
}
