import { closeSync, createReadStream, fstatSync, openSync, readdirSync, readSync, statSync } from 'node:fs';
import { basename, join, relative, sep } from 'node:path';
import { CancelledError, InputError } from '../core/errors';
import type { JobContext } from '../core/job';
import { concatTables, type TablePart } from '../core/table/concat';
import { detectFormat } from '../core/table/format';
import { createTableReader, readsByOffset, readTableSource } from '../core/table/reader';
import { readCsvInTwo } from './csv-in-two';
import { openFileSource } from './file-source';
import { hashFilesInBackground, type RunningHash } from './hash-files';
import type { ReadOptions } from '../core/table/reader.types';
import type { Table } from '../core/table/table';

/** Bytes read from disk at a time. */
const CHUNK = 4 * 1024 * 1024;
/** Delimited text files at least this large are parsed on two threads (csv-in-two.ts). */
const TWO_THREADS_BYTES = 32 * 1024 * 1024;

export interface InputTable {
  table: Table;
  /** File or folder name, for messages and the summary. */
  fileName: string;
  /** SHA-256 of the file; of a folder, of each part's relative path and bytes in path order. */
  sha256: string;
  /** Part files read (1 for a single file). */
  parts: number;
}

export interface ReadInputDeps {
  progress(stage: string, fraction: number): void;
  /** True once the user asked to stop; reading stops at the next chunk. */
  cancelled(): boolean;
  options?: ReadOptions;
  /** Delimited text at least this large is parsed on two threads (default 32 MiB). */
  twoThreadsBytes?: number;
  /** Bytes read at a time (default 4 MiB). */
  chunkBytes?: number;
  /** Told, for a file read on two threads, whether the parts were joined or why not (csv-in-two.ts). */
  twoThreadsOutcome?(how: string): void;
}

/**
 * Reads a windows table from a file (CSV/TSV, Parquet, Arrow IPC) or from a folder of Parquet
 * parts written by a partitioned job (`subject=S01/part-0.parquet`, ...), streaming each file in
 * chunks into the core reader: no file is ever held as one string.
 */
export async function readInput(path: string, deps: ReadInputDeps): Promise<InputTable> {
  // A missing path fails on open (below), so the message says "cannot open".
  if (statSync(path, { throwIfNoEntry: false })?.isDirectory()) {
    const files = listParts(path);
    if (files.length === 0) {
      throw new InputError({ file: basename(path), expected: 'data files (parts such as part-0.parquet) in the folder or its key=value subfolders', found: 'none' });
    }
    const rels = files.map((f) => relative(path, f).split(sep).join('/'));
    const hashing = hashFilesInBackground(files.map((f, t) => ({ label: `${rels[t]}\n`, path: f })));
    const total = files.reduce((s, f) => s + statSync(f).size, 0);
    let done = 0;
    const parts: TablePart[] = [];
    const fileName = basename(path);
    const table = await whileHashing(hashing, async () => {
      for (const [t, file] of files.entries()) {
        const part = await readFile(file, rels[t], deps, (f) => deps.progress('reading', (done + f) / total));
        done += statSync(file).size;
        parts.push({ table: part, partition: partitionOf(rels[t]) });
      }
      return concatTables(parts, fileName);
    });
    return { table, fileName, sha256: await hashing.digest, parts: files.length };
  }
  const hashing = hashFilesInBackground([{ path }]);
  const table = await whileHashing(hashing, () => readFile(path, basename(path), deps, (f) => deps.progress('reading', f)));
  return { table, fileName: basename(path), sha256: await hashing.digest, parts: 1 };
}

/** Runs `read`; if it fails (bad input, cancel), the hashing thread is stopped and its outcome ignored. */
async function whileHashing<T>(hashing: RunningHash, read: () => Promise<T>): Promise<T> {
  try {
    return await read();
  } catch (err) {
    hashing.digest.catch(() => undefined);
    hashing.stop();
    throw err;
  }
}

async function readFile(path: string, fileName: string, deps: ReadInputDeps, progress: (f: number) => void): Promise<Table> {
  const fd = openSync(path, 'r');
  const size = fstatSync(fd).size;
  const head = new Uint8Array(8);
  const headBytes = readSync(fd, head, 0, 8, 0);
  const format = detectFormat(fileName, head.subarray(0, headBytes));
  const ctx: JobContext = {
    progress: (_stage, f) => progress(f),
    checkpoint: () => (deps.cancelled() ? Promise.reject(new CancelledError()) : new Promise((r) => setImmediate(r))),
  };
  if (readsByOffset(format)) {
    // Parquet: read by offset, one row group in memory at a time.
    closeSync(fd);
    const source = await openFileSource(path);
    try {
      return await readTableSource(format, fileName, source, { totalBytes: size, ...deps.options }, ctx);
    } finally {
      await source.close();
    }
  }
  const chunkBytes = deps.chunkBytes ?? CHUNK;
  if (format === 'csv' && size >= (deps.twoThreadsBytes ?? TWO_THREADS_BYTES)) {
    closeSync(fd);
    return readCsvInTwo(path, fileName, size, { cancelled: deps.cancelled, progress, options: deps.options, chunkBytes, outcome: deps.twoThreadsOutcome });
  }
  const reader = createTableReader(format, fileName, { totalBytes: size, ...deps.options });
  const stream = createReadStream(path, { fd, highWaterMark: chunkBytes });
  try {
    for await (const chunk of stream as AsyncIterable<Buffer>) {
      if (deps.cancelled()) throw new CancelledError();
      reader.push(new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.byteLength));
      progress(size > 0 ? reader.bytesConsumed / size : 1);
    }
  } finally {
    stream.destroy();
  }
  return reader.finish(ctx);
}

/** Data files under a folder, in path order, skipping hidden and marker files (_SUCCESS, .crc). */
function listParts(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const entry of readdirSync(d, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
      if (entry.name.startsWith('.') || entry.name.startsWith('_')) continue;
      const p = join(d, entry.name);
      if (entry.isDirectory()) walk(p);
      else if (/\.(parquet|parq|pq)$/i.test(entry.name)) out.push(p);
    }
  };
  walk(dir);
  return out;
}

/** key=value pairs of the folders between the dataset root and a part. */
function partitionOf(rel: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const seg of rel.split(sep).slice(0, -1)) {
    const eq = seg.indexOf('=');
    if (eq > 0) out[decodeURIComponent(seg.slice(0, eq))] = decodeURIComponent(seg.slice(eq + 1));
  }
  return out;
}

export interface ReadStepDeps {
  progress: { update(stage: string, fraction: number): void; finish(): void };
  /** Receives a cancel handle while reading, so that Ctrl-C stops between chunks. */
  onJob(job: { id: number; result: Promise<unknown>; cancel(): void } | null): void;
}

/** The CLI's reading step: readInput with the progress bar and Ctrl-C wired in. */
export async function readInputStep(path: string, deps: ReadStepDeps, options?: ReadOptions): Promise<InputTable> {
  let stop = false;
  const reading = readInput(path, {
    progress: (stage, f) => deps.progress.update(stage, f),
    cancelled: () => stop,
    options,
  });
  deps.onJob({ id: 0, result: reading, cancel: () => { stop = true; } });
  try {
    return await reading;
  } finally {
    deps.onJob(null);
    deps.progress.finish();
  }
}
