import { parquetMetadataAsync, parquetRead, parquetSchema, type AsyncBuffer, type FileMetaData, type RowGroup, type SchemaTree } from 'hyparquet';
import { decompress as decompressZstd } from 'fzstd';
import { decompressBrotli } from 'hyparquet-compressors/src/brotli.js';
import { gunzip } from 'hyparquet-compressors/src/gzip.js';
import { decompressLz4, decompressLz4Raw } from 'hyparquet-compressors/src/lz4.js';
import { InputError } from '../errors';
import { quietContext, type JobContext } from '../job';
import type { ByteSource } from '../raw/byte-source';
import { checkFileCounts, checkGroupPages } from './parquet-checks';
import { checkGroupRuns } from './parquet-levels';
import { decodeNumericChunk, UnsupportedChunk, type NumericType } from './parquet-numeric';
import { AUTO_FLOAT32_BYTES, DEFAULT_READ_OPTIONS, type ReadOptions } from './reader.types';
import { roleFromName } from './roles';
import { snappyDecompress } from './snappy';
import type { Table, TimeFormat } from './table';
import { ValueColumn } from './value-column';

/**
 * Codecs, all pure JS: our snappy (bulk copies; hyparquet's copies byte by byte, which made it half
 * the read time of a numeric file), the rest from fzstd and hyparquet-compressors. The latter's
 * bundled map is not used: it compiles a WebAssembly snappy when imported, which the app's
 * Content-Security-Policy (no 'wasm-unsafe-eval') forbids in the worker.
 */
const compressors = {
  SNAPPY: (input: Uint8Array, length: number) => {
    const out = new Uint8Array(length);
    snappyDecompress(input, out);
    return out;
  },
  GZIP: (input: Uint8Array, length: number) => gunzip(input, new Uint8Array(length)),
  ZSTD: (input: Uint8Array) => decompressZstd(input),
  BROTLI: decompressBrotli,
  LZ4: decompressLz4,
  LZ4_RAW: decompressLz4Raw,
};

const WIDE_ROLES = new Set(['id', 'subject', 'session', 'start', 'end', 'duration', 'label', 'metadata']);

/** Timestamps and dates decode to seconds since the epoch (printed back as ISO 8601). */
const PARSERS = {
  timestampFromMilliseconds: (v: bigint) => Number(v) / 1e3,
  timestampFromMicroseconds: (v: bigint) => Number(v) / 1e6,
  timestampFromNanoseconds: (v: bigint) => Number(v) / 1e9,
  dateFromDays: (d: number) => d * 86400,
};

const NUMERIC = new Set(['FLOAT', 'DOUBLE', 'INT32', 'INT64']);
const SIGNED_INTS = new Set<string>(['INT_8', 'INT_16', 'INT_32', 'INT_64']);

/** Flat FLOAT/DOUBLE/INT32/INT64 columns without a logical type take the typed-array decoder. */
function isPlainNumber(node: SchemaTree): boolean {
  const e = node.element;
  const logical = e.logical_type;
  const signedInt = e.converted_type === undefined || SIGNED_INTS.has(e.converted_type);
  return node.children.length === 0 && e.type !== undefined && NUMERIC.has(e.type) && e.repetition_type !== 'REPEATED' && signedInt &&
    (logical === undefined || (logical.type === 'INTEGER' && logical.isSigned));
}

function isTime(node: SchemaTree): boolean {
  const e = node.element;
  const logical = e.logical_type?.type;
  return logical === 'TIMESTAMP' || logical === 'DATE' || e.converted_type === 'TIMESTAMP_MILLIS' || e.converted_type === 'TIMESTAMP_MICROS' || e.converted_type === 'DATE';
}

/** Byte range [start, end) of a column chunk: its dictionary page (if any) and data pages. */
function chunkRange(meta: NonNullable<RowGroup['columns'][number]['meta_data']>): [number, number] {
  const dict = meta.dictionary_page_offset;
  const start = Number(dict !== undefined && dict > 0n && dict < meta.data_page_offset ? dict : meta.data_page_offset);
  return [start, start + Number(meta.total_compressed_size)];
}

/** An exactly sized ArrayBuffer holding `bytes` (copied when it is a view into a larger buffer). */
function ownBuffer(bytes: Uint8Array): ArrayBuffer {
  return (bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes.buffer : bytes.slice().buffer) as ArrayBuffer;
}

/**
 * hyparquet's view of the file: slices inside the row group held in memory come from it, any
 * other slice (the footer, a chunk outside the group) is read from the source.
 */
class WindowedBuffer implements AsyncBuffer {
  held: { start: number; bytes: Uint8Array } | null = null;
  constructor(private readonly source: ByteSource) {}
  get byteLength(): number {
    return this.source.size;
  }
  async slice(start: number, end = this.source.size): Promise<ArrayBuffer> {
    const h = this.held;
    if (h && start >= h.start && end <= h.start + h.bytes.length) return h.bytes.slice(start - h.start, end - h.start).buffer as ArrayBuffer;
    const bytes = await this.source.read(start, end - start);
    if (bytes.length < end - start) throw new Error(`the file ends at byte ${this.source.size}, before byte ${end}`);
    return ownBuffer(bytes);
  }
}

/**
 * Parquet (snappy, gzip, zstd, brotli, lz4 or uncompressed) read from random-access bytes: the
 * footer first, then one row group at a time (only that group's bytes in memory), with progress
 * and a checkpoint between row groups. Plain numeric columns are decoded straight into typed
 * arrays; other columns go through hyparquet.
 */
