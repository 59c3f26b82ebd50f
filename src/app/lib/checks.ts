import type { FeatureMatrix } from '../../core/analysis.types';
import { InputError } from '../../core/errors';
import { featureMatrix } from '../../core/table/matrix';
import type { Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';

/**
 * The feature matrix of a table, refused with an InputError naming the file when it cannot be
 * clustered at all (no usable feature, fewer than 2 windows). Same rule as the CLI's.
 */
export function clusterableMatrix(table: Table, roles: Roles): FeatureMatrix {
  const matrix = featureMatrix(table, roles);
  if (matrix.n < 2) {
    throw new InputError({ file: table.fileName, expected: 'at least 2 windows (data rows) to cluster', found: `${matrix.n} window` });
  }
  return matrix;
}
