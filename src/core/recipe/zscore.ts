/** What z-scoring did, for the recipe record. */
export interface ZScoreEffect {
  /** Indices of features with zero spread (or no values), set to 0. */
  constantFeatures: number[];
  /** Per-feature mean and standard deviation (ddof 0) over the non-missing values. */
  means: Float64Array;
  stds: Float64Array;
}

/**
 * Standardizes each column of a row-major n × d matrix in place: (x - mean) / sd with ddof 0,
 * missing values (NaN) left out of both and kept NaN. Columns with zero spread become 0.
 */
export function zscoreInPlace(data: Float64Array, n: number, d: number): ZScoreEffect {
  const sums = new Float64Array(d);
  const counts = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) { sums[j] += x; counts[j]++; }
    }
  }
  const means = new Float64Array(d);
  for (let j = 0; j < d; j++) means[j] = counts[j] > 0 ? sums[j] / counts[j] : NaN;
  // Second pass on deviations (two-pass variance, stable for large offsets).
  const ss = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) { const dx = x - means[j]; ss[j] += dx * dx; }
    }
  }
  const stds = new Float64Array(d);
  const scale = new Float64Array(d);
  const constantFeatures: number[] = [];
  for (let j = 0; j < d; j++) {
    stds[j] = counts[j] > 0 ? Math.sqrt(ss[j] / counts[j]) : NaN;
    // Spread at rounding level relative to the mean counts as constant.
    const tiny = 1e-12 * Math.max(1, Math.abs(means[j]));
    if (!(stds[j] > tiny)) { constantFeatures.push(j); scale[j] = 0; } else scale[j] = 1 / stds[j];
  }
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) data[o + j] = scale[j] === 0 ? 0 : (x - means[j]) * scale[j];
    }
  }
  return { constantFeatures, means, stds };
}
