import { entropyOfCounts } from '../metrics/entropy';
import type { Categories } from './categories';

/** Windows of one value of the column inside one cluster. */
export interface ValueCount {
  value: string;
  windows: number;
}

/** The mix of one categorical column's values inside one cluster. */
export interface ClusterMix {
  id: number;
  size: number;
  /** Most frequent value ('' when the cluster is empty); ties go to the first name in sort order. */
  top: string;
  /** Share of the cluster's windows holding the top value (0 when empty). */
  topShare: number;
  /** Distinct values present in the cluster. */
  values: number;
  /** exp(Shannon entropy) of the value shares: how many values the cluster holds in effect (0 when empty). */
  effectiveValues: number;
  /**
   * Shannon entropy of the value shares divided by ln(distinct values in the whole table): 1 when
   * the cluster spreads evenly over every value of the cohort, 0 when it holds one value.
   */
  entropy: number;
  /** Windows per value, most first (ties by value name). */
  byValue: ValueCount[];
}

/** How the column's values spread over all windows (of clusters 0..k-1). */
export interface CohortMix {
  windows: number;
  values: number;
  effectiveValues: number;
}

export interface MixTable {
  clusters: ClusterMix[];
  cohort: CohortMix;
  /** counts[c][v]: windows of cluster c holding value v (category code order). */
  counts: number[][];
}

/**
 * Cross-tabulates clusters 0..k-1 against a categorical column (windows with a cluster outside
 * 0..k-1, such as set-aside windows, and windows with a missing code are left out).
 */
export function clusterMix(labels: ArrayLike<number>, k: number, cats: Categories): MixTable {
  const v = cats.names.length;
  const counts = Array.from({ length: k }, () => new Array<number>(v).fill(0));
  const totals = new Array<number>(v).fill(0);
  for (let i = 0; i < labels.length; i++) {
    const c = labels[i];
    const code = cats.codes[i];
    if (c < 0 || c >= k || code < 0) continue;
    counts[c][code]++;
    totals[code]++;
  }
  const present = totals.filter((t) => t > 0).length;
  const scale = present > 1 ? Math.log(present) : 0;
  const clusters = counts.map((row, id): ClusterMix => {
    const byValue = row
      .map((windows, code) => ({ value: cats.names[code], windows }))
      .filter((e) => e.windows > 0)
      .sort((a, b) => b.windows - a.windows || (a.value < b.value ? -1 : a.value > b.value ? 1 : 0));
    const size = byValue.reduce((s, e) => s + e.windows, 0);
    const h = entropyOfCounts(row);
    return {
      id,
      size,
      top: byValue[0]?.value ?? '',
      topShare: size > 0 ? byValue[0].windows / size : 0,
      values: byValue.length,
      effectiveValues: size > 0 ? Math.exp(h) : 0,
      entropy: scale > 0 ? h / scale : 0,
      byValue,
    };
  });
  const windows = totals.reduce((s, t) => s + t, 0);
  return {
    clusters,
    cohort: { windows, values: present, effectiveValues: windows > 0 ? Math.exp(entropyOfCounts(totals)) : 0 },
    counts,
  };
}
