import { readHeaderCell } from './header-units';
import type { CaptureColumn, CaptureParseOptions, CaptureSeparator } from './types';

/** Where the two quantities sit in a data row and how to scale them to SI. */
export interface DataLayout {
  separator: CaptureSeparator;
  /** Commas in cells are decimal marks whenever they cannot be separators. */
  decimalComma: boolean;
  time: CaptureColumn;
  voltage: CaptureColumn;
  timeExp10: number;
  voltageExp10: number;
}

/**
 * Picks the time and voltage columns: the caller's indices first, else the first header cell
 * that reads as time and the first that reads as voltage, else the first two columns. A column
 * the header does not give a unit for is taken to be in seconds or volts.
 */
export function chooseLayout(
  separator: CaptureSeparator,
  headerCells: string[] | null,
  options: CaptureParseOptions,
): DataLayout {
  const described = (headerCells ?? []).map(readHeaderCell);
  let timeIndex = options.timeColumnIndex;
  let voltageIndex = options.voltageColumnIndex;
  if (timeIndex === undefined) {
    const found = described.findIndex((cell, index) => cell.role === 'time' && index !== voltageIndex);
    if (found >= 0) timeIndex = found;
  }
  if (voltageIndex === undefined) {
    const found = described.findIndex((cell, index) => cell.role === 'voltage' && index !== timeIndex);
    if (found >= 0) voltageIndex = found;
  }
  if (timeIndex === undefined) timeIndex = voltageIndex === 0 ? 1 : 0;
  if (voltageIndex === undefined) {
    voltageIndex = 0;
    while (voltageIndex === timeIndex || described[voltageIndex]?.role === 'time') voltageIndex++;
  }
  const column = (index: number, siUnit: string): CaptureColumn => ({
    index,
    name: headerCells?.[index] || null,
    unit: described[index]?.unit ?? siUnit,
  });
  return {
    separator,
    decimalComma: separator !== ',',
    time: column(timeIndex, 's'),
    voltage: column(voltageIndex, 'V'),
    timeExp10: described[timeIndex]?.unitExp10 ?? 0,
    voltageExp10: described[voltageIndex]?.unitExp10 ?? 0,
  };
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
  return null;
}
