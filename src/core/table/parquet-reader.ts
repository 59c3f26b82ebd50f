import { parquetMetadata, parquetRead, parquetSchema, type FileMetaData, type RowGroup, type SchemaTree } from 'hyparquet';
import { decompress as decompressZstd } from 'fzstd';
import { decompressBrotli } from 'hyparquet-compressors/src/brotli.js';
import { gunzip } from 'hyparquet-compressors/src/gzip.js';
import { decompressLz4, decompressLz4Raw } from 'hyparquet-compressors/src/lz4.js';
import { InputError } from '../errors';
import { quietContext, type JobContext } from '../job';
import { WholeFileReader } from './whole-file-reader';
import { decodeNumericChunk, UnsupportedChunk, type NumericType } from './parquet-numeric';
import { AUTO_FLOAT32_BYTES } from './reader.types';
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

/**
 * Parquet (snappy, gzip, zstd, brotli, lz4 or uncompressed) read one row group at a time, with
 * progress and a checkpoint between row groups. The bytes are gathered first: Parquet keeps its
 * schema in the footer.
 */
export class ParquetReader extends WholeFileReader {
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
    const fast = new Map(schema.children.filter(isPlainNumber).map((n) => [n.element.name, n]));
    const bytes = new Uint8Array(file);
    let start = 0;
    for (const group of metadata.row_groups) {
      const end = start + Number(group.num_rows);
      try {
        const rest = this.decodeNumbers(bytes, group, fast, columns, start);
        if (rest.length > 0) {
          await parquetRead({
            file, metadata, rowStart: start, rowEnd: end, compressors, parsers: PARSERS, columns: rest,
            onChunk: ({ columnName, columnData, rowStart }) => columns.get(columnName)?.set(rowStart, columnData),
          });
        }
      } catch (e) {
        throw this.damaged(e, `row group starting at row ${start + 2}`);
      }
      start = end;
      ctx.progress('decoding', start / nRows);
      await ctx.checkpoint();
    }
    return { fileName: this.fileName, nRows, columns: [...columns.values()].map((c) => c.finish()) };
  }

  /**
   * Decodes the row group's plain numeric columns straight into their typed arrays; returns the
   * names of the columns left for the general decoder (other types, encodings or codecs).
   */
  private decodeNumbers(file: Uint8Array, group: RowGroup, fast: Map<string, SchemaTree>, columns: Map<string, ValueColumn>, row: number): string[] {
    const rest: string[] = [];
    for (const [name, column] of columns) {
      const node = fast.get(name);
      const meta = group.columns.find((c) => c.meta_data?.path_in_schema.length === 1 && c.meta_data.path_in_schema[0] === name)?.meta_data;
      if (!node || !meta) {
        rest.push(name);
        continue;
      }
      const dict = meta.dictionary_page_offset;
      const begin = Number(dict !== undefined && dict > 0n && dict < meta.data_page_offset ? dict : meta.data_page_offset);
      try {
        decodeNumericChunk({
          file, start: begin, length: Number(meta.total_compressed_size), type: meta.type as NumericType, numValues: Number(meta.num_values),
          maxDefinition: node.element.repetition_type === 'OPTIONAL' ? 1 : 0, codec: meta.codec, decompress: compressors,
        }, column.target(), row);
      } catch (e) {
        if (!(e instanceof UnsupportedChunk)) throw e;
        rest.push(name);
      }
    }
    return rest;
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