export async function readParquetSource(source: ByteSource, fileName: string, options: ReadOptions = {}, ctx: JobContext = quietContext): Promise<Table> {
  const opts = { ...DEFAULT_READ_OPTIONS, ...options };
  const damaged = (e: unknown, where?: string): InputError => {
    if (e instanceof InputError) return e;
    const why = e instanceof Error ? e.message : String(e);
    return new InputError({
      file: fileName,
      expected: `a complete Parquet file (it is damaged or cut short${where ? ` in the ${where}` : ''}; was the copy interrupted?)`,
      found: why,
    });
  };
  if (source.size === 0) throw new InputError({ file: fileName, expected: 'a Parquet file', found: 'an empty file (0 bytes)' });
  const head = await source.read(0, 4);
  if (String.fromCharCode(...head) !== 'PAR1') {
    throw new InputError({ file: fileName, expected: 'a Parquet file (starting with "PAR1")', found: 'other bytes' });
  }
  const file = new WindowedBuffer(source);
  let metadata: FileMetaData;
  try {
    metadata = await parquetMetadataAsync(file, { initialFetchSize: 1 << 16 });
  } catch (e) {
    throw damaged(e);
  }
  let schema: SchemaTree;
  try {
    schema = parquetSchema(metadata);
    checkFileCounts(metadata, schema);
  } catch (e) {
    throw damaged(e);
  }
  const nRows = Number(metadata.num_rows);
  const narrow = opts.precision === 'float32' || (opts.precision === 'auto' && Math.max(opts.totalBytes, source.size) > AUTO_FLOAT32_BYTES);
  const columns = new Map<string, ValueColumn>();
  for (const node of schema.children) {
    const name = node.element.name;
    const role = roleFromName(name);
    const time: TimeFormat | undefined = isTime(node) ? 'iso8601' : undefined;
    columns.set(name, new ValueColumn(name, nRows, !narrow || time !== undefined || (role !== undefined && WIDE_ROLES.has(role)), time));
  }
  if (columns.size === 0) throw new InputError({ file: fileName, expected: 'at least one column', found: 'a Parquet file without columns' });
  if (nRows === 0) throw new InputError({ file: fileName, row: 2, expected: 'at least one data row', found: 'a Parquet file with no rows' });
  const fast = new Map(schema.children.filter(isPlainNumber).map((n) => [n.element.name, n]));
  let start = 0;
  // The next group's bytes are requested before this one is decoded, so the read overlaps the work
  // (at most two groups' bytes in memory). A failed read surfaces when its group's turn comes.
  const groups = metadata.row_groups;
  const fetch = (g: number) => {
    const p = holdGroup(source, groups[g]);
    p.catch(() => undefined);
    return p;
  };
  let next = groups.length > 0 ? fetch(0) : null;
  for (const [g, group] of groups.entries()) {
    const end = start + Number(group.num_rows);
    try {
      const held = next as Promise<{ start: number; bytes: Uint8Array }>;
      next = g + 1 < groups.length ? fetch(g + 1) : null;
      file.held = await held;
      checkGroupPages(file.held, group, schema);
      const rest = decodeNumbers(file.held, group, fast, columns, start);
      if (rest.length > 0) {
        checkGroupRuns(file.held, group, schema, rest, compressors);
        await parquetRead({
          file, metadata, rowStart: start, rowEnd: end, compressors, parsers: PARSERS, columns: rest,
          onChunk: ({ columnName, columnData, rowStart }) => columns.get(columnName)?.set(rowStart, columnData),
        });
      }
    } catch (e) {
      throw damaged(e, `row group starting at row ${start + 2}`);
    } finally {
      file.held = null;
    }
    start = end;
    ctx.progress('decoding', start / nRows);
    await ctx.checkpoint();
  }
  return { fileName, nRows, columns: [...columns.values()].map((c) => c.finish()) };
}

/** Reads the bytes spanning all of a row group's column chunks in one request. */
async function holdGroup(source: ByteSource, group: RowGroup): Promise<{ start: number; bytes: Uint8Array }> {
  let lo = Infinity, hi = 0;
  for (const c of group.columns) {
    if (!c.meta_data) continue;
    const [a, b] = chunkRange(c.meta_data);
    lo = Math.min(lo, a);
    hi = Math.max(hi, b);
  }
  if (!(hi > lo)) return { start: 0, bytes: new Uint8Array(0) };
  if (hi > source.size) throw new Error(`the row group needs bytes up to ${hi}, but the file ends at byte ${source.size}`);
  return { start: lo, bytes: await source.read(lo, hi - lo) };
}

/**
 * Decodes the row group's plain numeric columns straight into their typed arrays; returns the
 * names of the columns left for the general decoder (other types, encodings or codecs).
 */
function decodeNumbers(held: { start: number; bytes: Uint8Array }, group: RowGroup, fast: Map<string, SchemaTree>, columns: Map<string, ValueColumn>, row: number): string[] {
  const rest: string[] = [];
  for (const [name, column] of columns) {
    const node = fast.get(name);
    const meta = group.columns.find((c) => c.meta_data?.path_in_schema.length === 1 && c.meta_data.path_in_schema[0] === name)?.meta_data;
    if (!node || !meta) {
      rest.push(name);
      continue;
    }
    const [begin] = chunkRange(meta);
    try {
      decodeNumericChunk({
        file: held.bytes, start: begin - held.start, length: Number(meta.total_compressed_size), type: meta.type as NumericType, numValues: Number(meta.num_values),
        maxDefinition: node.element.repetition_type === 'OPTIONAL' ? 1 : 0, codec: meta.codec, decompress: compressors,
      }, column.target(), row);
    } catch (e) {
      if (!(e instanceof UnsupportedChunk)) throw e;
      rest.push(name);
    }
  }
  return rest;
}
