import { describe, expect, it } from 'vitest';
import { analyzeCapture } from '../../shared/capture/analyze';
import { parseCaptureText } from '../../shared/capture/parse';
import type { CaptureParseOptions, ParsedCapture } from '../../shared/capture/types';

// One file per bench-export layout, each built here from a closed-form waveform: a 1 MHz square
// (0 → 3.3 V, ideal edges) or a 500 kHz sine (0.5 V peak), sampled every 10 ns. Expected values come from the
// waveform's own definition (its levels and period), not from the reader.
const SAMPLE_S = 10e-9;
const POINTS = 1000;
const square = (k: number) => ((Math.floor((k * SAMPLE_S) / 0.5e-6) % 2) === 1 ? 3.3 : 0);
const sine = (k: number) => 0.5 * Math.sin(2 * Math.PI * 500e3 * k * SAMPLE_S);

const read = (text: string, options?: CaptureParseOptions): ParsedCapture => {
  const result = parseCaptureText(text, options);
  if (!result.ok) throw new Error(`expected the capture to read, got: ${result.error.message}`);
  return result;
};
const refused = (text: string, options?: CaptureParseOptions) => {
  const result = parseCaptureText(text, options);
  if (result.ok) throw new Error('expected the capture to be refused');
  return result.error;
};
const rows = (row: (k: number) => string) => Array.from({ length: POINTS }, (_, k) => row(k));
const notes = (r: ParsedCapture) => r.notes.join('\n');

