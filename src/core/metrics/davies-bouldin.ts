import { clusterMeans } from './cluster-means';

/**
 * Davies–Bouldin index: the mean over clusters of max over other clusters of (sᵢ + sⱼ) / ‖cᵢ − cⱼ‖,
 * sᵢ the mean Euclidean distance of cluster i's windows to its centroid (lower is better). As in
 * scikit-learn: coinciding centroids do not count (their ratio is dropped), and the index is 0
 * when every sᵢ or every centroid distance is 0. NaN when k < 2 or k ≥ n.
 */
export function daviesBouldin(data: ArrayLike<number>, n: number, d: number, labels: ArrayLike<number>): number {
  const { k, codes, counts, means } = clusterMeans(data, n, d, labels);
  if (k < 2 || k >= n) return NaN;
  const scatter = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const co = codes[i] * d;
    let s = 0;
    for (let j = 0; j < d; j++) { const t = data[i * d + j] - means[co + j]; s += t * t; }
    scatter[codes[i]] += Math.sqrt(s);
  }
  let anyScatter = false;
  for (let c = 0; c < k; c++) { scatter[c] /= counts[c]; if (scatter[c] !== 0) anyScatter = true; }
  const centreDist = new Float64Array(k * k);
  let anyApart = false;
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k; b++) {
      let s = 0;
      for (let j = 0; j < d; j++) { const t = means[a * d + j] - means[b * d + j]; s += t * t; }
      centreDist[a * k + b] = centreDist[b * k + a] = Math.sqrt(s);
      if (s !== 0) anyApart = true;
    }
  }
  if (!anyScatter || !anyApart) return 0;
  let total = 0;
  for (let a = 0; a < k; a++) {
    let worst = 0;
    for (let b = 0; b < k; b++) {
      const m = centreDist[a * k + b];
      if (b === a || m === 0) continue;
      const r = (scatter[a] + scatter[b]) / m;
      if (r > worst) worst = r;
    }
    total += worst;
  }
  return total / k;
}
