import type { Column } from '../table/table';

/** A categorical column as codes: codes[i] indexes `names`, -1 marks a missing cell. */
export interface Categories {
  codes: Int32Array;
  names: string[];
}

/**
 * Reads any column as categories: a text column keeps its dictionary order; a numeric column
 * (subject ids written as numbers) becomes one category per distinct value, ascending. Without a
 * column every window falls in one category named ''.
 */
export function categoriesOf(column: Column | undefined, n: number): Categories {
  if (!column) return { codes: new Int32Array(n), names: [''] };
  if (column.kind === 'categorical') return { codes: Int32Array.from(column.codes), names: column.dictionary.slice() };
  const values = column.values;
  const distinct = [...new Set(Array.from(values).filter((v) => v === v))].sort((a, b) => a - b);
  const index = new Map(distinct.map((v, i) => [v, i]));
  const codes = new Int32Array(n);
  for (let i = 0; i < n; i++) codes[i] = values[i] === values[i] ? index.get(values[i])! : -1;
  return { codes, names: distinct.map(String) };
}

/**
 * The same categories with missing cells counted as one more category named '' (appended, or
 * merged with an existing '' name), for composition counts where every window must count.
 */
export function withMissingAsValue(c: Categories): Categories {
  let missing = false;
  for (let i = 0; i < c.codes.length; i++) if (c.codes[i] < 0) { missing = true; break; }
  if (!missing) return c;
  let blank = c.names.indexOf('');
  const names = blank >= 0 ? c.names : [...c.names, ''];
  if (blank < 0) blank = names.length - 1;
  const codes = Int32Array.from(c.codes, (v) => (v < 0 ? blank : v));
  return { codes, names };
}