describe('capture layouts from bench exports', () => {
  it('applies millivolts from a key–value preamble and keeps its settings, with notes', () => {
    const text = [
      'Model,Bench scope',
      'Vertical Units,mV',
      'Probe,10X',
      'Vertical Scale,500mV',
      'Offset,-1.65 V',
      'Coupling,DC',
      'BW Limit,20MHz',
      'Input Impedance,1M',
      'Sample Rate,100MSa/s',
      '',
      'Time,CH1',
      ...rows((k) => `${(k * SAMPLE_S).toExponential(6)},${(square(k) * 1000).toFixed(1)}`),
    ].join('\n');
    const r = read(text);
    const a = analyzeCapture(r.samples);
    // source: the square's levels by construction, 0 and 3.3 V; period 1 µs
    expect(a.amplitudeV).toBeCloseTo(3.3, 9);
    expect(a.periodS).toBeCloseTo(1e-6, 12);
    expect(r.channels).toEqual([{ index: 1, name: 'CH1', unit: 'mV', column: 1 }]);
    expect(notes(r)).toMatch(/'CH1' read as millivolts from the preamble's 'Vertical Units' = 'mV'/);
    expect(r.metadata).toMatchObject({
      attenuationSetting: 10,
      voltsPerDiv: 0.5,
      offsetV: -1.65,
      coupling: 'dc',
      bandwidthLimitHz: 20e6,
      inputResistanceOhm: 1e6,
      sampleRateHz: 100e6,
    });
    expect(r.metadata.raw).toMatchObject({ Model: 'Bench scope', Probe: '10X' });
  });

  it.each([
    ['10X', 10],
    ['x10', 10],
    ['10:1', 10],
    ['1X', 1],
    ['X1', 1],
    ['100 x', 100],
    ['10', 10],
  ])('reads the attenuation setting %j as %d', (value, expected) => {
    const r = read(`Probe Attenuation,${value}\nTime,CH1\n0,0\n1e-9,1\n`);
    expect(r.metadata.attenuationSetting).toBe(expected);
  });

  it('builds time from a sample index with Start and Increment in the header row (time = start + i·increment)', () => {
    const text = ['X,CH1,CH2,Start,Increment,', 'Sequence,Volt,Volt,-5.000000e-06,1.000000e-08', ...rows((k) => `${k},${square(k)},${sine(k).toFixed(6)},`)].join('\r\n');
    const r = read(text, { channel: 2 });
    expect(r.samples.timesS[0]).toBeCloseTo(-5e-6, 18);
    expect(r.samples.timesS[10]).toBeCloseTo(-5e-6 + 10 * 1e-8, 18);
    expect(r.channel).toBe(2);
    expect(r.channels.map((c) => c.name)).toEqual(['CH1 (Volt)', 'CH2 (Volt)']);
    expect(notes(r)).toMatch(/Column 1 \('X \(Sequence\)'\) is a sample index: time = start \+ index × increment, from 'Increment' = '1.000000e-08' and 'Start' = '-5.000000e-06'/);
    const a = analyzeCapture(r.samples);
    // source: the sine's own period, 1/500 kHz = 2 µs; a sine has no rise time
    expect(a.shape).toBe('sine');
    expect(a.periodS).toBeCloseTo(2e-6, 9);
    expect(a.riseTimeS).toBeNull();
    const first = read(text);
    expect(analyzeCapture(first.samples).amplitudeV).toBeCloseTo(3.3, 9);
  });

  it('finds the data beside label, value, unit metadata columns and keeps the metadata', () => {
    const meta = [
      ['Record Length', String(POINTS), 'Points'],
      ['Sample Interval', String(SAMPLE_S), 's'],
      ['Trigger Point', '0', 'Samples'],
      ['Source', 'CH1', ''],
      ['Vertical Units', 'V', ''],
      ['Vertical Scale', '1', ''],
      ['Probe Atten', '1', ''],
    ];
    const text = rows((k) => `${(meta[k] ?? ['', '', '']).join(',')},${(k * SAMPLE_S).toExponential(6)},${square(k)}`).join('\n');
    const r = read(text);
    expect(r.time.index).toBe(3);
    expect(r.voltage.index).toBe(4);
    expect(r.samples.volts.length).toBe(POINTS);
    expect(notes(r)).toMatch(/Columns 1–3 hold metadata beside the data/);
    expect(r.metadata).toMatchObject({ attenuationSetting: 1, voltsPerDiv: 1, sampleRateHz: 1 / SAMPLE_S });
    expect(r.metadata.raw['Record Length']).toBe(`${POINTS} Points`);
  });

  it('lists every channel and analyses the one chosen, by number or by name', () => {
    const text = ['Time (us),CH1 (V),CH2 (mV)', ...rows((k) => `${(k * SAMPLE_S * 1e6).toFixed(3)},${sine(k).toFixed(6)},${square(k) * 1000}`)].join('\n');
    const byNumber = read(text, { channel: 2 });
    const byName = read(text, { channel: 'CH2' });
    expect(byNumber.channels).toHaveLength(2);
    expect(byNumber.channel).toBe(2);
    expect(byName.channel).toBe(2);
    expect(analyzeCapture(byName.samples).amplitudeV).toBeCloseTo(3.3, 9);
    expect(notes(byName)).toMatch(/Analysed channel 2 \('CH2 \(mV\)', column 3\) of 2, as chosen/);
    expect(notes(read(text))).toMatch(/Analysed channel 1 .* choose another with the channel field/);
    expect(refused(text, { channel: 3 }).message).toBe("channel 3 does not exist: the file has 2 signal column(s): 1 'CH1 (V)', 2 'CH2 (mV)'");
    expect(refused(text, { channel: 'CH9' }).message).toMatch(/no signal column is named 'CH9'/);
  });

  it('reads semicolons with a decimal comma and CRLF, and says so', () => {
    const text = ['Zeit [ms];Spannung [V]', ...rows((k) => `${(k * SAMPLE_S * 1e3).toFixed(6).replace('.', ',')};${square(k).toFixed(2).replace('.', ',')}`)].join('\r\n');
    const r = read(text);
    expect(r.decimalComma).toBe(true);
    expect(r.samples.timesS[1]).toBeCloseTo(SAMPLE_S, 15);
    expect(analyzeCapture(r.samples).amplitudeV).toBeCloseTo(3.3, 9);
    expect(notes(r)).toMatch(/Read with ';' between columns and a comma as the decimal mark/);
  });

  it.each([
    ['Time[us],Volt', 1e6, 1, 'µs'],
    ['Time (ns),CH1 (uV)', 1e9, 1e6, 'ns'],
    ['t/ms,V/mV', 1e3, 1e3, 'ms'],
  ])('applies the units in the header %j', (header, timeScale, voltScale, timeUnit) => {
    const r = read([header, ...rows((k) => `${k * SAMPLE_S * timeScale},${square(k) * voltScale}`)].join('\n'));
    expect(r.time.unit).toBe(timeUnit);
    expect(r.samples.timesS[3]).toBeCloseTo(3 * SAMPLE_S, 15);
    expect(analyzeCapture(r.samples).amplitudeV).toBeCloseTo(3.3, 6);
  });

  it('takes time units and a sample interval from the preamble for a single column', () => {
    const r = read(['Sample Interval: 10 ns', 'CH1', ...rows((k) => String(square(k)))].join('\n'));
    expect(r.time.index).toBe(-1);
    expect(r.samples.timesS[POINTS - 1]).toBeCloseTo((POINTS - 1) * SAMPLE_S, 15);
    expect(notes(r)).toMatch(/No time column: time = start \+ row × increment/);
  });

  it('refuses what it cannot place, saying which lines and columns it saw and what it expected', () => {
    const noInterval = refused('CH1,CH2\n0.1,0.2\n0.2,0.3\n');
    expect(noInterval.message).toMatch(/no column holds time \(line 2 has numbers in columns 1, 2, headed 'CH1', 'CH2'\)/);
    expect(noInterval.message).toMatch(/expected a time column, or 'Increment', 'Sample Interval' or 'Sample Rate'/);
    const noData = refused('Model,Bench\nhello,world\nfoo,bar\n');
    expect(noData.message).toMatch(/no numeric rows found in 3 line\(s\)/);
    expect(noData.message).toMatch(/expected rows with numbers in two or more columns/);
    const index = refused('Index,CH1\n0,1\n1,2\n');
    expect(index.message).toMatch(/column 1 \('Index'\) counts samples, but the file gives no sample interval/);
  });
});
