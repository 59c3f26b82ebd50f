import { quietContext, type JobContext } from '../job';
import { bytesSource } from '../raw/byte-source';
import { readParquetSource } from './parquet-source';
import type { Table } from './table';
import { WholeFileReader } from './whole-file-reader';

/**
 * Parquet from pushed chunks: the bytes are gathered first (Parquet keeps its schema in the
 * footer), then decoded as random-access bytes. Hosts that can read by offset (a file on disk, a
 * browser File) call readParquetSource directly and never hold the whole file.
 */
export class ParquetReader extends WholeFileReader {
  async finish(ctx: JobContext = quietContext): Promise<Table> {
    const file = new Uint8Array(this.bytes.take());
    return readParquetSource(bytesSource(file), this.fileName, { ...this.opts, totalBytes: Math.max(this.opts.totalBytes, file.length) }, ctx);
  }
}
