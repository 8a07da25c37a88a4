import { unitName, unitWord, type DataLayout } from './data-layout';
import type { SettingsCollector } from './settings';
import type { CaptureChannel, CaptureColumn, CaptureParseError, CaptureParseOptions, ParsedCapture } from './types';

/** A parse whose samples went to a caller's sink: everything but the arrays, and the powers of ten still to apply to them. */
export type ParsedColumns = Omit<ParsedCapture, 'samples' | 'channelVolts'> & {
  rows: number;
  /** Power of ten the stored times are still to be scaled by (see `scaleValue`). */
  timeExp10: number;
  /** Per channel (in the order of `channels`), the power of ten its stored values are still to be scaled by. */
  channelExp10s: number[];
};

/** What `CaptureParser` knows at the end of a file, for `describeParse`. */
export interface ParseState {
  error: CaptureParseError | null;
  layout: DataLayout | null;
  noDataError: () => CaptureParseError;
  rows: number;
  firstDataLine: number;
  settings: SettingsCollector;
  footer: { error: CaptureParseError; count: number } | null;
  notes: string[];
  headerLine: number | null;
  line: number;
  options: CaptureParseOptions;
}

/** The parse's outcome: the channels, units, settings and notes, or the error that stopped it. */
export function describeParse(state: ParseState): ParsedColumns | { ok: false; error: CaptureParseError } {
  if (state.error !== null) return { ok: false, error: state.error };
  const layout = state.layout;
  if (layout === null) return { ok: false, error: state.noDataError() };
  if (state.rows < 2) {
    return {
      ok: false,
      error: {
        message: `only one sample (line ${state.firstDataLine}); a capture needs at least 2`,
        line: state.firstDataLine,
        expected: 'at least 2 samples',
      },
    };
  }
  const notes = [...layout.notes];
  if (layout.decimalComma) notes.push(`Read with '${layout.separator === '\t' ? 'tab' : layout.separator}' between columns and a comma as the decimal mark.`);
  let timeExp10 = 0;
  let timeUnit = layout.time.kind === 'column' ? layout.time.column.unit : 's';
  if (layout.time.kind === 'column' && layout.time.column.name !== null && notes.some((n) => n.includes('read as seconds'))) {
    const exp10 = state.settings.number('horizontalUnit');
    if (exp10 !== undefined && exp10 !== 0) {
      timeExp10 = exp10;
      timeUnit = `1e${exp10} s`;
      notes.push(`…then rescaled: the metadata's '${state.settings.get('horizontalUnit')!.key}' says '${state.settings.get('horizontalUnit')!.text}'.`);
    }
  }
  const channels: CaptureChannel[] = [];
  const channelExp10s: number[] = [];
  layout.channels.forEach((channel, slot) => {
    let unit = channel.unit;
    if (channel.unitSource === 'default') {
      const exp10 = state.settings.number('verticalUnit', channel.number);
      if (exp10 !== undefined) {
        channelExp10s[slot] = exp10;
        unit = unitName(exp10);
        const applied = state.settings.get('verticalUnit', channel.number)!;
        notes.push(`'${channel.name}' read as ${unitWord(exp10)} from the file's '${applied.key}' = '${applied.text}'.`);
      } else notes.push(`'${channel.name}' read as volts: neither the header nor the preamble names a unit.`);
    }
    channels.push({ index: slot + 1, name: channel.name, unit, column: channel.column });
    channelExp10s[slot] ??= 0;
  });
  const chosen = chooseChannel(channels, state.options);
  if ('error' in chosen) return { ok: false, error: chosen.error };
  const picked = channels[chosen.index - 1];
  if (channels.length > 1 || chosen.asked) {
    notes.push(
      `Analysed channel ${picked.index} ('${picked.name}', column ${picked.column + 1}) of ${channels.length}${chosen.asked ? ', as chosen' : ': the first signal column; choose another with the channel field'}.`,
    );
  }
  if (state.footer !== null) {
    notes.push(`Ignored ${state.footer.count} line(s) after the last sample, from line ${state.footer.error.line}.`);
  }
  notes.push(...state.notes);
  const metadata = state.settings.metadataFor(layout.channels[chosen.index - 1].number, notes);
  const time: CaptureColumn = layout.time.kind === 'rows' ? { index: -1, name: null, unit: 's' } : { ...layout.time.column, unit: layout.time.kind === 'index' ? 'sample' : timeUnit };
  return {
    ok: true,
    rows: state.rows,
    timeExp10,
    channelExp10s,
    time,
    voltage: { index: picked.column, name: layout.channels[chosen.index - 1].name.startsWith('column ') && state.headerLine === null ? null : picked.name, unit: picked.unit },
    channel: picked.index,
    channels,
    metadata,
    separator: layout.separator,
    decimalComma: layout.decimalComma,
    headerLine: state.headerLine,
    firstDataLine: state.firstDataLine,
    lineCount: state.line,
    notes,
  };
}

export function chooseChannel(channels: CaptureChannel[], options: CaptureParseOptions): { index: number; asked: boolean } | { error: CaptureParseError } {
  const list = channels.map((c) => `${c.index} '${c.name}'`).join(', ');
  const { channel, voltageColumnIndex } = options;
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
export function scaleInPlace(values: Float64Array, exp10: number): void {
  for (let i = 0; i < values.length; i++) values[i] = scaleValue(values[i], exp10);
}

/** A stored value in its column's unit times 10^exp10, rounded the one way every reader of a capture uses. */
export function scaleValue(value: number, exp10: number): number {
  const factor = 10 ** Math.abs(exp10);
  return exp10 < 0 ? value / factor : value * factor;
}
