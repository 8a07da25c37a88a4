import { closeSync, mkdirSync, openSync, readFileSync, readSync, writeFileSync, writeSync } from 'node:fs';
import path from 'node:path';
import { scaleValue } from '../../shared/capture/parse';
import type { RowSink } from '../../shared/capture/sample-buffer';
import type { Series } from '../../shared/capture/series';

/**
 * Samples on disk, one binary file per column, so that a capture of any length is read a block
 * at a time rather than held in memory. Values are stored as the file wrote them (before a unit
 * from the preamble is applied); the reader applies each column's power of ten the way the
 * in-memory parser does, so both give the same doubles.
 *
 * A store is a directory: `meta.json`, `time.f64` (absent when the times are start + i·interval)
 * and per channel (1-based) `ch<N>.f64` (as parsed, for the analysis) or, for plots, `ch<N>.i32`
 * (whole multiples of 10^−d V, when every value is one: the usual export with fixed decimals, kept
 * exactly) else `ch<N>.f32`.
 */
export interface StoreMeta {
  rows: number;
  channelCount: number;
  /** 'f64' as parsed (for the analysis); 'compact' for plots (4 bytes a sample, a fifth of the CSV or less). */
  precision: 'f64' | 'compact';
  /** In a compact store, per channel: d when stored as whole multiples of 10^−d (`ch<N>.i32`), null for `ch<N>.f32`. */
  channelDecimals?: (number | null)[];
  timeExp10: number;
  channelExp10s: number[];
  /** Set when the times are start + i·interval (within a millionth of the interval), and no time file is kept. */
  uniformTime?: { startS: number; intervalS: number };
  /**
   * An analysis store written in parts (two threads read halves of the file): per part its rows
   * and the suffix of its column files (`time.f64<suffix>`…), in order. Absent: one part, no suffix.
   */
  parts?: { rows: number; suffix: string }[];
}

/** A part of a store another writer wrote: its file suffix, rows, and first and last times. */
export interface WrittenPart {
  suffix: string;
  rows: number;
  firstTimeS: number;
  lastTimeS: number;
}

const WRITE_ROWS = 1 << 16;

const columnNames = (channelCount: number) => ['time.f64', ...Array.from({ length: channelCount }, (_, c) => `ch${c + 1}.f64`)];

/**
 * Rows from the parser, straight to one file per column, a block at a time. Rows another writer
 * put in files of their own (with a suffix) can be taken in between (`appendPart`): the store
 * then lists its parts, and this writer goes on in new files after them.
 */
export class SampleFileWriter implements RowSink {
  length = 0;
  private first = Number.NaN;
  private last = Number.NEGATIVE_INFINITY;
  private fds: number[];
  private readonly blocks: Float64Array[];
  private fill = 0;
  private readonly parts: { rows: number; suffix: string }[] = [];
  private partStart = 0;
  private suffix: string;

  /** @param suffix of the column files (a part written beside another writer's) */
  constructor(
    readonly dir: string,
    readonly channelCount: number,
    suffix = '',
  ) {
    mkdirSync(dir, { recursive: true });
    this.suffix = suffix;
    this.fds = this.openFiles();
    this.blocks = this.fds.map(() => new Float64Array(WRITE_ROWS));
  }

  /** Time of the first row, NaN before any. */
  firstTimeS(): number {
    return this.first;
  }

  lastTimeS(): number {
    return this.last;
  }

  pushRow(timeS: number, values: Float64Array): void {
    const at = this.fill;
    this.blocks[0][at] = timeS;
    for (let c = 0; c < this.channelCount; c++) this.blocks[c + 1][at] = values[c];
    if (this.length === 0) this.first = timeS;
    this.last = timeS;
    this.length++;
    if (++this.fill === WRITE_ROWS) this.flush();
  }

  /**
   * Takes the rows of a part another writer wrote in this directory as the rows that follow
   * those written so far; later rows go to new files.
   */
  appendPart(part: WrittenPart): void {
    this.endPart();
    this.parts.push({ rows: part.rows, suffix: part.suffix });
    if (this.length === 0) this.first = part.firstTimeS;
    this.length += part.rows;
    this.last = part.lastTimeS;
    this.suffix = `.after${this.parts.length}`;
    this.fds = this.openFiles();
    this.partStart = this.length;
  }

  /** Writes what is buffered and closes the files; then the store can be opened. */
  close(meta: Omit<StoreMeta, 'rows' | 'channelCount' | 'precision' | 'parts'>): void {
    this.endPart();
    const parts = this.parts.filter((part) => part.rows > 0);
    const single = parts.length === 0 || (parts.length === 1 && parts[0].suffix === '');
    writeMeta(this.dir, { ...meta, rows: this.length, channelCount: this.channelCount, precision: 'f64', ...(single ? {} : { parts }) });
  }

