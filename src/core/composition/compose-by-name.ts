import { InputError } from '../errors';
import { findColumn, type Column, type Table } from '../table/table';
import type { BoundRule } from './bound-rule';
import { categoriesOf } from './categories';
import { composeColumn, type ColumnComposition } from './compose-column';

/** More distinct values than this and a column is not read as categories (ids, times, measurements). */
export const MAX_CATEGORIES = 1000;

/**
 * The column a user named for a composition (device, site, group), checked: it must exist and
 * hold at most MAX_CATEGORIES distinct values. Throws InputError naming the file and column.
 */
export function categoricalColumn(table: Table, name: string): Column {
  const column = findColumn(table, name);
  if (!column) {
    const names = table.columns.map((c) => c.name).join(', ');
    throw new InputError({ file: table.fileName, column: name, expected: `a column of this name to compose by (columns: ${names})`, found: 'no such column' });
  }
  const distinct = categoriesOf(column, table.nRows).names.length;
  if (distinct > MAX_CATEGORIES) {
    throw new InputError({
      file: table.fileName, column: name,
      expected: `a categorical column (at most ${MAX_CATEGORIES} distinct values) to compose by`,
      found: `${distinct} distinct values`,
    });
  }
  return column;
}

/** composeColumn for a column named by the user; the column name is the noun in reasons. */
export function composeByName(table: Table, labels: ArrayLike<number>, k: number, name: string, rule: Partial<BoundRule> = {}): ColumnComposition {
  return composeColumn(labels, k, categoricalColumn(table, name), rule, name);
}
