import { CsvReader } from './csv-reader';
import type { ReadOptions } from './reader.types';
import type { Table } from './table';
import { annotateTimes } from './time-columns';

export { DEFAULT_MISSING_MARKERS, MissingMarkers, type MissingCount } from './missing-markers';

/**
 * Parses a whole delimited windows table held in memory (UTF-8, optional BOM, comma, semicolon or
 * tab, RFC 4180 quotes, LF or CRLF): a convenience over the streaming CsvReader. A column is numeric
 * when its non-missing cells are numbers, categorical when most are text. Every problem is an
 * InputError naming the file, row (1-based, header = 1) and column.
 */
export function parseCsv(bytes: Uint8Array, fileName: string, options: ReadOptions = {}): Table {
  const reader = new CsvReader(fileName, { totalBytes: bytes.length, ...options });
  reader.push(bytes);
  return annotateTimes(reader.finishSync());
}
