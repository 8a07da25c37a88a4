import type { CaptureSamples } from './types';

/**
 * Time and voltage columns that grow by doubling, so a parser can append samples without
 * knowing the length of the file and without a boxed number per sample.
 */
export class SampleBuffer {
  private timesS = new Float64Array(4096);
  private volts = new Float64Array(4096);
  length = 0;

  push(timeS: number, voltage: number): void {
    if (this.length === this.timesS.length) this.grow();
    this.timesS[this.length] = timeS;
    this.volts[this.length] = voltage;
    this.length++;
  }

  lastTimeS(): number {
    return this.length === 0 ? Number.NEGATIVE_INFINITY : this.timesS[this.length - 1];
  }

  /** The samples so far, as views on the buffer (no copy). */
  samples(): CaptureSamples {
    return { timesS: this.timesS.subarray(0, this.length), volts: this.volts.subarray(0, this.length) };
  }

  private grow(): void {
    const timesS = new Float64Array(this.timesS.length * 2);
    timesS.set(this.timesS);
    this.timesS = timesS;
    const volts = new Float64Array(this.volts.length * 2);
    volts.set(this.volts);
    this.volts = volts;
  }
}
