import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CaptureParser, parseCaptureText } from '../../shared/capture/parse';
import { readNumber } from '../../shared/capture/read-number';
import type { ParseResult } from '../../shared/capture/types';

const SAMPLE_FILE = [
  '\uFEFF# bench export',
  'Model,Example',
  'Sample Interval,1.000000E-09',
  'Index;Zeit (µs);Spannung (mV);Kanal 2 (mV)',
  ...Array.from({ length: 400 }, (_, k) => `${k};${(k * 0.001).toFixed(3).replace('.', ',')};${(Math.sin(k / 7) * 1000).toExponential(5).replace('.', ',')};0`),
  'Ende',
].join('\r\n');

/** Feeds `text` cut at the given positions and returns what the parser reports. */
function parseInPieces(text: string, cuts: number[]): ParseResult {
  const parser = new CaptureParser();
  let from = 0;
  for (const cut of [...cuts].sort((a, b) => a - b)) {
    parser.push(text.slice(from, cut));
    from = cut;
  }
  parser.push(text.slice(from));
  return parser.finish();
}

/** A result in plain data, so two results compare with toEqual. */
const plain = (result: ParseResult) =>
  result.ok
    ? { ...result, samples: { timesS: Array.from(result.samples.timesS), volts: Array.from(result.samples.volts) } }
    : result;

describe('CaptureParser: chunk boundaries', () => {
  const whole = parseCaptureText(SAMPLE_FILE);

  it('should read the sample file (a check that the property below is not vacuous)', () => {
    expect(whole.ok && whole.samples.timesS.length).toBe(400);
    expect(whole.ok && whole.time.unit).toBe('µs');
  });

  it('should give the same result however the text is cut into chunks', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: SAMPLE_FILE.length }), { maxLength: 60 }), (cuts) => {
        expect(plain(parseInPieces(SAMPLE_FILE, cuts))).toEqual(plain(whole));
      }),
      { numRuns: 200 },
    );
  });

  it('should give the same result fed one character at a time', () => {
    const cuts = Array.from({ length: SAMPLE_FILE.length }, (_, k) => k);
    expect(plain(parseInPieces(SAMPLE_FILE, cuts))).toEqual(plain(whole));
  });

  it('should report the same error line however the text is cut', () => {
    const broken = SAMPLE_FILE.replace('\r\n250;', '\r\n250;x');
    const expected = parseCaptureText(broken);
    expect(expected.ok).toBe(false);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: broken.length }), { maxLength: 30 }), (cuts) => {
        expect(plain(parseInPieces(broken, cuts))).toEqual(plain(expected));
      }),
      { numRuns: 100 },
    );
  });
});

describe('CaptureParser: never throws', () => {
  const isResult = (result: ParseResult) =>
    result.ok ? result.samples.timesS.length >= 2 : typeof result.error.message === 'string' && result.error.message.length > 0;

  it('should return a result for any string', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 400 }), (text) => {
        expect(isResult(parseCaptureText(text))).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it('should return a result for broken CSV built from CSV characters', () => {
    const csvChar = fc.constantFrom(...'0123456789.,;\t\r\n-+eE #"abcµ()_usmV '.split(''));
    fc.assert(
      fc.property(fc.array(csvChar, { maxLength: 300 }), fc.array(fc.nat(300), { maxLength: 8 }), (chars, cuts) => {
        const text = chars.join('');
        const result = parseInPieces(text, cuts.map((cut) => Math.min(cut, text.length)));
        expect(isResult(result)).toBe(true);
        expect(plain(result)).toEqual(plain(parseCaptureText(text)));
      }),
      { numRuns: 500 },
    );
  });

  it('should return a result for a valid file with characters deleted, doubled or swapped in', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.nat(SAMPLE_FILE.length - 1), fc.constantFrom('delete', 'double', ';', ',', 'x', '\n', '\u0000')), {
          maxLength: 10,
        }),
        (edits) => {
          let text = SAMPLE_FILE;
          for (const [at, edit] of edits) {
            const k = Math.min(at, text.length - 1);
            if (edit === 'delete') text = text.slice(0, k) + text.slice(k + 1);
            else if (edit === 'double') text = text.slice(0, k) + text[k] + text.slice(k);
            else text = text.slice(0, k) + edit + text.slice(k + 1);
          }
          expect(isResult(parseCaptureText(text))).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('should keep refusing pushes after it has failed, and never throw from push or finish', () => {
    const parser = new CaptureParser();
    parser.push('0,1\n1,abc\n');
    expect(parser.failed).toBe(true);
    parser.push('2,3\n');
    const result = parser.finish();
    expect(result.ok).toBe(false);
    expect(parser.finish()).toEqual(result);
  });
});

describe('readNumber', () => {
  // source: ECMA-262, StringToNumber — JavaScript's own correctly rounded decimal conversion
  it('should agree with Number() on the decimal forms of any double', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 0, max: 16 }), (value, digits) => {
        for (const text of [String(value), value.toExponential(digits), Math.abs(value) < 1e21 ? value.toFixed(digits) : '1']) {
          const reference = Number(text);
          // a value that rounds out of range ("2e+308") is refused rather than read as Infinity
          expect(readNumber(text, 0, text.length, false, 0)).toBe(Number.isFinite(reference) ? reference : Number.NaN);
        }
      }),
      { numRuns: 2000 },
    );
  });

  it('should agree with Number() on a value scaled by a unit, written as an exponent', () => {
    fc.assert(
      fc.property(fc.integer({ min: -99_999_999, max: 99_999_999 }), fc.integer({ min: 0, max: 8 }), fc.constantFrom(-12, -9, -6, -3, 0, 3), (mantissa, decimals, exp10) => {
        const text = (mantissa / 10 ** decimals).toFixed(decimals);
        expect(readNumber(text, 0, text.length, false, exp10)).toBe(Number(`${text}e${exp10}`));
      }),
      { numRuns: 1000 },
    );
  });

  it.each(['', ' ', '.', '-', '+', 'e5', '1e', '1e+', '0x10', '0b1', 'Infinity', 'NaN', '1.2.3', '1,5', '1 2', '--1', '1e400'])(
    'should refuse %j',
    (text) => {
      expect(readNumber(text, 0, text.length, false, 0)).toBeNaN();
    },
  );

  it('should read a decimal comma only when asked to', () => {
    expect(readNumber('1,5', 0, 3, true, 0)).toBe(1.5);
    expect(readNumber(' "-0,25" ', 0, 9, true, 0)).toBe(-0.25);
    expect(readNumber('1,5', 0, 3, false, 0)).toBeNaN();
    expect(readNumber('1,234.5', 0, 7, true, 0)).toBeNaN();
  });
});
