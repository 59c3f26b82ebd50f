import type { JobContext } from '../job';
import { ByteCollector } from './collect-bytes';
import { DEFAULT_READ_OPTIONS, type ReadOptions, type TableReader } from './reader.types';
import type { Table } from './table';

/**
 * A reader for formats that need the whole file before decoding (their schema or index is at the
 * end): it gathers pushed chunks, and subclasses decode them in `finish`.
 */
export abstract class WholeFileReader implements TableReader {
  protected readonly bytes: ByteCollector;
  protected readonly opts: Required<ReadOptions>;

  constructor(protected readonly fileName: string, options: ReadOptions = {}) {
    this.opts = { ...DEFAULT_READ_OPTIONS, ...options };
    this.bytes = new ByteCollector(this.opts.totalBytes);
  }

  get bytesConsumed(): number {
    return this.bytes.length;
  }

  push(chunk: Uint8Array): void {
    this.bytes.push(chunk);
  }

  abstract finish(ctx?: JobContext): Promise<Table>;
}
