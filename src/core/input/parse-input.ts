import { blobSource } from '../raw/byte-source';
import { hashBlob, type BlobHasher, type RunningBlobHash } from '../hash/blob-hash';
import { hashingSource } from '../hash/hashing-source';
import { createSha256 } from '../hash/sha256';
import type { JobContext } from '../job';
import { checkTable, type TableWarning } from '../table/checks';
import { detectFormat, tableFormat } from '../table/format';
import { createTableReader, readsByOffset, readTableSource } from '../table/reader';
import type { ReadOptions, TableFormat } from '../table/reader.types';
import { inferRoles } from '../table/roles';
import type { RoleOverrides, Roles } from '../table/roles.types';
import type { Table } from '../table/table';

export interface ParseJob {
  fileName: string;
  /** The whole file, or its chunks in order (each is released once parsed). */
  bytes?: Uint8Array | Uint8Array[];
  /** Or the file itself (browser File / Blob): read here one slice at a time, never whole. */
  blob?: Blob;
  /** Detected from the magic bytes and the extension when absent. */
  format?: TableFormat;
  options?: ReadOptions;
  overrides?: RoleOverrides;
}
export interface ParseResult {
  table: Table;
  roles: Roles;
  /** Problems that do not stop the analysis (for example a subject with a single window). */
  warnings: TableWarning[];
  /** Hex SHA-256 of the bytes read, computed slice by slice. */
  sha256: string;
}

/**
 * Shares of the parse job's progress: reading the bytes (text is split into rows on the way), then
 * parsing (columns built, Parquet/Arrow decoded, roles inferred, the table checked, the hash).
 */
export const READ_SHARE = 0.9;

/** Text is parsed this many bytes at a time, with progress and a cancel check in between. */
const SLICE = 4 * 1024 * 1024;

/** The input in file order, at most SLICE bytes at a time; a Blob is read slice by slice. */
async function* slicesOf(payload: ParseJob): AsyncGenerator<Uint8Array> {
  const { blob } = payload;
  if (blob) {
    for (let at = 0; at < blob.size; at += SLICE) yield new Uint8Array(await blob.slice(at, Math.min(blob.size, at + SLICE)).arrayBuffer());
    return;
  }
  const bytes = payload.bytes ?? [];
  for (const chunk of Array.isArray(bytes) ? bytes : [bytes]) {
    for (let at = 0; at < chunk.length; at += SLICE) yield chunk.subarray(at, Math.min(chunk.length, at + SLICE));
  }
}

/**
 * Reads a windows table (the app's Open, the worker's 'parse' job): bytes or a Blob read slice by
 * slice into the core reader, the column roles inferred, the table checked, and the SHA-256 of the
 * bytes, computed on the way or by `blobHasher` on another thread where the host can start one
 * (should it fail, the Blob is hashed here after all).
 */
export async function parseInput(payload: ParseJob, ctx: JobContext, blobHasher: BlobHasher | null = null): Promise<ParseResult> {
  const bytes = payload.bytes ?? [];
  const { blob } = payload;
  const total = blob ? blob.size : (Array.isArray(bytes) ? bytes : [bytes]).reduce((s, c) => s + c.length, 0);
  // A Blob is hashed on another thread where the host can start one (the app's worker), so the
  // SHA-256 costs no wall time on a second core; otherwise here, on the way through the reads.
  const elsewhere: RunningBlobHash | null = blob && blobHasher ? blobHasher(blob) : null;
  const hash = createSha256();
  const formatOf = (first: Uint8Array) => (payload.format !== undefined ? tableFormat(payload.format) : detectFormat(payload.fileName, first));
  // Parquet read by offset decodes as it reads: its whole progress is the reading share.
  const decodingWhileReading: JobContext = { progress: (_stage, f) => ctx.progress('parsing', READ_SHARE * f, 'decoding'), checkpoint: () => ctx.checkpoint() };
  const decoding: JobContext = { progress: (_stage, f) => ctx.progress('parsing', READ_SHARE + 0.08 * (1 - READ_SHARE) * f, 'decoding'), checkpoint: () => ctx.checkpoint() };
  ctx.progress('reading', 0);
  let table: Table;
  try {
    const blobFormat = blob ? formatOf(new Uint8Array(await blob.slice(0, 8).arrayBuffer())) : null;
    if (blob && blobFormat && readsByOffset(blobFormat)) {
      // A File read by offset (Parquet): one row group in memory at a time, hashed on the way.
      const source = blobSource(blob);
      const hashing = elsewhere ? null : hashingSource(source, hash);
      table = await readTableSource(blobFormat, payload.fileName, hashing ?? source, { totalBytes: total, ...payload.options }, decodingWhileReading);
      await hashing?.finish();
    } else {
      let reader: ReturnType<typeof createTableReader> | null = null;
      for await (const slice of slicesOf(payload)) {
        reader ??= createTableReader(blobFormat ?? formatOf(slice), payload.fileName, { totalBytes: total, ...payload.options });
        if (!elsewhere) hash.update(slice);
        reader.push(slice);
        ctx.progress('reading', READ_SHARE * (reader.bytesConsumed / Math.max(1, total)));
        await ctx.checkpoint();
      }
      reader ??= createTableReader(blobFormat ?? formatOf(new Uint8Array(0)), payload.fileName, { totalBytes: total, ...payload.options });
      ctx.progress('parsing', READ_SHARE, 'columns');
      table = await reader.finish(decoding);
    }
    ctx.progress('parsing', READ_SHARE + 0.8 * (1 - READ_SHARE), 'roles and checks');
    const roles = inferRoles(table, payload.overrides);
    const warnings = checkTable(table, roles);
    ctx.progress('parsing', READ_SHARE + 0.9 * (1 - READ_SHARE), 'SHA-256');
    // Should the hashing thread fail, the file is hashed here after all.
    const sha256 = elsewhere && blob ? await elsewhere.digest.catch(() => hashBlob(blob)) : hash.hex();
    ctx.progress('parsing', 1);
    return { table, roles, warnings, sha256 };
  } catch (err) {
    elsewhere?.stop();
    throw err;
  }
}
