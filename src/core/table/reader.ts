import { quietContext, type JobContext } from '../job';
import type { ByteSource } from '../raw/byte-source';
import { ArrowReader } from './arrow-reader';
import { CsvReader } from './csv-reader';
import { ParquetReader } from './parquet-reader';
import { readParquetSource } from './parquet-source';
import type { ReadOptions, TableFormat, TableReader } from './reader.types';
import type { Table } from './table';
import { annotateTimes } from './time-columns';

/**
 * A chunked reader for a windows table: push the file's bytes in order, then finish. Time columns
 * (by name, or ISO 8601 / typed timestamps) come back marked with their unit.
 */
export function createTableReader(format: TableFormat, fileName: string, options: ReadOptions = {}): TableReader {
  const inner: TableReader =
    format === 'parquet' ? new ParquetReader(fileName, options)
      : format === 'arrow' ? new ArrowReader(fileName, options)
        : new CsvReader(fileName, options);
  return {
    push: (chunk) => inner.push(chunk),
    finish: async (ctx) => annotateTimes(await inner.finish(ctx)),
    get bytesConsumed() {
      return inner.bytesConsumed;
    },
  };
}

/** Formats that decode from random-access bytes without holding the whole file. */
export function readsByOffset(format: TableFormat): boolean {
  return format === 'parquet';
}

/**
 * A windows table from random-access bytes (a file on disk, a browser File). Parquet is read by
 * offset, one row group in memory at a time; other formats are pushed through their chunked
 * reader in `chunkBytes` slices.
 */
export async function readTableSource(format: TableFormat, fileName: string, source: ByteSource, options: ReadOptions = {}, ctx: JobContext = quietContext, chunkBytes = 4 << 20): Promise<Table> {
  if (readsByOffset(format)) return annotateTimes(await readParquetSource(source, fileName, { totalBytes: source.size, ...options }, ctx));
  const reader = createTableReader(format, fileName, { totalBytes: source.size, ...options });
  for (let at = 0; at < source.size; at += chunkBytes) {
    reader.push(await source.read(at, Math.min(chunkBytes, source.size - at)));
    ctx.progress('reading', Math.min(1, (at + chunkBytes) / source.size));
    await ctx.checkpoint();
  }
  return reader.finish(ctx);
}
