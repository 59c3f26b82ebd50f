import { createReadStream, openSync, readSync, closeSync } from 'node:fs';
import type { Worker } from 'node:worker_threads';
import { CancelledError, InputError } from '../core/errors';
import { CsvReader, lineEndAfter } from '../core/table/csv-reader';
import type { ReadOptions } from '../core/table/reader.types';
import type { Table } from '../core/table/table';
import { annotateTimes } from '../core/table/time-columns';
import type { CsvPartJob, CsvPartMessage } from './csv-part-protocol';
import { spawnThread } from './spawn-thread';

/** Bytes read past the middle of the file to find the line end where the second part starts. */
const PROBE = 1 << 20;

export interface InTwoDeps {
  cancelled(): boolean;
  progress(fraction: number): void;
  options?: ReadOptions;
  chunkBytes: number;
  /** Told how the file was read: 'joined' when the second thread's rows were used, else why not. */
  outcome?(how: string): void;
}

/**
 * Reads a large delimited text file on two threads: this one parses from the start to the first
 * line end past the middle, a worker thread parses the rest, and the worker's rows are appended
 * to this reader's (CsvReader.absorb). The table, its line numbers and every error message equal
 * those of one reader going through the whole file, because the two parts are joined only when
 * that is certain:
 * - no cell before the cut opened with a quote (else the cut could lie inside a quoted cell);
 * - no column mixes numbers and text across the parts (see CsvColumn.canAbsorb).
 * Otherwise, or if the worker fails for a reason other than the input, this thread reads the rest
 * itself. A problem in the second part is reported, on the file's own row, only once the first
 * part has been read without one, so the first problem in the file is the one reported.
 */
export async function readCsvInTwo(path: string, fileName: string, size: number, deps: InTwoDeps): Promise<Table> {
  const reader = new CsvReader(fileName, { totalBytes: size, ...deps.options });
  const cut = findCut(path, size);
  const part: { worker: Worker | null; outcome: Promise<CsvPartMessage> | null; bytes: number } = { worker: null, outcome: null, bytes: 0 };
  const report = () => deps.progress(Math.min(1, (reader.bytesConsumed + part.bytes) / size));
  const startPart = () => {
    const layout = reader.layout();
    if (part.worker || cut >= size || !layout) return;
    const job: CsvPartJob = { path, fileName, start: cut, layout, chunkBytes: deps.chunkBytes };
    const w = spawnThread('csv-part-thread', job);
    part.worker = w;
    part.outcome = new Promise((resolve) => {
      w.on('message', (m: CsvPartMessage) => {
        if (m.kind === 'progress') part.bytes = m.bytes;
        else resolve(m);
      });
      w.once('error', (e) => resolve({ kind: 'error', message: e.message }));
      w.once('exit', (code) => resolve({ kind: 'error', message: `the part thread stopped (exit code ${code})` }));
    });
  };
  try {
    await pushRange(reader, path, 0, cut, deps, report, startPart);
    let how = 'joined';
    if (!part.outcome) how = cut >= size ? 'no line end found past the middle' : 'no header in the first chunk';
    else if (reader.sawQuote || reader.pendingBytes > 0) how = 'a quoted cell before the cut';
    else {
      const m = await whileNotCancelled(part.outcome, deps, report);
      if (m.kind === 'input-error') {
        const row = m.details.row === undefined ? undefined : m.details.row + reader.nextLine - 1;
        throw new InputError({ ...m.details, row });
      }
      // The thread's work is done: let its memory go before the parts are joined.
      await part.worker?.terminate();
      if (m.kind === 'error') how = `the part thread failed: ${m.message}`;
      else if (m.kind === 'part' && !reader.absorb(m.part)) how = 'numbers and text in one column';
    }
    deps.outcome?.(how);
    if (how !== 'joined' && cut < size) {
      void part.worker?.terminate();
      part.bytes = 0;
      await pushRange(reader, path, cut, size, deps, report, () => {});
    }
  } finally {
    void part.worker?.terminate();
  }
  return annotateTimes(reader.finishSync());
}

/** The first byte after the first line end past the middle of the file (the file's size if none within PROBE). */
function findCut(path: string, size: number): number {
  const mid = Math.floor(size / 2);
  const buf = new Uint8Array(Math.min(PROBE, size - mid));
  const fd = openSync(path, 'r');
  try {
    const got = readSync(fd, buf, 0, buf.length, mid);
    const at = lineEndAfter(buf.subarray(0, got), 0);
    return at < 0 ? size : mid + at;
  } finally {
    closeSync(fd);
  }
}

/** Pushes bytes [start, end) of the file in chunks, stopping between chunks on cancel. */
async function pushRange(reader: CsvReader, path: string, start: number, end: number, deps: InTwoDeps, report: () => void, afterChunk: () => void): Promise<void> {
  if (end <= start) return;
  const stream = createReadStream(path, { start, end: end - 1, highWaterMark: deps.chunkBytes });
  try {
    for await (const chunk of stream as AsyncIterable<Buffer>) {
      if (deps.cancelled()) throw new CancelledError();
      reader.push(new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.byteLength));
      report();
      afterChunk();
    }
  } finally {
    stream.destroy();
  }
}

/** Waits for `p`, checking for cancel and reporting progress every 20 ms. */
async function whileNotCancelled<T>(p: Promise<T>, deps: InTwoDeps, report: () => void): Promise<T> {
  let done = false;
  let value: T | undefined;
  void p.then((v) => { done = true; value = v; });
  while (!done) {
    if (deps.cancelled()) throw new CancelledError();
    report();
    await new Promise((r) => setTimeout(r, 20));
  }
  return value as T;
}
