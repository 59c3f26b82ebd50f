import type { MissingCount } from './missing-markers';

/** How a time column was written in the file; its values are always numbers. */
export type TimeFormat =
  /** ISO 8601 text; values are seconds since 1970-01-01T00:00:00Z (text without a zone is read as UTC). */
  | 'iso8601'
  /** Numbers in seconds (epoch or relative). */
  | 'seconds'
  /** Numbers in milliseconds (epoch or relative). */
  | 'milliseconds';

/**
 * A numeric column: NaN marks a missing value. Large tables keep feature columns in single
 * precision (half the memory); time, id and code columns always stay in double precision.
 */
export interface NumericColumn {
  kind: 'numeric';
  name: string;
  values: Float32Array | Float64Array;
  /** Set when the column was read as timestamps (ISO 8601 text or a typed timestamp column). */
  time?: TimeFormat;
}

/** A text column, dictionary-encoded: codes index `dictionary`; -1 marks a missing value. */
export interface CategoricalColumn {
  kind: 'categorical';
  name: string;
  codes: Int32Array;
  dictionary: string[];
}

export type Column = NumericColumn | CategoricalColumn;

/** A parsed windows table: one row per window, typed columns. */
export interface Table {
  /** File name (no directories) the table was read from; used in messages. */
  fileName: string;
  nRows: number;
  columns: Column[];
  /**
   * 1-based line of the file where each row starts (the header is line 1), for messages. When
   * absent (columnar files), row r is reported as r + 2, as if the file had one line per row.
   */
  lines?: Int32Array;
  /** Text tables: the missing cells of each column that has any, by marker, in table order. */
  missing?: MissingCount[];
}

export function findColumn(table: Table, name: string): Column | undefined {
  return table.columns.find((c) => c.name === name);
}

/** The row number a message should name for 0-based row r (header = row 1). */
export function rowLine(table: Table, r: number): number {
  return table.lines ? table.lines[r] : r + 2;
}

/** The text of a cell, for display and export ('' when missing). ISO 8601 times print as ISO 8601 (UTC). */
export function cellText(column: Column, row: number): string {
  if (column.kind === 'numeric') {
    const v = column.values[row];
    if (Number.isNaN(v)) return '';
    if (column.time === 'iso8601') return new Date(Math.round(v * 1000)).toISOString();
    return String(v);
  }
  const code = column.codes[row];
  return code < 0 ? '' : column.dictionary[code];
}
