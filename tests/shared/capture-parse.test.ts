import { describe, expect, it } from 'vitest';
import { parseCaptureText } from '../../shared/capture/parse';
import type { CaptureParseOptions, ParsedCapture } from '../../shared/capture/types';

const parsed = (text: string, options?: CaptureParseOptions): ParsedCapture => {
  const result = parseCaptureText(text, options);
  if (!result.ok) throw new Error(`expected the capture to read, got: ${result.error.message}`);
  return result;
};
const refused = (text: string, options?: CaptureParseOptions) => {
  const result = parseCaptureText(text, options);
  if (result.ok) throw new Error(`expected the capture to be refused, got ${result.samples.timesS.length} samples`);
  return result.error;
};
const times = (result: ParsedCapture) => Array.from(result.samples.timesS);
const volts = (result: ParsedCapture) => Array.from(result.samples.volts);

describe('CaptureParser: layout', () => {
  it('should read a file without a header as time, voltage in seconds and volts', () => {
    const result = parsed('0,0.5\n1e-9,0.75\n2e-9,1\n');
    expect(times(result)).toEqual([0, 1e-9, 2e-9]);
    expect(volts(result)).toEqual([0.5, 0.75, 1]);
    expect(result.headerLine).toBeNull();
    expect(result.time).toEqual({ index: 0, name: null, unit: 's' });
  });

  it('should read a header in any words and report where it was', () => {
    const result = parsed('Zeitpunkt,Messwert\n0,1\n1,2\n');
    expect(result.headerLine).toBe(1);
    expect(result.firstDataLine).toBe(2);
    expect(times(result)).toEqual([0, 1]);
    expect(result.time.name).toBe('Zeitpunkt');
  });

  it.each([
    [',', 'Time,Voltage\n0,1.5\n1,2.5\n'],
    [';', 'Time;Voltage\n0;1.5\n1;2.5\n'],
    ['\t', 'Time\tVoltage\n0\t1.5\n1\t2.5\n'],
  ])('should detect the separator %j', (separator, text) => {
    const result = parsed(text);
    expect(result.separator).toBe(separator);
    expect(volts(result)).toEqual([1.5, 2.5]);
  });

  it('should read a comma as the decimal mark when the separator is a semicolon', () => {
    const result = parsed('Zeit (ms);Spannung (mV)\n0,0;1,5\n0,5;-2,25\n');
    expect(result.decimalComma).toBe(true);
    expect(times(result)).toEqual([0, 0.5e-3]);
    expect(volts(result)).toEqual([1.5e-3, -2.25e-3]);
  });

  it('should not read a comma as a decimal mark when it separates the columns', () => {
    expect(parsed('0,1\n1,2\n').decimalComma).toBe(false);
  });

  it('should read numbers in scientific notation', () => {
    const result = parsed('-5.000000E-07,1.2E+00\n-4.99e-7,-3.5e-1\n+1.5E-9,.25\n');
    expect(times(result)).toEqual([-5e-7, -4.99e-7, 1.5e-9]);
    expect(volts(result)).toEqual([1.2, -0.35, 0.25]);
  });
});

describe('CaptureParser: units in the header', () => {
  // source: BIPM SI Brochure, 9th ed., 2019, Table 7 (SI prefixes m, µ, n)
  it.each([
    ['Time (us),CH1 [mV]', -6, -3, 'µs', 'mV'],
    ['Time (µs),CH1 (V)', -6, 0, 'µs', 'V'],
    ['time_s,voltage_v', 0, 0, 's', 'V'],
    ['time_ms,voltage_mv', -3, -3, 'ms', 'mV'],
    ['t [ns],U [V]', -9, 0, 'ns', 'V'],
    ['Time/s,Amplitude/mV', 0, -3, 's', 'mV'],
    ['TIME (S),CH1 (MV)', 0, -3, 's', 'mV'],
  ])('should apply the units in %j', (header, timeExp10, voltExp10, timeUnit, voltUnit) => {
    const result = parsed(`${header}\n2,5\n3,7\n`);
    expect(times(result)).toEqual([Number(`2e${timeExp10}`), Number(`3e${timeExp10}`)]);
    expect(volts(result)).toEqual([Number(`5e${voltExp10}`), Number(`7e${voltExp10}`)]);
    expect(result.time.unit).toBe(timeUnit);
    expect(result.voltage.unit).toBe(voltUnit);
  });

  it('should convert exactly, as if the unit were written as an exponent', () => {
    const result = parsed('Time (us),CH1 (mV)\n2.5,-12.75\n3.1,0.001\n');
    expect(times(result)).toEqual([Number('2.5e-6'), Number('3.1e-6')]);
    expect(volts(result)).toEqual([Number('-12.75e-3'), Number('0.001e-3')]);
  });

  it('should merge a units row under the header', () => {
    const result = parsed('Time,Channel A\n(ms),(mV)\n0,1\n1,2\n');
    expect(times(result)).toEqual([0, 1e-3]);
    expect(volts(result)).toEqual([1e-3, 2e-3]);
    expect(result.headerLine).toBe(2);
  });
});

