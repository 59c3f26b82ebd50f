import { ArrowReader } from './arrow-reader';
import { CsvReader } from './csv-reader';
import { ParquetReader } from './parquet-reader';
import type { ReadOptions, TableFormat, TableReader } from './reader.types';
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