  /** Writes what is buffered and closes the files, without a store's description (a part for another writer). */
  closeFiles(): void {
    this.endPart();
  }

  private openFiles(): number[] {
    return columnNames(this.channelCount).map((name) => openSync(path.join(this.dir, `${name}${this.suffix}`), 'w'));
  }

  private endPart(): void {
    this.flush();
    for (const fd of this.fds) closeSync(fd);
    this.fds = [];
    this.parts.push({ rows: this.length - this.partStart, suffix: this.suffix });
  }

  /** Closes the files without a usable store (the parse failed). */
  abandon(): void {
    for (const fd of this.fds) closeSync(fd);
    this.fds.length = 0;
  }

  private flush(): void {
    if (this.fill === 0) return;
    this.fds.forEach((fd, k) => writeAll(fd, new Uint8Array(this.blocks[k].buffer, 0, this.fill * 8)));
    this.fill = 0;
  }
}

export function writeAll(fd: number, bytes: Uint8Array): void {
  let done = 0;
  while (done < bytes.length) done += writeSync(fd, bytes, done, bytes.length - done);
}

export function writeMeta(dir: string, meta: StoreMeta): void {
  writeFileSync(path.join(dir, 'meta.json'), JSON.stringify(meta));
}

export function readMeta(dir: string): StoreMeta {
  return JSON.parse(readFileSync(path.join(dir, 'meta.json'), 'utf8')) as StoreMeta;
}

const PAGE = 1 << 16;
const PAGES_KEPT = 4;
export const SCAN_ROWS = 1 << 16;

/**
 * One column of a store, read on demand: `get` through a few cached pages of 65,536 samples
 * (the work about an edge reads the same neighbourhood again and again), `scan` a block at a time.
 */
export class FileSeries implements Series {
  private readonly pageIds = new Float64Array(PAGES_KEPT).fill(-1);
  // allocated on first use: a column only scanned (the time axis, mostly) never needs them
  private readonly pages: (Float64Array | null)[] = new Array<Float64Array | null>(PAGES_KEPT).fill(null);
  private scratch: Float64Array | null = null;
  private raw: Float32Array | Int32Array | null = null;
  private nextSlot = 0;

  private readonly divisor: number;

  private readonly fds: number[];
  // first row of each part, and the rows in all
  private readonly partStarts: number[];

  /**
   * @param parts the column's files in order with their rows (one, unless two threads wrote the store)
   * @param decimals for 'i32': the stored integers are the values times 10^decimals
   */
  constructor(
    parts: { fd: number; rows: number }[],
    readonly length: number,
    private readonly format: 'f64' | 'f32' | 'i32',
    private readonly exp10: number,
    decimals = 0,
  ) {
    this.fds = parts.map((part) => part.fd);
    this.partStarts = [0];
    for (const part of parts) this.partStarts.push(this.partStarts[this.partStarts.length - 1] + part.rows);
    this.divisor = 10 ** decimals;
  }

  // the page read last, checked first: one subtraction and one comparison per sample
  private lo = 0;
  private span = 0;
  private current: Float64Array = new Float64Array(0);

  get(i: number): number {
    let k = i - this.lo;
    if (k < 0 || k >= this.span) {
      this.turnTo(i);
      k = i - this.lo;
    }
    // the value always comes from the array: were it also a call's result on a miss, optimised
    // code would box every sample into a heap number to return either
    return this.current[k];
  }

  /** Makes the page holding sample i the current one, reading it unless it is kept. */
  private turnTo(i: number): void {
    const id = Math.floor(i / PAGE);
    let slot = -1;
    for (let k = 0; k < PAGES_KEPT; k++) if (this.pageIds[k] === id) slot = k;
    if (slot < 0) {
      slot = this.nextSlot;
      this.nextSlot = (slot + 1) % PAGES_KEPT;
      const page = (this.pages[slot] ??= new Float64Array(PAGE));
      this.read(id * PAGE, Math.min(this.length, (id + 1) * PAGE), page);
      this.pageIds[slot] = id;
    }
    this.lo = id * PAGE;
    this.span = Math.min(this.length, (id + 1) * PAGE) - this.lo;
    this.current = this.pages[slot]!;
  }

  scan(from: number, to: number, visit: (values: Float64Array, firstIndex: number) => void): void {
    this.scratch ??= new Float64Array(SCAN_ROWS);
    const scratch = this.scratch;
    const first = Math.max(0, from);
    const last = Math.min(to, this.length);
    if (last > first && last - first <= PAGE) {
      // a short range (the samples after one edge) comes from the pages `get` keeps, mostly one
      // already read, copied out so a `get` during the visit cannot change it: no read per call
      for (let i = first; i < last; ) {
        this.turnTo(i);
        const end = Math.min(last, this.lo + this.span);
        const page = this.current;
        // a loop, not set(subarray): no view object per call (one per edge and window adds up)
        for (let k = i; k < end; k++) scratch[k - first] = page[k - this.lo];
        i = end;
      }
      visit(scratch.subarray(0, last - first), first);
      return;
    }
    for (let start = first; start < last; start += SCAN_ROWS) {
      const end = Math.min(last, start + SCAN_ROWS);
      this.read(start, end, scratch);
      visit(scratch.subarray(0, end - start), start);
    }
  }

