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
  /** 0-based index among the cells of a row; -1 when the quantity was built, not read (time from an increment). */
  index: number;
  /** The header cell, when the file had a header. */
  name: string | null;
  /** The unit applied to the numbers ("us", "mV"…); the SI unit when nothing named one. */
  unit: string;
}

/** One signal column, as listed in the analysis response. */
export interface CaptureChannel {
  /** 1-based among the signal columns (what the `channel` form field takes). */
  index: number;
  /** The header cell, or "column N" without a header. */
  name: string;
  /** Unit the numbers were written in ("mV"); the values are always returned in volts. */
  unit: string;
  /** 0-based column in the file. */
  column: number;
}

/** The instrument settings a bench export records, in SI units, for the analysed channel. */
export interface CaptureMetadata {
  /** The ratio the channel was set to assume (10 for "10X"), not the probe that was on it. */
  attenuationSetting?: number;
  voltsPerDiv?: number;
  offsetV?: number;
  sampleRateHz?: number;
  coupling?: 'dc' | 'ac';
  bandwidthLimitHz?: number;
  inputResistanceOhm?: number;
  /** Every key–value pair of the preamble (and metadata columns), as written. */
  raw: Record<string, string>;
}

export type CaptureSeparator = ',' | ';' | '\t';

export interface ParsedCapture {
  ok: true;
  /** The chosen channel's samples. */
  samples: CaptureSamples;
  time: CaptureColumn;
  /** The chosen channel's column. */
  voltage: CaptureColumn;
  /** 1-based index of the chosen channel among `channels`. */
  channel: number;
  channels: CaptureChannel[];
  /** Every channel's samples in volts, in the order of `channels` (same time axis). */
  channelVolts: Float64Array[];
  metadata: CaptureMetadata;
  separator: CaptureSeparator;
  /** True when commas inside cells are read as decimal marks: with a `;` or tab separator. */
  decimalComma: boolean;
  /** Line of the header row, or null when the file has none. */
  headerLine: number | null;
  firstDataLine: number;
  /** Lines the parser looked at, including preamble, comments and blanks. */
  lineCount: number;
  /** Every assumption made while reading, in plain words. */
  notes: string[];
}

export type ParseResult = ParsedCapture | { ok: false; error: CaptureParseError };

export interface CaptureParseOptions {
  /** 0-based column of the time values; overrides the header. */
  timeColumnIndex?: number;
  /** 0-based column of the voltage values to analyse; overrides the header. */
  voltageColumnIndex?: number;
  /** The channel to analyse: 1-based among the signal columns, or a column's name. */
  channel?: number | string;
}
