import { readHeaderCell } from './header-units';
import type { SettingsCollector } from './settings';
import type { CaptureColumn, CaptureParseError, CaptureParseOptions, CaptureSeparator } from './types';

// More signal columns than this are not plotted or analysed; the reader says so.
export const MAX_CHANNELS = 16;

/** How time is obtained for each row. */
export type TimeSource =
  | { kind: 'column'; column: CaptureColumn; exp10: number }
  | { kind: 'index'; column: CaptureColumn; startS: number; intervalS: number }
  | { kind: 'rows'; startS: number; intervalS: number };

export interface ChannelLayout {
  column: number;
  name: string;
  unit: string;
  exp10: number;
  /** Where the unit came from; 'default' units may still be corrected by metadata read later. */
  unitSource: 'header' | 'preamble' | 'default';
  /** The channel number a name like "CH2" carries, for per-channel settings. */
  number: number | null;
}

/** Where the quantities sit in a data row and how to scale them to SI. */
export interface DataLayout {
  separator: CaptureSeparator;
  /** Commas in cells are decimal marks whenever they cannot be separators. */
  decimalComma: boolean;
  time: TimeSource;
  channels: ChannelLayout[];
  /** Columns before the data that hold label, value, unit metadata (0 when none). */
  metadataColumns: number;
  notes: string[];
}

const CHANNEL_NUMBER = /(?:^|[^a-z])(?:ch|channel|chan|c|trace)\s*[-_]?\s*(\d{1,2})(?!\d)/iu;

/**
 * Decides, on the first data row, which column is time (or a sample counter, or none) and which
 * are signals. `dataColumns` are the columns that hold numbers in that row (a trailing run:
 * metadata columns may precede them). The caller's column indices win, then the header's words
 * and units, then the preamble's increment; failing all of them the reader says what it saw.
 */
