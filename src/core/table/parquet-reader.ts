import { parquetMetadata, parquetRead, parquetSchema, type FileMetaData, type SchemaTree } from 'hyparquet';
import { decompress as decompressZstd } from 'fzstd';
import { decompressBrotli } from 'hyparquet-compressors/src/brotli.js';
import { gunzip } from 'hyparquet-compressors/src/gzip.js';
import { decompressLz4, decompressLz4Raw } from 'hyparquet-compressors/src/lz4.js';
import { InputError } from '../errors';
import { quietContext, type JobContext } from '../job';
import { ByteCollector } from './collect-bytes';
import { AUTO_FLOAT32_BYTES, DEFAULT_READ_OPTIONS, type ReadOptions, type TableReader } from './reader.types';
import { roleFromName } from './roles';
import type { Table, TimeFormat } from './table';
import { ValueColumn } from './value-column';

/**
 * Codecs beyond hyparquet's own pure-JS snappy, all pure JS. hyparquet-compressors' bundled map is
 * not used: it compiles a WebAssembly snappy when imported, which the app's Content-Security-Policy
 * (no 'wasm-unsafe-eval') forbids in the worker.
 */
const compressors = {
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

function isTime(node: SchemaTree): boolean {
  const e = node.element;
  const logical = e.logical_type?.type;
  return logical === 'TIMESTAMP' || logical === 'DATE' || e.converted_type === 'TIMESTAMP_MILLIS' || e.converted_type === 'TIMESTAMP_MICROS' || e.converted_type === 'DATE';
}

/**
 * Parquet (snappy, gzip, zstd, brotli, lz4 or uncompressed) read one row group at a time, with
 * progress and a checkpoint between row groups. The bytes are gathered first: Parquet keeps its
 * schema in the footer.
 */
export class ParquetReader implements TableReader {
  private readonly bytes: ByteCollector;
  private readonly opts: Required<ReadOptions>;

  constructor(private readonly fileName: string, options: ReadOptions = {}) {
    this.opts = { ...DEFAULT_READ_OPTIONS, ...options };
    this.bytes = new ByteCollector(this.opts.totalBytes);
  }

  get bytesConsumed(): number {
    return this.bytes.length;
  }

  push(chunk: Uint8Array): void {
    this.bytes.push(chunk);
  }

  async finish(ctx: JobContext = quietContext): Promise<Table> {
    const file = this.bytes.take();
    const metadata = this.metadata(file);
    const nRows = Number(metadata.num_rows);
    const schema = parquetSchema(metadata);
    const { precision, totalBytes } = this.opts;
    const narrow = precision === 'float32' || (precision === 'auto' && Math.max(totalBytes, file.byteLength) > AUTO_FLOAT32_BYTES);
    const columns = new Map<string, ValueColumn>();
    for (const node of schema.children) {
      const name = node.element.name;
      const role = roleFromName(name);
      const time: TimeFormat | undefined = isTime(node) ? 'iso8601' : undefined;
      columns.set(name, new ValueColumn(name, nRows, !narrow || time !== undefined || (role !== undefined && WIDE_ROLES.has(role)), time));
    }
    if (columns.size === 0) throw new InputError({ file: this.fileName, expected: 'at least one column', found: 'a Parquet file without columns' });
    if (nRows === 0) throw new InputError({ file: this.fileName, row: 2, expected: 'at least one data row', found: 'a Parquet file with no rows' });
    let start = 0;
    for (const group of metadata.row_groups) {
      const end = start + Number(group.num_rows);
      try {
        await parquetRead({
          file, metadata, rowStart: start, rowEnd: end, compressors, parsers: PARSERS,
          onChunk: ({ columnName, columnData, rowStart }) => columns.get(columnName)?.set(rowStart, columnData),
        });
      } catch (e) {
        throw this.damaged(e, `row group starting at row ${start + 2}`);
      }
      start = end;
      ctx.progress('decoding', start / nRows);
      await ctx.checkpoint();
    }
    return { fileName: this.fileName, nRows, columns: [...columns.values()].map((c) => c.finish()) };
  }

  private metadata(file: ArrayBuffer): FileMetaData {
    if (file.byteLength === 0) {
      throw new InputError({ file: this.fileName, expected: 'a Parquet file', found: 'an empty file (0 bytes)' });
    }
    const head = new Uint8Array(file, 0, Math.min(4, file.byteLength));
    if (String.fromCharCode(...head) !== 'PAR1') {
      throw new InputError({ file: this.fileName, expected: 'a Parquet file (starting with "PAR1")', found: 'other bytes' });
    }
    try {
      return parquetMetadata(file);
    } catch (e) {
      throw this.damaged(e);
    }
  }

  private damaged(e: unknown, where?: string): InputError {
    if (e instanceof InputError) return e;
    const why = e instanceof Error ? e.message : String(e);
    return new InputError({
      file: this.fileName,
      expected: `a complete Parquet file (it is damaged or cut short${where ? ` in the ${where}` : ''}; was the copy interrupted?)`,
      found: why,
    });
  }
}
