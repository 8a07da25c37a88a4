/** Exact powers of ten: every one up to 1e22 is representable in a double. */
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));
const MAX_EXACT_DIGITS = 15;

const DIGIT_0 = 48;
const DIGIT_9 = 57;
const PLUS = 43;
const MINUS = 45;
const DOT = 46;
const COMMA = 44;
const QUOTE = 34;
const LOWER_E = 101;
const UPPER_E = 69;

function isBlank(code: number): boolean {
  return code === 32 || code === 9;
}

/**
 * Reads one cell `text[start, end)` as a plain decimal number times 10^`scaleExp10` (the unit of
 * its column: -6 for µs, -3 for mV). Accepts "1.5", "-.5", "+3", "1e-9", "4.7E+03", surrounding
 * blanks and one pair of double quotes; when `decimalComma` is set, "1,5" as well. Refuses
 * everything else (hex, "Infinity", "NaN", empty cells, thousands separators) by returning NaN.
 *
 * Why not `Number(slice)`: a capture has millions of cells and slicing each one allocates.
 * Short mantissas are converted the exact way (Clinger's fast path: an integer of at most 15
 * digits and a power of ten up to 1e22 are both exact doubles, so one multiply or divide is
 * correctly rounded); longer ones fall back to `Number`, which rounds correctly too.
 */
export function readNumber(
  text: string,
  start: number,
  end: number,
  decimalComma: boolean,
  scaleExp10: number,
): number {
  while (start < end && isBlank(text.charCodeAt(start))) start++;
  while (end > start && isBlank(text.charCodeAt(end - 1))) end--;
  if (end - start >= 2 && text.charCodeAt(start) === QUOTE && text.charCodeAt(end - 1) === QUOTE) {
    start++;
    end--;
    while (start < end && isBlank(text.charCodeAt(start))) start++;
    while (end > start && isBlank(text.charCodeAt(end - 1))) end--;
  }
  let i = start;
  let negative = false;
  let code = text.charCodeAt(i);
  if (code === PLUS || code === MINUS) {
    negative = code === MINUS;
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let exp10 = 0;
  let sawDigit = false;
  let sawMark = false;
  for (; i < end; i++) {
    code = text.charCodeAt(i);
    if (code >= DIGIT_0 && code <= DIGIT_9) {
      sawDigit = true;
      const digit = code - DIGIT_0;
      if (mantissa !== 0 || digit !== 0) {
        if (digits < MAX_EXACT_DIGITS + 1) mantissa = mantissa * 10 + digit;
        else exp10++;
        digits++;
      }
      if (sawMark) exp10--;
    } else if (!sawMark && (code === DOT || (decimalComma && code === COMMA))) {
      sawMark = true;
    } else break;
  }
  if (!sawDigit) return Number.NaN;
  if (i < end && (code === LOWER_E || code === UPPER_E)) {
    i++;
    let exponentNegative = false;
    code = text.charCodeAt(i);
    if (code === PLUS || code === MINUS) {
      exponentNegative = code === MINUS;
      i++;
    }
    let exponent = 0;
    let exponentDigits = 0;
    for (; i < end; i++) {
      code = text.charCodeAt(i);
      if (code < DIGIT_0 || code > DIGIT_9) break;
      if (exponent < 100_000) exponent = exponent * 10 + (code - DIGIT_0);
      exponentDigits++;
    }
    if (exponentDigits === 0) return Number.NaN;
    exp10 += exponentNegative ? -exponent : exponent;
  }
  if (i !== end) return Number.NaN;

  const totalExp10 = exp10 + scaleExp10;
  let value: number;
  if (mantissa === 0) value = 0;
  else if (digits <= MAX_EXACT_DIGITS && totalExp10 >= -22 && totalExp10 <= 22) {
    value = totalExp10 < 0 ? mantissa / POW10[-totalExp10] : mantissa * POW10[totalExp10];
  } else {
    let cell = text.slice(start, end);
    if (decimalComma) cell = cell.replace(',', '.');
    value = Math.abs(Number(cell));
    if (scaleExp10 < 0) value /= POW10[-scaleExp10];
    else if (scaleExp10 > 0) value *= POW10[scaleExp10];
  }
  if (!Number.isFinite(value)) return Number.NaN;
  return negative ? -value : value;
}

/** `readNumber` over bytes of ASCII-compatible text (UTF-8, Latin-1): the server's hot path, without decoding the file to a string. */
export function readNumberBytes(
  text: Uint8Array,
  start: number,
  end: number,
  decimalComma: boolean,
  scaleExp10: number,
): number {
  while (start < end && isBlank(text[start])) start++;
  while (end > start && isBlank(text[end - 1])) end--;
  if (end - start >= 2 && text[start] === QUOTE && text[end - 1] === QUOTE) {
    start++;
    end--;
    while (start < end && isBlank(text[start])) start++;
    while (end > start && isBlank(text[end - 1])) end--;
  }
  let i = start;
  let negative = false;
  let code = text[i];
  if (code === PLUS || code === MINUS) {
    negative = code === MINUS;
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let exp10 = 0;
  let sawDigit = false;
  let sawMark = false;
  for (; i < end; i++) {
    code = text[i];
    if (code >= DIGIT_0 && code <= DIGIT_9) {
      sawDigit = true;
      const digit = code - DIGIT_0;
      if (mantissa !== 0 || digit !== 0) {
        if (digits < MAX_EXACT_DIGITS + 1) mantissa = mantissa * 10 + digit;
        else exp10++;
        digits++;
      }
      if (sawMark) exp10--;
    } else if (!sawMark && (code === DOT || (decimalComma && code === COMMA))) {
      sawMark = true;
    } else break;
  }
  if (!sawDigit) return Number.NaN;
  if (i < end && (code === LOWER_E || code === UPPER_E)) {
    i++;
    let exponentNegative = false;
    code = text[i];
    if (code === PLUS || code === MINUS) {
      exponentNegative = code === MINUS;
      i++;
    }
    let exponent = 0;
    let exponentDigits = 0;
    for (; i < end; i++) {
      code = text[i];
      if (code < DIGIT_0 || code > DIGIT_9) break;
      if (exponent < 100_000) exponent = exponent * 10 + (code - DIGIT_0);
      exponentDigits++;
    }
    if (exponentDigits === 0) return Number.NaN;
    exp10 += exponentNegative ? -exponent : exponent;
  }
  if (i !== end) return Number.NaN;

  const totalExp10 = exp10 + scaleExp10;
  let value: number;
  if (mantissa === 0) value = 0;
  else if (digits <= MAX_EXACT_DIGITS && totalExp10 >= -22 && totalExp10 <= 22) {
    value = totalExp10 < 0 ? mantissa / POW10[-totalExp10] : mantissa * POW10[totalExp10];
  } else {
    let cell = latin1Slice(text, start, end);
    if (decimalComma) cell = cell.replace(',', '.');
    value = Math.abs(Number(cell));
    if (scaleExp10 < 0) value /= POW10[-scaleExp10];
    else if (scaleExp10 > 0) value *= POW10[scaleExp10];
  }
  if (!Number.isFinite(value)) return Number.NaN;
  return negative ? -value : value;
}

function latin1Slice(bytes: Uint8Array, start: number, end: number): string {
  let text = '';
  for (let i = start; i < end; i++) text += String.fromCharCode(bytes[i]);
  return text;
}
