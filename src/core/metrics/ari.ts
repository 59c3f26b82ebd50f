import { contingency } from './contingency';

/**
 * Pair confusion matrix [[tn, fp], [fn, tp]] over ordered pairs of distinct windows: tp = pairs
 * together in both labellings, tn = apart in both, fn = together in a only, fp = together in b only.
 */
export function pairConfusion(a: ArrayLike<number>, b: ArrayLike<number>): [[number, number], [number, number]] {
  const { counts } = contingency(a, b);
  const n = a.length;
  let sumSquares = 0;
  const rowSums: number[] = [];
  const colSums = new Array<number>(counts[0]?.length ?? 0).fill(0);
  for (const row of counts) {
    let rs = 0;
    row.forEach((v, c) => { sumSquares += v * v; rs += v; colSums[c] += v; });
    rowSums.push(rs);
  }
  const sq = (xs: number[]) => xs.reduce((s, x) => s + x * x, 0);
  const tp = sumSquares - n;
  const fp = sq(colSums) - sumSquares;
  const fn = sq(rowSums) - sumSquares;
  const tn = n * n - fp - fn - sumSquares;
  return [[tn, fp], [fn, tp]];
}

/** Rand index: share of window pairs on which the two labellings agree. */
export function randIndex(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const [[tn, fp], [fn, tp]] = pairConfusion(a, b);
  const total = tn + fp + fn + tp;
  return total === 0 ? 1 : (tn + tp) / total;
}

/**
 * Adjusted Rand index (Hubert & Arabie): 1 for identical partitions up to renaming, about 0 for
 * chance agreement, negative below chance. Two labellings that both put every window together,
 * or both apart, score 1.
 */
export function adjustedRandIndex(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const [[tn, fp], [fn, tp]] = pairConfusion(a, b);
  if (fn === 0 && fp === 0) return 1;
  return (2 * (tp * tn - fn * fp)) / ((tp + fn) * (fn + tn) + (tp + fp) * (fp + tn));
}
