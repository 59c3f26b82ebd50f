import { clusterMeans } from './cluster-means';

/**
 * Calinski–Harabasz index (variance ratio): [B / (k − 1)] / [W / (n − k)], B the between-cluster
 * and W the within-cluster sum of squares. 1 when W = 0 (all windows equal their cluster mean),
 * as scikit-learn defines it. NaN when k < 2 or k ≥ n (undefined). Labels may be any integers.
 */
export function calinskiHarabasz(data: ArrayLike<number>, n: number, d: number, labels: ArrayLike<number>): number {
  const { k, codes, counts, means } = clusterMeans(data, n, d, labels);
  if (k < 2 || k >= n) return NaN;
  const overall = new Float64Array(d);
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) overall[j] += data[i * d + j];
  for (let j = 0; j < d; j++) overall[j] /= n;
  let between = 0;
  for (let c = 0; c < k; c++) {
    let s = 0;
    for (let j = 0; j < d; j++) { const t = means[c * d + j] - overall[j]; s += t * t; }
    between += counts[c] * s;
  }
  let within = 0;
  for (let i = 0; i < n; i++) {
    const co = codes[i] * d;
    for (let j = 0; j < d; j++) { const t = data[i * d + j] - means[co + j]; within += t * t; }
  }
  return within === 0 ? 1 : (between * (n - k)) / (within * (k - 1));
}
