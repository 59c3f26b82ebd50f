import type { JobContext } from '../job';
import { DEFAULT_MISSING_MARKERS } from './missing-markers';
import type { Table } from './table';

/** File formats a windows table can be read from. */
export type TableFormat = 'csv' | 'parquet' | 'arrow';

export const TABLE_FORMATS: readonly TableFormat[] = ['csv', 'parquet', 'arrow'];

/** How numeric feature columns are stored. 'auto' = single precision for files over AUTO_FLOAT32_BYTES. */
export type Precision = 'float64' | 'float32' | 'auto';

export interface ReadOptions {
  /** Field delimiter of a text table; 'auto' detects comma, semicolon or tab. */
  delimiter?: ',' | ';' | '\t' | 'auto';
  /** Decimal mark of a text table; 'auto' detects a decimal comma in semicolon- or tab-separated files. */
  decimal?: '.' | ',' | 'auto';
  precision?: Precision;
  /** Size of the whole input in bytes when known (sizes buffers, decides 'auto' precision). */
  totalBytes?: number;
  /**
   * Cells of a text table read as missing (exact, case included, after trimming spaces); the empty
   * cell always is. Default DEFAULT_MISSING_MARKERS; [''] means only the empty cell.
   */
  missing?: readonly string[];
}

export const DEFAULT_READ_OPTIONS: Required<ReadOptions> = {
  delimiter: 'auto',
  decimal: 'auto',
  precision: 'auto',
  totalBytes: 0,
  missing: DEFAULT_MISSING_MARKERS,
};

/** Inputs larger than this keep feature columns in Float32 under precision 'auto'. */
export const AUTO_FLOAT32_BYTES = 64 * 1024 * 1024;

/**
 * Reads a table from chunks of bytes, fed in file order by the host (a browser File stream, a
 * Node read stream). No reader builds the whole file as one string; text is parsed from bytes.
 * The host reports progress as bytesConsumed / size and may stop between chunks to cancel.
 */
export interface TableReader {
  push(chunk: Uint8Array): void;
  /** Ends the input and returns the table; columnar formats decode here, with progress and checkpoints. */
  finish(ctx?: JobContext): Promise<Table>;
  readonly bytesConsumed: number;
}
