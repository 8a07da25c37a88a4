import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatEngineering, parseEngineering } from '../../shared/units/engineering';

const value = (text: string, unit?: string) => {
  const result = parseEngineering(text, unit);
  if (!result.ok) throw new Error(`expected "${text}" to parse: ${result.error}`);
  return result.value;
};
const error = (text: string, unit?: string) => {
  const result = parseEngineering(text, unit);
  if (result.ok) throw new Error(`expected "${text}" to be refused, got ${result.value}`);
  return result.error;
};

describe('parseEngineering', () => {
  // source: BIPM SI Brochure, 9th ed., 2019, Table 7 (SI prefixes)
  const table: [string, number][] = [
    ['y', -24], ['z', -21], ['a', -18], ['f', -15], ['p', -12], ['n', -9], ['µ', -6],
    ['m', -3], ['k', 3], ['M', 6], ['G', 9], ['T', 12],
  ];
  it.each(table)('should read the SI prefix %s as 10^%i', (symbol, exponent) => {
    expect(value(`1 ${symbol}F`)).toBe(Number(`1e${exponent}`));
    expect(value(`1${symbol}`)).toBe(Number(`1e${exponent}`));
  });

  it('should read the spellings used on benches and in SPICE decks', () => {
    expect(value('15 pF', 'F')).toBe(15e-12);
    expect(value('9 MΩ', 'Ω')).toBe(9e6);
    expect(value('9Meg')).toBe(9e6); // SPICE: "meg" is mega
    expect(value('9 MEG', 'ohm')).toBe(9e6);
    expect(value('9 Mohm', 'Ω')).toBe(9e6);
    expect(value('120 MHz', 'Hz')).toBe(120e6);
    expect(value('2.5 ns', 's')).toBe(2.5e-9);
    expect(value('500m')).toBe(0.5); // bare lower-case m is milli
    expect(value('1e-9')).toBe(1e-9);
    expect(value('4.7k')).toBe(4700);
    expect(value('4.7K')).toBe(4700);
    expect(value('10 µs', 's')).toBe(10e-6);
    expect(value('10 μs', 's')).toBe(10e-6); // Greek mu as well as the micro sign
    expect(value('10 us', 's')).toBe(10e-6);
    expect(value('50 Ω')).toBe(50);
    expect(value('50 \u2126')).toBe(50); // OHM SIGN
    expect(value('50 ohm', 'Ω')).toBe(50);
    expect(value('-3.3 V', 'V')).toBe(-3.3);
    expect(value('.5 V')).toBe(0.5);
    expect(value('  2 kHz  ', 'Hz')).toBe(2000);
  });

  it('should read a bare m as metres only when a length is expected', () => {
    expect(value('0.15 m', 'm')).toBe(0.15);
    expect(value('15 cm', 'm')).toBe(0.15);
    expect(value('150 mm', 'm')).toBe(0.15);
    expect(value('0.15 m')).toBe(0.15e-3);
  });

  it('should refuse a unit that does not match the one expected', () => {
    expect(error('120 MHz', 'F')).toBe('expected a capacitance in F, got Hz');
    expect(error('15 pF', 'Ω')).toBe('expected a resistance in Ω, got F');
    expect(error('5 V', '')).toBe('expected a plain number, got V');
  });

  it('should refuse input that is not a number', () => {
    expect(error('')).toBe('enter a value');
    expect(error('   ')).toBe('enter a value');
    expect(error('abc')).toMatch(/not a number/);
    expect(error('5 qF')).toMatch(/unknown prefix or unit "qF"/);
    expect(error('1..2')).toMatch(/not a number/);
    expect(error('NaN')).toMatch(/not a number/);
    expect(error('Infinity')).toMatch(/not a number/);
    expect(error('-Infinity')).toMatch(/not a number/);
    expect(error('1 2')).toMatch(/not a number/);
    expect(error('1e999')).toMatch(/too large/);
    expect(error('5 c')).toMatch(/only before a unit/);
    expect(error('5 cF')).toMatch(/lengths/);
    expect(error('5', 'furlong')).toMatch(/unknown unit/);
  });

  it('should refuse a decimal comma rather than guess', () => {
    expect(error('1,5')).toMatch(/decimal point/);
    expect(error('1,500 Hz')).toMatch(/decimal point/);
  });
});

describe('formatEngineering', () => {
  it('should write the examples the case pages use', () => {
    expect(formatEngineering(15e-12, 'F')).toBe('15 pF');
    expect(formatEngineering(9e6, 'Ω')).toBe('9 MΩ');
    expect(formatEngineering(9e6, 'ohm')).toBe('9 MΩ');
    expect(formatEngineering(120e6, 'Hz')).toBe('120 MHz');
    expect(formatEngineering(2.5e-9, 's')).toBe('2.50 ns');
    expect(formatEngineering(1.0476e-7, 'H')).toBe('105 nH');
    expect(formatEngineering(-0.0033, 'V')).toBe('-3.30 mV');
    expect(formatEngineering(0, 'V')).toBe('0 V');
    expect(formatEngineering(180001, '')).toBe('180 k');
  });

  it('should carry into the next prefix when rounding reaches 1000', () => {
    expect(formatEngineering(999.96, 'Hz')).toBe('1 kHz');
    expect(formatEngineering(999.4e-9, 's')).toBe('999 ns');
  });

  it('should honour the requested significant figures', () => {
    expect(formatEngineering(1.23456e-9, 's', 5)).toBe('1.2346 ns');
    expect(formatEngineering(1.5e-9, 's', 1)).toBe('2 ns');
  });

  it('should write non-finite values as they are', () => {
    expect(formatEngineering(Number.NaN, 'V')).toBe('NaN V');
    expect(formatEngineering(Infinity, 'Hz')).toBe('Infinity Hz');
  });

  it('should read back what it writes, to the digits written', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-23, max: 9e14, noNaN: true }), (x) => {
        const back = parseEngineering(formatEngineering(x, 'F'), 'F');
        expect(back.ok).toBe(true);
        if (back.ok) expect(Math.abs(back.value - x) / x).toBeLessThan(5e-3);
      }),
    );
  });
});