export function chooseLayout(
  separator: CaptureSeparator,
  decimalComma: boolean,
  header: string[] | null,
  dataColumns: number[],
  firstRow: number[],
  settings: SettingsCollector,
  options: CaptureParseOptions,
  lineNumber: number,
): DataLayout | { error: CaptureParseError } {
  const notes: string[] = [];
  const described = dataColumns.map((column) => readHeaderCell(header?.[column] ?? ''));
  const nameOf = (column: number) => (header?.[column] ? header[column] : `column ${column + 1}`);
  const columnsSaw = `line ${lineNumber} has numbers in column${dataColumns.length > 1 ? 's' : ''} ${dataColumns.map((c) => c + 1).join(', ')}`;
  const intervalS = settings.number('interval') ?? (settings.number('sampleRate') ? 1 / settings.number('sampleRate')! : undefined);
  const intervalFrom = settings.get('interval') ?? settings.get('sampleRate');
  const startS = settings.number('start') ?? 0;
  const horizontalExp10 = settings.number('horizontalUnit');

  let timeAt = -1; // position in dataColumns
  let role: 'time' | 'index' | 'rows' = 'time';
  if (options.timeColumnIndex !== undefined) {
    timeAt = dataColumns.indexOf(options.timeColumnIndex);
    if (timeAt < 0) {
      return { error: { message: `column ${options.timeColumnIndex + 1} was chosen as time, but ${columnsSaw}`, line: lineNumber, expected: `a number in column ${options.timeColumnIndex + 1} (time)` } };
    }
    role = 'time';
  } else {
    const byTime = described.findIndex((cell, at) => cell.role === 'time' && dataColumns[at] !== options.voltageColumnIndex);
    const byIndex = described.findIndex((cell) => cell.role === 'index');
    if (byTime >= 0) timeAt = byTime;
    else if (byIndex >= 0) {
      timeAt = byIndex;
      role = 'index';
    } else if (header !== null && described.every((cell) => cell.role === 'voltage')) {
      role = 'rows';
    } else if (dataColumns.length === 1) role = 'rows';
    else if (header === null && intervalS !== undefined && Number.isInteger(firstRow[0]) && (firstRow[0] === 0 || firstRow[0] === 1)) {
      timeAt = 0;
      role = 'index';
      notes.push(`No header: column ${dataColumns[0] + 1} counts from ${firstRow[0]} in whole numbers, so it was read as a sample index, not as time.`);
    } else {
      timeAt = described.findIndex((cell, at) => cell.role !== 'voltage' && dataColumns[at] !== options.voltageColumnIndex);
      if (timeAt < 0) timeAt = 0;
      if (header === null) notes.push(`No header: column ${dataColumns[timeAt] + 1} was read as time and the other numeric column(s) as voltage.`);
      else if (described[timeAt].role === null) notes.push(`Column ${dataColumns[timeAt] + 1} ('${nameOf(dataColumns[timeAt])}') was read as time: its header does not name a quantity and it is the first column that is not a signal.`);
    }
  }

  let time: TimeSource;
  if (role === 'time') {
    const column = dataColumns[timeAt];
    const cell = described[timeAt];
    let exp10 = cell.unitExp10;
    let unit = cell.unit ?? 's';
    if (cell.unit !== null) notes.push(`Time read from column ${column + 1} ('${nameOf(column)}') in ${cell.unit}, as its header says.`);
    else if (horizontalExp10 !== undefined) {
      exp10 = horizontalExp10;
      unit = `1e${exp10} s`;
      notes.push(`Time read from column ${column + 1} in units of 1e${exp10} s, from the preamble's '${settings.get('horizontalUnit')!.key}' = '${settings.get('horizontalUnit')!.text}'.`);
    } else notes.push(`Time in column ${column + 1} read as seconds: neither the header nor the preamble names a unit.`);
    time = { kind: 'column', column: { index: column, name: header?.[column] || null, unit }, exp10 };
  } else {
    if (intervalS === undefined || !(intervalS > 0)) {
      const what = role === 'index' ? `column ${dataColumns[timeAt] + 1} ('${nameOf(dataColumns[timeAt])}') counts samples` : `no column holds time (${columnsSaw}${header ? `, headed ${dataColumns.map((c) => `'${nameOf(c)}'`).join(', ')}` : ''})`;
      return {
        error: {
          message: `${what}, but the file gives no sample interval; expected a time column, or 'Increment', 'Sample Interval' or 'Sample Rate' in the preamble or header`,
          line: lineNumber,
          expected: 'a time column or a sample interval',
        },
      };
    }
    const how = `from '${intervalFrom!.key}' = '${intervalFrom!.text}'${settings.get('start') ? ` and '${settings.get('start')!.key}' = '${settings.get('start')!.text}'` : ' and a start of 0 s (the file gives none)'}`;
    if (role === 'index') {
      const column = dataColumns[timeAt];
      notes.push(`Column ${column + 1} ('${nameOf(column)}') is a sample index: time = start + index × increment, ${how}.`);
      time = { kind: 'index', column: { index: column, name: header?.[column] || null, unit: 'sample' }, startS, intervalS };
    } else {
      notes.push(`No time column: time = start + row × increment, ${how}.`);
      time = { kind: 'rows', startS, intervalS };
    }
  }

  const channels: ChannelLayout[] = [];
  dataColumns.forEach((column, at) => {
    const cell = described[at];
    if (at === timeAt || (cell.role === 'index' && column !== options.voltageColumnIndex)) return;
    const name = header?.[column] ? header[column] : `column ${column + 1}`;
    const numberMatch = CHANNEL_NUMBER.exec(name);
    const number = numberMatch ? Number(numberMatch[1]) : null;
    const channelExp10 = settings.number('verticalUnit', number);
    if (cell.unit !== null) {
      channels.push({ column, name, unit: cell.unit, exp10: cell.unitExp10, unitSource: 'header', number });
    } else if (channelExp10 !== undefined) {
      const exp10 = channelExp10;
      const applied = settings.get('verticalUnit', number)!;
      channels.push({ column, name, unit: unitName(exp10), exp10, unitSource: 'preamble', number });
      notes.push(`'${name}' read as ${unitWord(exp10)} from the preamble's '${applied.key}' = '${applied.text}'.`);
    } else channels.push({ column, name, unit: 'V', exp10: 0, unitSource: 'default', number });
  });
  if (channels.length > MAX_CHANNELS) {
    notes.push(`Only the first ${MAX_CHANNELS} of ${channels.length} signal columns were read.`);
    channels.length = MAX_CHANNELS;
  }
  if (channels.length === 0) {
    return { error: { message: `${columnsSaw}, all taken as time; expected at least one signal column beside it`, line: lineNumber, expected: 'a voltage column' } };
  }
  const metadataColumns = dataColumns[0];
  if (metadataColumns > 0) {
    notes.push(`Columns 1–${metadataColumns} hold metadata beside the data (read as label, value, unit); the data were read from column${dataColumns.length > 1 ? 's' : ''} ${dataColumns.map((c) => c + 1).join(', ')}.`);
  }
  return { separator, decimalComma, time, channels, metadataColumns, notes };
}

export function unitName(exp10: number): string {
  return { 0: 'V', [-3]: 'mV', [-6]: 'µV', 3: 'kV' }[exp10] ?? `1e${exp10} V`;
}

export function unitWord(exp10: number): string {
  return { 0: 'volts', [-3]: 'millivolts', [-6]: 'microvolts', 3: 'kilovolts' }[exp10] ?? `units of 1e${exp10} V`;
}

/** A problem with the caller's column choice, or null when there is none. */
export function checkColumnOptions(options: CaptureParseOptions): string | null {
  for (const name of ['timeColumnIndex', 'voltageColumnIndex'] as const) {
    const value: unknown = options[name];
    if (value !== undefined && (typeof value !== 'number' || !Number.isInteger(value) || value < 0)) {
      return `${name} must be a whole number from 0 up, got ${String(value)}`;
    }
  }
  if (options.timeColumnIndex !== undefined && options.timeColumnIndex === options.voltageColumnIndex) {
    return 'time and voltage cannot be read from the same column';
  }
  const channel: unknown = options.channel;
  if (channel !== undefined && !(typeof channel === 'string' && channel.trim() !== '') && !(typeof channel === 'number' && Number.isInteger(channel) && channel >= 1)) {
    return `channel must be a whole number from 1 up or a column's name, got ${String(channel)}`;
  }
  return null;
}
