/** Per-feature statistics over the non-missing values of a row-major n × d matrix. */

/** The present (non-NaN) values of column j among `rows` (all rows when omitted), sorted ascending. */
export function sortedColumn(data: Float64Array, n: number, d: number, j: number, rows?: ArrayLike<number>): Float64Array {
  const m = rows ? rows.length : n;
  const out = new Float64Array(m);
  let c = 0;
  for (let r = 0; r < m; r++) {
    const x = data[(rows ? rows[r] : r) * d + j];
    if (x === x) out[c++] = x;
  }
  return out.subarray(0, c).sort();
}

/**
 * The p-th percentile (0..100) of sorted values, linearly interpolated between closest ranks
 * (h = (m - 1) p / 100; NumPy's default "linear" method, as used by scipy.stats.iqr and
 * scikit-learn's RobustScaler). NaN when there are no values.
 */
export function percentileSorted(sorted: Float64Array, p: number): number {
  const m = sorted.length;
  if (m === 0) return NaN;
  const h = ((m - 1) * p) / 100;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, m - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

export function medianSorted(sorted: Float64Array): number {
  return percentileSorted(sorted, 50);
}

/** Interquartile range (75th minus 25th percentile, linear interpolation). */
export function iqrSorted(sorted: Float64Array): number {
  return percentileSorted(sorted, 75) - percentileSorted(sorted, 25);
}

export interface ColumnMoments {
  count: Float64Array;
  mean: Float64Array;
  /** Variance with ddof 0 (two-pass). */
  variance: Float64Array;
}

/** Count, mean and variance (ddof 0) of every column, missing values left out. */
export function columnMoments(data: Float64Array, n: number, d: number): ColumnMoments {
  const count = new Float64Array(d);
  const mean = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) { mean[j] += x; count[j]++; }
    }
  }
  for (let j = 0; j < d; j++) mean[j] = count[j] > 0 ? mean[j] / count[j] : NaN;
  const variance = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) { const dx = x - mean[j]; variance[j] += dx * dx; }
    }
  }
  for (let j = 0; j < d; j++) variance[j] = count[j] > 0 ? variance[j] / count[j] : NaN;
  return { count, mean, variance };
}

/** Share of the present values taken by the most frequent one (exact equality); NaN when none. */
export function modeShareSorted(sorted: Float64Array): number {
  const m = sorted.length;
  if (m === 0) return NaN;
  let best = 1;
  let run = 1;
  for (let i = 1; i < m; i++) {
    run = sorted[i] === sorted[i - 1] ? run + 1 : 1;
    if (run > best) best = run;
  }
  return best / m;
}

/** Count of missing values per column. */
export function missingPerColumn(data: Float64Array, n: number, d: number): Int32Array {
  const out = new Int32Array(d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) if (data[o + j] !== data[o + j]) out[j]++;
  }
  return out;
}
