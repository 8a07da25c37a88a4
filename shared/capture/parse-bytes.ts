import { CaptureParser, MAX_LINE_CHARS, ROW_FAILED, ROW_TAKEN, SLOT_TIME } from './parse';
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
      if (this.pendingBytes !== null) {
        const joined = new Uint8Array(this.pendingBytes.length + bytes.length);
        joined.set(this.pendingBytes);
        joined.set(bytes, this.pendingBytes.length);
        bytes = joined;
        this.pendingBytes = null;
      }
      let start = 0;
      while (this.error === null) {
        const at = bytes.indexOf(10, start);
        if (at < 0) break;
        this.line++;
        this.readDataBytes(bytes, start, at > start && bytes[at - 1] === 13 ? at - 1 : at, decode);
        start = at + 1;
      }
      if (this.error === null && start < bytes.length) {
        if (bytes.length - start > MAX_LINE_CHARS) this.keepPending('x'.repeat(MAX_LINE_CHARS + 1));
        else this.pendingBytes = bytes.slice(start);
      }
    } catch (cause) {
      this.fail({ message: `the capture reader stopped unexpectedly (${String(cause)})` });
    }
  }

  /** `readDataLine` over the bytes of one line; any line that is not plain data is decoded and read as text. */
  private readDataBytes(bytes: Uint8Array, start: number, end: number, decode: (bytes: Uint8Array) => string): void {
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
    let control = false;
    for (let i = start; ; i++) {
      const code = i === end ? -1 : bytes[i];
      if (code < 32 && code >= 0 && code !== separator && CONTROL_BYTE[code]) control = true;
      if (code === -1 || code === separator) {
        const slot = slots[column];
        if (slot === SLOT_TIME) timeValue = readNumberBytes(bytes, cellStart, i, decimalComma, this.timeExp10);
        else if (slot >= 0) row[slot] = readNumberBytes(bytes, cellStart, i, decimalComma, exp10s[slot]);
        if (column === lastColumn || code === -1) {
          for (let k = i + 1; k < end && !control; k++) if (bytes[k] < 32 && CONTROL_BYTE[bytes[k]]) control = true;
          break;
        }
        column++;
        cellStart = i + 1;
      }
    }
    const plain = !control && (layout.metadataColumns === 0 || start === end || bytes[start] === separator);
    if (plain) {
      const taken = this.takeRow(timeValue);
      if (taken === ROW_TAKEN || taken === ROW_FAILED) return;
    }
    // the rare line: metadata cells, a footer, a bad row, a control character; the text reader has the words for it
    this.line--;
    const text = decode(bytes.subarray(start, end));
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
