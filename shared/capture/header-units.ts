/** 'index' is a sample counter: time comes from a start and an increment given elsewhere. */
export type ColumnRole = 'time' | 'voltage' | 'index';

/** How a header cell reads: which quantity it names and the unit its numbers are in. */
export interface HeaderCell {
  role: ColumnRole | null;
  /** The unit as written ("us", "mV"), or null when the header names none we know. */
  unit: string | null;
  /** Power of ten that turns a number in that unit into SI (µs → -6). */
  unitExp10: number;
}

interface UnitSpelling {
  role: 'time' | 'voltage';
  exp10: number;
  symbol: string;
}

// Matched after lower-casing: "MV" in a header is a shouted millivolt far more often than a megavolt.
const UNITS: Record<string, UnitSpelling> = Object.create(null);
function unit(role: 'time' | 'voltage', exp10: number, symbol: string, spellings: string[]) {
  for (const spelling of spellings) UNITS[spelling] = { role, exp10, symbol };
}
unit('time', 0, 's', ['s', 'sec', 'secs', 'second', 'seconds']);
unit('time', -3, 'ms', ['ms', 'msec', 'millisecond', 'milliseconds']);
unit('time', -6, 'µs', ['us', 'µs', 'μs', 'usec', 'microsecond', 'microseconds']);
unit('time', -9, 'ns', ['ns', 'nsec', 'nanosecond', 'nanoseconds']);
unit('time', -12, 'ps', ['ps', 'picosecond', 'picoseconds']);
unit('voltage', 0, 'V', ['v', 'volt', 'volts']);
unit('voltage', -3, 'mV', ['mv', 'millivolt', 'millivolts']);
unit('voltage', -6, 'µV', ['uv', 'µv', 'μv', 'microvolt', 'microvolts']);
unit('voltage', 3, 'kV', ['kv', 'kilovolt', 'kilovolts']);

// Words scope and spreadsheet exports use for the two columns, in the languages that also
// write semicolon-separated files.
const TIME_WORDS = new Set(['time', 't', 'x', 'zeit', 'temps', 'tiempo', 'tempo', 'tid', 'czas']);
const VOLTAGE_WORDS = new Set([
  'voltage', 'volt', 'volts', 'v', 'u', 'y', 'signal', 'ampl', 'amplitude', 'value', 'level',
  'ch', 'channel', 'chan', 'trace', 'math', 'spannung', 'tension', 'tensión', 'tensione', 'napięcie',
]);
const INDEX_WORDS = new Set(['index', 'idx', 'sequence', 'seq', 'sample', 'samples', 'point', 'points', 'pt', 'no', 'nr', 'n', 'num', 'number', 'count']);
const VOLTAGE_TOKEN = /^(?:ch|channel|chan|c|trace|v)\d+$|^v(?:out|in|o|i|sig)$/u;

const BRACKETED = /[([{]\s*([^)\]}]*?)\s*[)\]}]/u;
const SUFFIX = /[_/\s-]([a-zµμ]+)$/u;

/**
 * Reads a header cell such as "Time (us)", "CH1 [mV]", "time_s", "voltage_v", "t / ns" or
 * "Spannung in mV": the unit in brackets, after `_`, `/`, `-` or a blank at the end, or the
 * whole cell ("ms"); the quantity from the unit, else from the words around it.
 */
export function readHeaderCell(cell: string): HeaderCell {
  const lower = cell.trim().replace(/^"|"$/gu, '').trim().toLowerCase();
  let unitText: string | null = null;
  let words = lower;
  const bracketed = BRACKETED.exec(lower);
  if (bracketed && bracketed[1] in UNITS) {
    unitText = bracketed[1];
    words = lower.replace(bracketed[0], ' ');
  } else if (bracketed) {
    words = lower.replace(bracketed[0], ` ${bracketed[1]} `);
  } else {
    const suffix = SUFFIX.exec(lower);
    if (suffix && suffix[1] in UNITS) {
      unitText = suffix[1];
      words = lower.slice(0, suffix.index);
    } else if (lower in UNITS) {
      unitText = lower;
      words = '';
    }
  }
  const spelled = unitText === null ? undefined : UNITS[unitText];
  const role = spelled?.role ?? roleFromWords(words);
  return { role, unit: spelled ? spelled.symbol : null, unitExp10: spelled ? spelled.exp10 : 0 };
}

/** True when a cell holds nothing but a unit, as in a units row under the header ("(ms)", "[mV]", "V"). */
export function isUnitOnly(cell: string): boolean {
  const bare = cell.trim().replace(/^"|"$/gu, '').replace(/^[([{]\s*|\s*[)\]}]$/gu, '').trim().toLowerCase();
  return bare in UNITS || INDEX_WORDS.has(bare);
}

function roleFromWords(words: string): ColumnRole | null {
  const tokens = words.split(/[^\p{L}\p{N}#]+/u).filter((token) => token !== '');
  if (tokens.some((token) => token !== 'x' && TIME_WORDS.has(token))) return 'time';
  if (tokens.some((token) => INDEX_WORDS.has(token) || token === '#')) return 'index';
  if (tokens.includes('x')) return 'time';
  if (tokens.some((token) => VOLTAGE_WORDS.has(token) || VOLTAGE_TOKEN.test(token))) return 'voltage';
  return null;
}
