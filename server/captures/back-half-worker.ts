// Runs in a thread beside the capture worker (see back-half.ts): reads the data rows of the back
// half of a large capture file while the capture worker reads the front half, then takes the
// measurements of the whole record that do not need its edges while the worker finds those.
import { closeSync, openSync, readSync } from 'node:fs';
import type { DataLayout } from '../../shared/capture/data-layout';
import { PlainRowReader } from '../../shared/capture/parse-bytes';
import { wholeRecordMeasures, type WholeRecordMeasures } from '../../shared/capture/whole-record';
import { openStore, SampleFileWriter, type WrittenPart } from './sample-store';

export interface BackHalfTask {
  file: string;
  /** The store's directory; the rows go to column files with `suffix`. */
  dir: string;
  suffix: string;
  /** First byte to read: the start of a line. */
  startByte: number;
  layout: DataLayout;
  /** Set to 1 by the front reader when it no longer wants the rows (its half failed): stop at the next read. */
  cancel?: Int32Array;
}

export interface BackHalfResult extends WrittenPart {
  /** Where the rows taken end: the first byte of the line the front reader goes on from. */
  stopByte: number;
}

const READ_BYTES = 1 << 20;

/**
 * Reads plain rows from `startByte` (as `PlainRowReader` takes them) into column files of their
 * own, until the first line that is not one or the end of the file; an unfinished last line is
 * left too. Throws only when the files cannot be read or written.
 */
export default function readBackHalf(task: BackHalfTask): BackHalfResult {
  const writer = new SampleFileWriter(task.dir, task.layout.channels.length, task.suffix);
  const reader = new PlainRowReader(task.layout, writer);
  const fd = openSync(task.file, 'r');
  const buffer = Buffer.allocUnsafe(READ_BYTES);
  let chunkStart = task.startByte; // file position of buffer[0]
  let kept = 0; // bytes of an unfinished row carried to the front of the buffer
  try {
    for (;;) {
      if (task.cancel && Atomics.load(task.cancel, 0) === 1) break;
      const read = readSync(fd, buffer, kept, READ_BYTES - kept, chunkStart + kept);
      if (read === 0) break; // the end of the file: what is kept is an unterminated last line
      const bytes = buffer.subarray(0, kept + read);
      const stop = reader.readRows(bytes, 0);
      // a line end after the stop: a row not taken; none: the row goes on in the next read
      if (bytes.indexOf(10, stop) >= 0 || (stop === 0 && bytes.length === READ_BYTES)) {
        chunkStart += stop;
        kept = 0;
        break;
      }
      buffer.copyWithin(0, stop, bytes.length);
      kept = bytes.length - stop;
      chunkStart += stop;
    }
  } finally {
    closeSync(fd);
    writer.closeFiles();
  }
  return { suffix: task.suffix, rows: writer.length, firstTimeS: writer.firstTimeS(), lastTimeS: writer.lastTimeS(), stopByte: chunkStart };
}

export interface WholeRecordTask {
  /** A closed store's directory (sample-store.ts). */
  dir: string;
  /** The channel measured, 1-based. */
  channel: number;
}

/** `wholeRecordMeasures` of one channel of a store, read here through a store of its own. */
export function measureWholeRecord(task: WholeRecordTask): WholeRecordMeasures {
  const store = openStore(task.dir);
  try {
    return wholeRecordMeasures(store.timesS, store.channel(task.channel));
  } finally {
    store.close();
  }
}
