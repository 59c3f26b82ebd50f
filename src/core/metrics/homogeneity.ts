import { contingency } from './contingency';
import { entropyOfCounts, margins } from './entropy';
import { mutualInfoFromCounts } from './mutual-info';

export interface HomogeneityScores {
  /** Each cluster holds members of one class only: I(C;K) / H(C), 1 when H(C) = 0. */
  homogeneity: number;
  /** All members of a class sit in one cluster: I(C;K) / H(K), 1 when H(K) = 0. */
  completeness: number;
  /** Harmonic mean of the two (beta = 1); 0 when both are 0. */
  vMeasure: number;
}

/** Homogeneity, completeness and V-measure of a table with classes as rows, clusters as columns. */
export function homogeneityFromCounts(counts: readonly (readonly number[])[]): HomogeneityScores {
  const { rows, cols } = margins(counts);
  const hClasses = entropyOfCounts(rows);
  const hClusters = entropyOfCounts(cols);
  const mi = mutualInfoFromCounts(counts);
  const homogeneity = hClasses > 0 ? Math.min(1, mi / hClasses) : 1;
  const completeness = hClusters > 0 ? Math.min(1, mi / hClusters) : 1;
  const sum = homogeneity + completeness;
  return { homogeneity, completeness, vMeasure: sum > 0 ? (2 * homogeneity * completeness) / sum : 0 };
}

/** Homogeneity, completeness and V-measure of `clusters` against the true `classes`. */
export function homogeneityCompleteness(classes: ArrayLike<number>, clusters: ArrayLike<number>): HomogeneityScores {
  return homogeneityFromCounts(contingency(classes, clusters).counts);
}
