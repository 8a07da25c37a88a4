import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readCaptureStream } from '../../server/captures/read-capture-stream';

/** How bench software writes a double: fixed decimals, exponent forms, shortest round trip, padded. */
const written = fc.tuple(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), fc.integer({ min: 0, max: 9 }), fc.integer({ min: 0, max: 6 })).map(([value, digits, form]) => {
  switch (form) {
    case 0:
      return value.toFixed(digits);
    case 1:
      return value.toExponential(digits);
    case 2:
      return value.toExponential(digits).toUpperCase();
    case 3:
      return value.toPrecision(digits + 1);
    case 4:
      return String(value);
    case 5:
      return `+${Math.abs(value).toFixed(digits)}`;
    default:
      return `00${Math.abs(value).toFixed(digits + 8)}`; // leading zeros and more than 15 digits
  }
});

/**
 * The header line first: the byte reader takes over once the data rows start, so the rows after
 * the first chunk are read from bytes. The rest in chunks of 7 bytes, so lines are also cut.
 */
function readBytes(text: string) {
  const bytes = Buffer.from(text, 'utf8');
  const headerEnd = bytes.indexOf(10) + 1;
  const chunks = [bytes.subarray(0, headerEnd)];
  for (let at = headerEnd; at < bytes.length; at += 7) chunks.push(bytes.subarray(at, at + 7));
  return readCaptureStream(Readable.from(chunks));
}

describe('capture rows read straight from the bytes', () => {
  // source: ECMA-262, StringToNumber: JavaScript's own correctly rounded decimal conversion
  it('should give each cell the double Number() gives its text', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(written, { minLength: 2, maxLength: 60 }), async (cells) => {
        const text = ['Time (s),CH1 (V)', ...cells.map((cell, k) => `${k}e-9,${cell}`)].join('\n') + '\n';
        const result = await readBytes(text);
        expect(result.ok).toBe(true);
        if (!result.ok) return;
        expect(Array.from(result.samples.volts)).toEqual(cells.map((cell) => Number(cell)));
        expect(Array.from(result.samples.timesS)).toEqual(cells.map((_, k) => Number(`${k}e-9`)));
      }),
      { numRuns: 300 },
    );
  });

  it('should read a decimal comma when the file uses one', async () => {
    const result = await readBytes('Zeit (s);Spannung (V)\n0,000;-0,25\n1,5e-3;3,300\n2,000E-3;+1,0\n');
    expect(result.ok && Array.from(result.samples.volts)).toEqual([-0.25, 3.3, 1]);
    expect(result.ok && Array.from(result.samples.timesS)).toEqual([0, 0.0015, 0.002]);
  });
});
