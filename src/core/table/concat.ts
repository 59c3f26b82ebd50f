import { InputError } from '../errors';
import type { CategoricalColumn, Column, NumericColumn, Table } from './table';

/** One part of a partitioned dataset: its table and the key=value pairs of its folders. */
export interface TablePart {
  table: Table;
  /** Partition column → value, from folder names such as "subject=S01" (already URL-decoded). */
  partition: Record<string, string>;
}

/** Hive-style writers name a missing partition value so. */
const MISSING_PARTITION = '__HIVE_DEFAULT_PARTITION__';

/**
 * Stacks the parts of a partitioned dataset into one table, in part order, and adds each partition
 * key as a text column. Every part must have the same columns (in any order); a column that is
 * numbers in one part and text in another becomes text.
 */
export function concatTables(parts: TablePart[], fileName: string): Table {
  if (parts.length === 0) throw new InputError({ file: fileName, expected: 'at least one data file (part) in the folder', found: 'none' });
  const first = parts[0].table;
  const names = first.columns.map((c) => c.name);
  const keys = Object.keys(parts[0].partition);
  for (const k of keys) {
    if (names.includes(k)) {
      throw new InputError({ file: first.fileName, column: k, expected: `no column named like the partition folder "${k}=..."`, found: 'a column of that name in the part' });
    }
  }
  for (const p of parts) {
    const have = new Set(p.table.columns.map((c) => c.name));
    const missing = names.find((n) => !have.has(n));
    const extra = p.table.columns.find((c) => !names.includes(c.name));
    if (missing || extra) {
      throw new InputError({
        file: p.table.fileName, column: missing ?? extra?.name,
        expected: `the same columns as ${first.fileName}`,
        found: missing ? 'this column missing' : 'an extra column',
      });
    }
    const pk = Object.keys(p.partition);
    if (pk.length !== keys.length || keys.some((k) => !(k in p.partition))) {
      throw new InputError({ file: p.table.fileName, expected: `partition folders ${keys.map((k) => `${k}=...`).join('/') || '(none)'}, as for ${first.fileName}`, found: pk.join(', ') || 'none' });
    }
  }
  const nRows = parts.reduce((s, p) => s + p.table.nRows, 0);
  const columns: Column[] = names.map((name) => stack(name, parts.map((p) => p.table.columns.find((c) => c.name === name) as Column), nRows));
  for (const k of keys) {
    const dictionary: string[] = [];
    const codes = new Int32Array(nRows);
    let at = 0;
    for (const p of parts) {
      const v = p.partition[k];
      let code = -1;
      if (v !== MISSING_PARTITION && v !== '') {
        code = dictionary.indexOf(v);
        if (code < 0) code = dictionary.push(v) - 1;
      }
      codes.fill(code, at, at + p.table.nRows);
      at += p.table.nRows;
    }
    columns.push({ kind: 'categorical', name: k, codes, dictionary });
  }
  return { fileName, nRows, columns };
}

function stack(name: string, cols: Column[], nRows: number): Column {
  if (cols.every((c) => c.kind === 'numeric')) {
    const num = cols as NumericColumn[];
    const wide = num.some((c) => c.values instanceof Float64Array);
    const values = wide ? new Float64Array(nRows) : new Float32Array(nRows);
    let at = 0;
    for (const c of num) {
      values.set(c.values, at);
      at += c.values.length;
    }
    const time = num.find((c) => c.time)?.time;
    return time ? { kind: 'numeric', name, values, time } : { kind: 'numeric', name, values };
  }
  const dictionary: string[] = [];
  const index = new Map<string, number>();
  const code = (s: string) => {
    let c = index.get(s);
    if (c === undefined) {
      c = dictionary.push(s) - 1;
      index.set(s, c);
    }
    return c;
  };
  const codes = new Int32Array(nRows);
  let at = 0;
  for (const c of cols) {
    if (c.kind === 'numeric') {
      for (let i = 0; i < c.values.length; i++) codes[at + i] = c.values[i] === c.values[i] ? code(String(c.values[i])) : -1;
      at += c.values.length;
    } else {
      const map = (c as CategoricalColumn).dictionary.map(code);
      for (let i = 0; i < c.codes.length; i++) codes[at + i] = c.codes[i] < 0 ? -1 : map[c.codes[i]];
      at += c.codes.length;
    }
  }
  return { kind: 'categorical', name, codes, dictionary };
}
