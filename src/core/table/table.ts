/** A numeric column: NaN marks a missing value. */
export interface NumericColumn {
  kind: 'numeric';
  name: string;
  values: Float64Array;
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
}

export function findColumn(table: Table, name: string): Column | undefined {
  return table.columns.find((c) => c.name === name);
}

/** The text of a cell, for display and export ('' when missing). */
export function cellText(column: Column, row: number): string {
  if (column.kind === 'numeric') {
    const v = column.values[row];
    return Number.isNaN(v) ? '' : String(v);
  }
  const code = column.codes[row];
  return code < 0 ? '' : column.dictionary[code];
}
