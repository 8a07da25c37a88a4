import type { CaptureSamples } from './types';

/** Where a parser puts its rows: growing arrays in memory, or a file on the server. */
export interface RowSink {
  readonly length: number;
  lastTimeS(): number;
  /** Appends one row: its time and one value per channel (the array is reused by the caller). */
  pushRow(timeS: number, values: Float64Array): void;
}

/**
 * A time column and any number of voltage columns that grow by doubling, so a parser can
 * append samples without knowing the length of the file and without a boxed number per sample.
 */
export class SampleBuffer implements RowSink {
  private timesS = new Float64Array(4096);
  private channels: Float64Array[];
  length = 0;

  constructor(channelCount = 1) {
    this.channels = Array.from({ length: channelCount }, () => new Float64Array(4096));
  }

  push(timeS: number, voltage: number): void {
    if (this.length === this.timesS.length) this.grow();
    this.timesS[this.length] = timeS;
    this.channels[0][this.length] = voltage;
    this.length++;
  }

  /** Appends one row: its time and one value per channel. */
  pushRow(timeS: number, values: Float64Array): void {
    if (this.length === this.timesS.length) this.grow();
    this.timesS[this.length] = timeS;
    for (let c = 0; c < this.channels.length; c++) this.channels[c][this.length] = values[c];
    this.length++;
  }

  lastTimeS(): number {
    return this.length === 0 ? Number.NEGATIVE_INFINITY : this.timesS[this.length - 1];
  }

  /** The first channel's samples so far, as views on the buffer (no copy). */
  samples(): CaptureSamples {
    return { timesS: this.times(), volts: this.channel(0) };
  }

  times(): Float64Array {
    return this.timesS.subarray(0, this.length);
  }

  channel(index: number): Float64Array {
    return this.channels[index].subarray(0, this.length);
  }

  private grow(): void {
    const size = this.timesS.length * 2;
    const timesS = new Float64Array(size);
    timesS.set(this.timesS);
    this.timesS = timesS;
    this.channels = this.channels.map((old) => {
      const next = new Float64Array(size);
      next.set(old);
      return next;
    });
  }
}
