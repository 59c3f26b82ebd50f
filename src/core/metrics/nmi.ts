import { contingency } from './contingency';
import { entropyOfCounts, margins } from './entropy';
import { mutualInfoFromCounts } from './mutual-info';

/**
 * Normalized mutual information of a contingency table, normalized by the arithmetic mean of the
 * two entropies: 1 for identical partitions up to renaming (and when both labellings hold a single
 * value), 0 for independent ones (and when only one labelling holds a single value).
 */
export function nmiFromCounts(counts: readonly (readonly number[])[]): number {
  const { rows, cols } = margins(counts);
  const nonEmptyRows = rows.filter((v) => v > 0).length;
  const nonEmptyCols = cols.filter((v) => v > 0).length;
  if (nonEmptyRows === nonEmptyCols && nonEmptyRows <= 1) return 1;
  const mi = mutualInfoFromCounts(counts);
  if (mi <= 0) return 0;
  const normalizer = (entropyOfCounts(rows) + entropyOfCounts(cols)) / 2;
  return Math.min(1, mi / normalizer);
}

/** Normalized mutual information (arithmetic-mean normalization) between two labellings. */
export function normalizedMutualInfo(a: ArrayLike<number>, b: ArrayLike<number>): number {
  return nmiFromCounts(contingency(a, b).counts);
}
