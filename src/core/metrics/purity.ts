import { contingency } from './contingency';

/**
 * Purity of clusters against classes: each cluster counts the windows of its most frequent
 * class; the sum over clusters, divided by the number of windows. 1 when every cluster holds one
 * class; NaN for no windows. `counts` rows are clusters, columns classes.
 */
export function purityFromCounts(counts: readonly (readonly number[])[]): number {
  let total = 0;
  let kept = 0;
  for (const row of counts) {
    let max = 0;
    for (const v of row) { total += v; if (v > max) max = v; }
    kept += max;
  }
  return total > 0 ? kept / total : NaN;
}

/** Purity of `clusters` against `classes` (not symmetric). */
export function purity(clusters: ArrayLike<number>, classes: ArrayLike<number>): number {
  return purityFromCounts(contingency(clusters, classes).counts);
}
