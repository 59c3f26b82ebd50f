/** Counts of each feature's values per cluster over shared bins (for small distribution plots). */
export interface FeatureHistograms {
  bins: number;
  k: number;
  d: number;
  /** Per feature: lower and upper edge of the binned range (the 1st and 99th percentile). */
  lo: Float64Array;
  hi: Float64Array;
  /** k × d × bins: windows of cluster c with feature j in bin b at [(c * d + j) * bins + b]. */
  counts: Float64Array;
}

/** Values below `lo` count in the first bin and above `hi` in the last; missing values and unclustered windows are left out. */
export function featureHistograms(data: ArrayLike<number>, n: number, d: number, labels: ArrayLike<number>, k: number, bins: number): FeatureHistograms {
  if (!Number.isInteger(bins) || bins < 1) throw new Error(`bins must be a whole number of at least 1, got ${bins}`);
  const lo = new Float64Array(d), hi = new Float64Array(d);
  const counts = new Float64Array(k * d * bins);
  const column = new Float64Array(n);
  for (let j = 0; j < d; j++) {
    let m = 0;
    for (let i = 0; i < n; i++) {
      const c = labels[i], x = data[i * d + j];
      if (c >= 0 && c < k && x === x) column[m++] = x;
    }
    const sorted = column.subarray(0, m).sort();
    lo[j] = m > 0 ? sorted[Math.floor(0.01 * (m - 1))] : NaN;
    hi[j] = m > 0 ? sorted[Math.ceil(0.99 * (m - 1))] : NaN;
    const span = hi[j] - lo[j];
    for (let i = 0; i < n; i++) {
      const c = labels[i], x = data[i * d + j];
      if (c < 0 || c >= k || x !== x) continue;
      const b = span > 0 ? Math.min(bins - 1, Math.max(0, Math.floor(((x - lo[j]) / span) * bins))) : 0;
      counts[(c * d + j) * bins + b]++;
    }
  }
  return { bins, k, d, lo, hi, counts };
}
