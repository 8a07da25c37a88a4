/** A capture as two parallel arrays: time in seconds (strictly increasing) and voltage in volts. */
export interface CaptureSamples {
  timesS: Float64Array;
  volts: Float64Array;
}

/** What went wrong reading a capture, phrased for the person who uploaded it. */
export interface CaptureParseError {
  message: string;
  /** 1-based line number in the file, when one line is to blame. */
  line?: number;
  /** What the parser was looking for at that place, e.g. "a number in column 2 (voltage)". */
  expected?: string;
}

/** The column a quantity was read from, as the parser understood it. */
export interface CaptureColumn {
  /** 0-based index among the cells of a row. */
  index: number;
  /** The header cell, when the file had a header. */
  name: string | null;
  /** The unit applied to the numbers ("us", "mV"…); the SI unit when the header named none. */
  unit: string;
}

export type CaptureSeparator = ',' | ';' | '\t';

export interface ParsedCapture {
  ok: true;
  samples: CaptureSamples;
  time: CaptureColumn;
  voltage: CaptureColumn;
  separator: CaptureSeparator;
  /** True when commas inside cells are read as decimal marks: with a `;` or tab separator. */
  decimalComma: boolean;
  /** Line of the header row, or null when the file has none. */
  headerLine: number | null;
  firstDataLine: number;
  /** Lines the parser looked at, including preamble, comments and blanks. */
  lineCount: number;
  /** Things the parser tolerated that a careful reader may want to know about. */
  notes: string[];
}

export type ParseResult = ParsedCapture | { ok: false; error: CaptureParseError };

export interface CaptureParseOptions {
  /** 0-based column of the time values; overrides the header. */
  timeColumnIndex?: number;
  /** 0-based column of the voltage values; overrides the header. */
  voltageColumnIndex?: number;
}
