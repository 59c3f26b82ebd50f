import { medianSorted, percentileSorted, sortedColumn } from '../recipe/column-stats';

/** Scale factor making the MAD a consistent estimate of a normal SD (common practice: 1/Φ⁻¹(3/4)). */
export const MAD_TO_SD = 1.482602218505602;

export interface ExtremeCount {
  count: number;
  maxRobustZ: number;
  /** Every present value is >= 0 (a log1p transform is defined). */
  nonNegative: boolean;
}

/**
 * Windows of feature j whose robust z-score |x - median| / (1.4826 · MAD) exceeds `limit`. When
 * the MAD is 0 the IQR / 1.349 stands in; when both are 0 the feature is near-constant and no
 * value counts as extreme here.
 */
export function extremeCount(data: Float64Array, n: number, d: number, j: number, limit: number): ExtremeCount {
  const sorted = sortedColumn(data, n, d, j);
  const m = sorted.length;
  if (m === 0) return { count: 0, maxRobustZ: 0, nonNegative: true };
  const median = medianSorted(sorted);
  const dev = new Float64Array(m);
  for (let r = 0; r < m; r++) dev[r] = Math.abs(sorted[r] - median);
  dev.sort();
  let scale = MAD_TO_SD * medianSorted(dev);
  if (!(scale > 0)) scale = (percentileSorted(sorted, 75) - percentileSorted(sorted, 25)) / 1.349;
  if (!(scale > 0)) return { count: 0, maxRobustZ: 0, nonNegative: sorted[0] >= 0 };
  let count = 0;
  for (let r = 0; r < m; r++) if (dev[r] / scale > limit) count++;
  return { count, maxRobustZ: dev[m - 1] / scale, nonNegative: sorted[0] >= 0 };
}
