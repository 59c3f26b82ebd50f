import { contingency } from './contingency';
import { margins } from './entropy';

/** Mutual information, in nats, of the two labellings cross-tabulated in `counts`. */
export function mutualInfoFromCounts(counts: readonly (readonly number[])[]): number {
  const { rows, cols, total } = margins(counts);
  if (total <= 0) return 0;
  let mi = 0;
  counts.forEach((row, i) => row.forEach((v, j) => {
    if (v > 0) mi += (v / total) * Math.log((v * total) / (rows[i] * cols[j]));
  }));
  return mi > 0 ? mi : 0;
}

/** Mutual information, in nats, between two labellings of the same windows. */
export function mutualInfo(a: ArrayLike<number>, b: ArrayLike<number>): number {
  return mutualInfoFromCounts(contingency(a, b).counts);
}
