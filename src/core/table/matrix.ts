import type { FeatureMatrix } from '../analysis.types';
import { InputError } from '../errors';
import type { Roles } from './roles.types';
import type { NumericColumn, Table } from './table';

/** Fewest windows an analysis can cluster. */
export const MIN_WINDOWS = 2;

/**
 * Gathers the feature columns (role "feature", in table order) into a row-major matrix; missing
 * values stay NaN for the recipe to handle. Fails when there is no feature column, when a
 * feature column is text, when one has no value at all, or when there are fewer than MIN_WINDOWS windows.
 */
export function featureMatrix(table: Table, roles: Roles): FeatureMatrix {
  const byName = new Map(table.columns.map((c) => [c.name, c]));
  const features: NumericColumn[] = [];
  for (const r of roles) {
    if (r.role !== 'feature') continue;
    const column = byName.get(r.name);
    if (!column) {
      throw new InputError({ file: table.fileName, column: r.name, expected: 'a column of this name (the roles do not match the table)' });
    }
    if (column.kind !== 'numeric') {
      throw new InputError({ file: table.fileName, column: r.name, expected: 'numbers in a feature column', found: `text such as "${column.dictionary[0] ?? ''}"` });
    }
    features.push(column);
  }
  if (features.length === 0) {
    throw new InputError({ file: table.fileName, expected: 'at least one numeric feature column', found: 'no column with the role "feature"' });
  }
  const n = table.nRows;
  const d = features.length;
  const data = new Float64Array(n * d);
  features.forEach((column, j) => {
    const v = column.values;
    let present = 0;
    for (let i = 0; i < n; i++) {
      const x = v[i];
      if (x === x) present++;
      data[i * d + j] = x;
    }
    if (present === 0) {
      throw new InputError({
        file: table.fileName,
        column: column.name,
        expected: 'at least one value in a feature column (give the column the role "ignore" to leave it out)',
        found: 'only missing values',
      });
    }
  });
  if (n < MIN_WINDOWS) {
    throw new InputError({ file: table.fileName, row: n + 1, expected: `at least ${MIN_WINDOWS} windows (data rows) to cluster`, found: `${n} window${n === 1 ? '' : 's'}` });
  }
  return { data, n, d, featureNames: features.map((c) => c.name) };
}
