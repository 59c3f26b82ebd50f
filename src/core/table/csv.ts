import { InputError } from '../errors';
import { cellString, indexCells, QUOTED, type CellIndex } from './csv-cells';
import type { CategoricalColumn, Column, NumericColumn, Table } from './table';
import { decodeUtf8 } from './utf8';

/** Decimal numbers as written by common tools: 12, -3.5, .5, 1e-3, +2.0E+5. */
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const INFINITE = /^[+-]?inf(?:inity)?$/i;

/** Cells that mean "no value" (case-insensitive), besides the empty cell. */
export const MISSING_TOKENS: readonly string[] = ['na', 'nan', 'null'];

/**
 * Parses a comma-separated windows table (UTF-8, optional BOM, RFC 4180 quotes, LF or CRLF).
 * A column is numeric when its non-missing cells are numbers, categorical when most are text.
 * Every problem is an InputError naming the file, row (1-based, header = 1) and column.
 */
export function parseCsv(bytes: Uint8Array, fileName: string): Table {
  const text = decodeUtf8(bytes, fileName);
  if (text.trim() === '') {
    throw new InputError({ file: fileName, expected: 'a header row and data rows', found: 'an empty file' });
  }
  const cells = indexCells(text, fileName);
  if (cells.nRows === 0) {
    throw new InputError({ file: fileName, row: 2, expected: 'at least one data row after the header', found: 'only the header' });
  }
  const names = columnNames(cells.header, fileName);
  const columns: Column[] = names.map((name, j) => buildColumn(text, cells, j, name, fileName));
  return { fileName, nRows: cells.nRows, columns };
}

function columnNames(header: string[], fileName: string): string[] {
  const names = header.map((h, j) => (h === '' ? `column ${j + 1}` : h));
  const seen = new Map<string, number>();
  names.forEach((name, j) => {
    const first = seen.get(name);
    if (first !== undefined) {
      throw new InputError({
        file: fileName, row: 1, column: name,
        expected: 'unique column names',
        found: `"${name}" in columns ${first + 1} and ${j + 1}`,
      });
    }
    seen.set(name, j);
  });
  return names;
}

/** Missing-value test on an already trimmed cell. */
export function isMissingToken(s: string): boolean {
  return s === '' || (s.length <= 4 && MISSING_TOKENS.includes(s.toLowerCase()));
}

function cellText(text: string, cells: CellIndex, idx: number): string {
  const flag = cells.flags[idx];
  const s = cellString(text, cells.starts[idx], cells.ends[idx], flag);
  return flag & QUOTED ? s : s.trim();
}

function buildColumn(text: string, cells: CellIndex, j: number, name: string, fileName: string): Column {
  const n = cells.nRows;
  const values = new Float64Array(n);
  let numeric = 0;
  let textCount = 0;
  let firstText = -1;
  let firstInfinite = -1;
  for (let r = 0; r < n; r++) {
    const s = cellText(text, cells, r * cells.nCols + j);
    if (NUMBER.test(s)) {
      values[r] = Number(s);
      numeric++;
    } else if (isMissingToken(s.trim())) {
      values[r] = NaN;
    } else if (INFINITE.test(s)) {
      values[r] = NaN;
      numeric++;
      if (firstInfinite < 0) firstInfinite = r;
    } else {
      values[r] = NaN;
      textCount++;
      if (firstText < 0) firstText = r;
    }
  }
  if (textCount >= numeric && textCount > 0) return categorical(text, cells, j, name);
  const bad = firstText >= 0 ? firstText : firstInfinite;
  if (bad >= 0) {
    throw new InputError({
      file: fileName, row: cells.lines[bad], column: name,
      expected: firstText >= 0
        ? 'a number (leave the cell empty or write NA for a missing value)'
        : 'a finite number (Inf is not allowed; leave the cell empty for a missing value)',
      found: cellText(text, cells, bad * cells.nCols + j),
    });
  }
  const column: NumericColumn = { kind: 'numeric', name, values };
  return column;
}

function categorical(text: string, cells: CellIndex, j: number, name: string): CategoricalColumn {
  const n = cells.nRows;
  const codes = new Int32Array(n);
  const dictionary: string[] = [];
  const index = new Map<string, number>();
  for (let r = 0; r < n; r++) {
    const s = cellText(text, cells, r * cells.nCols + j);
    if (isMissingToken(s.trim())) {
      codes[r] = -1;
      continue;
    }
    let code = index.get(s);
    if (code === undefined) {
      code = dictionary.length;
      dictionary.push(s);
      index.set(s, code);
    }
    codes[r] = code;
  }
  return { kind: 'categorical', name, codes, dictionary };
}