describe('CaptureParser: extra columns and preamble', () => {
  const file = 'Index,Time (ns),CH1 (V),CH2 (V)\n1,0,0.1,5\n2,10,0.2,6\n3,20,0.3,7\n';

  it('should pick the first time-like and the first voltage-like column', () => {
    const result = parsed(file);
    expect(result.time.index).toBe(1);
    expect(result.voltage.index).toBe(2);
    expect(times(result)).toEqual([0, 10e-9, 20e-9]);
    expect(volts(result)).toEqual([0.1, 0.2, 0.3]);
  });

  it('should let the caller choose the columns by index', () => {
    const result = parsed(file, { voltageColumnIndex: 3 });
    expect(result.voltage).toEqual({ index: 3, name: 'CH2 (V)', unit: 'V' });
    expect(volts(result)).toEqual([5, 6, 7]);
    const byIndex = parsed(file, { timeColumnIndex: 0, voltageColumnIndex: 2 });
    expect(times(byIndex)).toEqual([1, 2, 3]);
  });

  it('should refuse a column choice that cannot work', () => {
    expect(refused(file, { timeColumnIndex: 1, voltageColumnIndex: 1 }).message).toMatch(/same column/);
    expect(refused(file, { timeColumnIndex: -1 }).message).toMatch(/timeColumnIndex/);
    expect(refused(file, { voltageColumnIndex: 9 }).message).toMatch(/column 10 \(voltage\)/);
  });

  it('should skip comments and key,value lines before the data', () => {
    const text = [
      '# exported from the bench scope',
      '; second comment style',
      '// third',
      'Model,Bench scope 2000',
      'Record Length,4',
      'Sample Interval,1e-9',
      '',
      'Time (s),Voltage (V)',
      '0,0',
      '1e-9,1',
      '# a comment among the data is skipped too',
      '2e-9,1',
      '',
      '3e-9,0',
    ].join('\n');
    const result = parsed(text);
    expect(result.headerLine).toBe(8);
    expect(result.firstDataLine).toBe(9);
    expect(volts(result)).toEqual([0, 1, 1, 0]);
  });

  it('should read quoted cells', () => {
    const result = parsed('"Time, s","Volt, V"\n"0","1.5"\n"1","2.5"\n');
    expect(volts(result)).toEqual([1.5, 2.5]);
  });
});

describe('CaptureParser: line ends and encodings', () => {
  it('should read CRLF, CR and LF alike', () => {
    const rows = ['Time,V', '0,1', '1,2', '2,3'];
    const expected = parsed(rows.join('\n'));
    for (const end of ['\r\n', '\r']) {
      const result = parsed(rows.join(end) + end);
      expect(volts(result)).toEqual(volts(expected));
      expect(result.lineCount).toBe(4);
    }
  });

  it('should drop a byte order mark', () => {
    expect(parsed('\uFEFFTime (ms),V\n0,1\n1,2\n').time.unit).toBe('ms');
  });
});

describe('CaptureParser: what it tolerates', () => {
  it('should drop an unterminated last line that was cut off, and say so', () => {
    const result = parsed('0,1\n1,2\n2,3\n3,');
    expect(volts(result)).toEqual([1, 2, 3]);
    expect(result.notes.join()).toMatch(/line 4/);
  });

  it('should keep a complete last line without a line break', () => {
    expect(volts(parsed('0,1\n1,2\n2,3'))).toEqual([1, 2, 3]);
  });

  it('should ignore a footer after the last sample, and say so', () => {
    const result = parsed('0,1\n1,2\nEnd of record\nChecksum,ABCD\n');
    expect(volts(result)).toEqual([1, 2]);
    expect(result.notes.join()).toMatch(/2 line\(s\) after the last sample, from line 3/);
  });
});

describe('CaptureParser: what it refuses, with the line to blame', () => {
  it('should name the line, column and cell of a bad voltage', () => {
    const rows = ['Time,Voltage', ...Array.from({ length: 15 }, (_, k) => `${k},${k}`), '15,abc', '16,1'];
    const error = refused(rows.join('\n'));
    expect(error.message).toBe("line 17: expected a number in column 2 (voltage), got 'abc'");
    expect(error.line).toBe(17);
    expect(error.expected).toBe('a number in column 2 (voltage)');
  });

  it('should refuse garbage in the middle of the data', () => {
    const error = refused('0,1\n1,2\nnot a sample\n3,4\n');
    expect(error.line).toBe(3);
    expect(error.message).toMatch(/^line 3: expected a number in column 1 \(time\)/);
  });

  it('should refuse a row that lost its voltage', () => {
    expect(refused('0,1\n1\n2,3\n').message).toBe(
      'line 2: expected a number in column 2 (voltage), but the row has only one column',
    );
  });

  it('should refuse time that does not increase', () => {
    const rows = Array.from({ length: 600 }, (_, k) => `${k === 529 ? 527 : k}e-9,0`);
    const error = refused(rows.join('\n'));
    expect(error.message).toMatch(/^time is not increasing at line 530/);
    expect(error.line).toBe(530);
  });

  it('should refuse a repeated time stamp', () => {
    expect(refused('0,1\n1,2\n1,3\n').line).toBe(3);
  });

  it.each([
    ['', 'the file is empty'],
    ['\n\n  \n', 'no numeric rows found'],
    ['Time,Voltage\nabc,def\n', 'no numeric rows found'],
    ['1.5\n2.5\n3.5\n', 'only one column'],
    ['0 1\n1 2\n', 'columns separated by spaces are not supported'],
    ['Time,V\n0,1\n', 'only one sample'],
    ['0,1\u0000\n1,2\n', 'binary file'],
  ])('should refuse %j with a message saying why', (text, message) => {
    expect(refused(text).message).toContain(message);
  });

  it('should refuse a line too long to be a CSV row', () => {
    expect(refused('0,'.repeat(600_000)).message).toMatch(/longer than/);
  });
});
