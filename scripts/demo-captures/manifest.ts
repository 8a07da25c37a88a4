/**
 * How each demo capture is made. `spice`: the netlist in server/seed/demo/spice/ is run and its
 * node `scope` (the scope's input) read over [fromS, toS], times the channel's attenuation
 * setting: what the screen showed. `sampled`: a closed-form waveform read at the scope's sample
 * rate, for captures whose point is the sampling itself. Noise (V rms on the screen's scale) is
 * seeded by the case key; `adcRangeV` is where the ADC cut the trace (screen scale).
 */
interface Common {
  key: string;
  noiseV: number;
  points?: number;
  adcRangeV?: [number, number];
}

export type CaptureSpec = Common &
  (
    | { kind: 'spice'; netlist: string; fromS: number; toS: number; channelSetting: number }
    | { kind: 'sampled'; sampleRateHz: number; fromS: number; waveformV: (tS: number) => number }
  );

const spice = (key: string, fromS: number, toS: number, channelSetting: number, noiseV: number, extra: Partial<Common> = {}): CaptureSpec => ({
  key,
  kind: 'spice',
  netlist: `${key}.cir`,
  fromS,
  toS,
  channelSetting,
  noiseV,
  ...extra,
});

/** A pulse train between lowV and highV at frequencyHz with the given duty cycle. */
const pwm = (frequencyHz: number, duty: number, lowV: number, highV: number) => (tS: number) => {
  const phase = tS * frequencyHz - Math.floor(tS * frequencyHz);
  return phase < duty ? highV : lowV;
};

export const DEMO_CAPTURES: CaptureSpec[] = [
  spice('att-3v3-rail', 0, 1e-3, 1, 0.003),
  spice('att-gate-118v', 0, 60e-6, 10, 0.6),
  spice('att-100x-bus', 200e-3, 240e-3, 10, 0.08),
  spice('att-adc-ref', 0, 2e-3, 1, 0.002),
  spice('term-clock-vanish', 0, 200e-9, 10, 0.01),
  // 50 µV/div, centre at +0.1 mV, 8 divisions: the needles leave the screen
  spice('term-pwm-mv', 0, 100e-6, 10, 15e-6, { adcRangeV: [-0.11e-3, 0.31e-3] }),
  spice('load-rc-osc', 100e-6, 140e-6, 1, 0.004),
  spice('load-bias-divider', 0, 5e-3, 10, 0.006),
  spice('load-xtal', 400e-6, 550e-6, 1, 0.006),
  spice('bw-limit-on', 10e-9, 310e-9, 10, 0.015),
  spice('bw-1x-spi', 0, 1.5e-6, 1, 0.012),
  spice('bw-gan-100mhz', 0, 40e-9, 10, 0.15),
  spice('bw-radio-spi', 0, 250e-9, 10, 0.01),
  spice('comp-scope-b-rounded', 0, 2e-3, 10, 0.02),
  spice('comp-rounded-tops', 0, 2e-3, 10, 0.015),
  spice('comp-hall-spike', 0, 1e-3, 10, 0.02),
  spice('gl-buck-ring', 0, 500e-9, 10, 0.05),
  spice('gl-spi-spring', 0, 160e-9, 10, 0.015),
  spice('gl-taped-lead', 0, 500e-9, 10, 0.08),
  spice('gl-pa-supply', 0, 500e-9, 10, 0.012),
  // 0.5 V/div, offset 0, 8 divisions; the ADC reads a little past the screen's edge
  spice('clip-line-out', 0, 2e-3, 10, 0.008, { adcRangeV: [-2.05, 2.05] }),
  // 1 V/div, offset +2 V, 8 divisions: -2 V to +6 V on screen
  spice('clip-gate-offset', 0, 60e-6, 10, 0.03, { adcRangeV: [-2.1, 6.1] }),
  spice('ac-heater-pwm', 298e-3, 328e-3, 1, 0.005),
  spice('cm-floating-scope', 0, 40e-6, 100, 1),
  spice('cm-shunt-cmrr', 0, 100e-6, 10, 0.002),
  spice('hum-usb-loop', 0, 60e-3, 10, 0.002),
  spice('hum-electrode', 0, 60e-3, 10, 0.003),
  spice('gen-double', 0, 500e-6, 10, 0.005),
  // the LED driver's PWM runs at 1.002 MHz; 2,500 points over 2.5 ms is 1 MS/s: alias at 2 kHz
  { key: 'alias-pwm-2khz', kind: 'sampled', sampleRateHz: 1e6, fromS: 0.37e-6, waveformV: pwm(1.002e6, 0.3, 0, 3.3), noiseV: 0.015 },
  // a 2.45 MHz boost switch node read at 2.5 MS/s: alias at 50 kHz
  { key: 'alias-boost-50k', kind: 'sampled', sampleRateHz: 2.5e6, fromS: 0.11e-6, waveformV: pwm(2.45e6, 0.4, 0, 5), noiseV: 0.02 },
];