  /** Samples [from, to) into `out`, scaled. */
  private read(from: number, to: number, out: Float64Array): void {
    const count = to - from;
    if (this.format === 'f64') {
      this.readParts(from, to, new Uint8Array(out.buffer, out.byteOffset, count * 8), 8);
    } else {
      if (this.raw === null || this.raw.length < count) this.raw = this.format === 'f32' ? new Float32Array(Math.max(count, PAGE)) : new Int32Array(Math.max(count, PAGE));
      const raw = this.raw;
      this.readParts(from, to, new Uint8Array(raw.buffer, 0, count * 4), 4);
      if (this.format === 'f32') for (let k = 0; k < count; k++) out[k] = raw[k];
      else for (let k = 0; k < count; k++) out[k] = raw[k] / this.divisor;
    }
    if (this.exp10 !== 0) for (let k = 0; k < count; k++) out[k] = scaleValue(out[k], this.exp10);
  }

  /** The stored bytes of samples [from, to) into `bytes` (`size` bytes a sample), from whichever parts hold them. */
  private readParts(from: number, to: number, bytes: Uint8Array, size: number): void {
    const starts = this.partStarts;
    for (let p = 0, at = from; p < this.fds.length && at < to; p++) {
      const end = Math.min(to, starts[p + 1]);
      if (at >= end) continue;
      readAll(this.fds[p], bytes.subarray((at - from) * size, (end - from) * size), (at - starts[p]) * size);
      at = end;
    }
  }
}

function readAll(fd: number, bytes: Uint8Array, position: number): void {
  let done = 0;
  while (done < bytes.length) {
    const read = readSync(fd, bytes, done, bytes.length - done, position + done);
    if (read === 0) throw new Error('the stored samples end early');
    done += read;
  }
}

/** Times start + i·interval, computed rather than stored. */
export class UniformSeries implements Series {
  private scratch: Float64Array | null = null;

  constructor(
    readonly length: number,
    private readonly startS: number,
    private readonly intervalS: number,
  ) {}

  get(i: number): number {
    return this.startS + i * this.intervalS;
  }

  scan(from: number, to: number, visit: (values: Float64Array, firstIndex: number) => void): void {
    this.scratch ??= new Float64Array(SCAN_ROWS);
    for (let start = Math.max(0, from); start < Math.min(to, this.length); start += SCAN_ROWS) {
      const end = Math.min(to, this.length, start + SCAN_ROWS);
      for (let i = start; i < end; i++) this.scratch[i - start] = this.startS + i * this.intervalS;
      visit(this.scratch.subarray(0, end - start), start);
    }
  }
}

/** An open store: its time axis and channels as series, and the files to close. */
export interface OpenStore {
  meta: StoreMeta;
  timesS: Series;
  /** Channel `n` (1-based), opened on first use. */
  channel(n: number): Series;
  close(): void;
}

export function openStore(dir: string): OpenStore {
  const meta = readMeta(dir);
  const fds: number[] = [];
  const open = (name: string) => {
    const fd = openSync(path.join(dir, name), 'r');
    fds.push(fd);
    return fd;
  };
  // a column's files, one per part of the store
  const parts = meta.parts ?? [{ rows: meta.rows, suffix: '' }];
  const files = (name: string) => parts.map((part) => ({ fd: open(`${name}${part.suffix}`), rows: part.rows }));
  const timesS = meta.uniformTime
    ? new UniformSeries(meta.rows, meta.uniformTime.startS, meta.uniformTime.intervalS)
    : new FileSeries(files('time.f64'), meta.rows, 'f64', meta.timeExp10);
  const channels = new Map<number, Series>();
  return {
    meta,
    timesS,
    channel(n: number): Series {
      let series = channels.get(n);
      if (!series) {
        const decimals = meta.channelDecimals?.[n - 1] ?? null;
        const format = meta.precision === 'f64' ? 'f64' : decimals === null ? 'f32' : 'i32';
        series = new FileSeries(files(`ch${n}.${format}`), meta.rows, format, meta.channelExp10s[n - 1] ?? 0, decimals ?? 0);
        channels.set(n, series);
      }
      return series;
    },
    close(): void {
      for (const fd of fds.splice(0)) closeSync(fd);
    },
  };
}
