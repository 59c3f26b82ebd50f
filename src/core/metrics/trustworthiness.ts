import { OptionError } from '../errors';
import { exactKnnSync } from '../neighbors/exact';
import type { Metric } from '../neighbors/knn.types';
import type { Random } from '../random';
import { sampleIndices } from './sample';

/**
 * Trustworthiness (Venna & Kaski 2001), computed as scikit-learn's sklearn.manifold.trustworthiness:
 * T(k) = 1 − 2 / (n k (2n − 3k − 1)) · Σ_i Σ_{j ∈ U_i(k)} max(0, r(i, j) − k), where U_i(k) are the
 * k nearest neighbours of i in the map and r(i, j) the rank of j among i's neighbours in the
 * original space (1 = nearest). Ties go to the lower index in both spaces. Requires k < n / 2.
 * The map's neighbours are Euclidean; `metric` applies to the original space. O(n² (d + k)).
 */
export function trustworthiness(
  high: Float64Array, n: number, d: number, low: Float32Array | Float64Array, dLow: number, k: number,
  metric: Metric = 'euclidean',
): number {
  if (!Number.isInteger(k) || k < 1 || k >= n / 2) throw new OptionError('k', k, `an integer from 1 to below n / 2 = ${n / 2}`);
  const lowKnn = exactKnnSync(Float64Array.from(low.subarray(0, n * dLow)), n, dLow, k, 'euclidean');
  const row = new Float64Array(n);
  let penalty = 0;
  for (let i = 0; i < n; i++) {
    distanceRow(high, n, d, i, metric, row);
    for (let t = 0; t < k; t++) {
      const j = lowKnn.indices[i * k + t];
      const dj = row[j];
      let rank = 1;
      for (let l = 0; l < n; l++) if (l !== i && (row[l] < dj || (row[l] === dj && l < j))) rank++;
      if (rank > k) penalty += rank - k;
    }
  }
  return 1 - (2 / (n * k * (2 * n - 3 * k - 1))) * penalty;
}

export interface SampleOptions {
  /** Windows drawn (without replacement) when there are more; default 5000. */
  sample?: number;
  random: Random;
  metric?: Metric;
}

/**
 * Trustworthiness of the map restricted to a seeded sample of up to `sample` windows (neighbours
 * and ranks are taken within the sample). Equals `trustworthiness` when n ≤ sample.
 */
export function sampledTrustworthiness(
  high: Float64Array, n: number, d: number, low: Float32Array | Float64Array, dLow: number, k: number,
  options: SampleOptions,
): number {
  const s = sampleRows(high, n, d, low, dLow, options);
  return trustworthiness(s.high, s.n, d, s.low, dLow, k, options.metric);
}

/** The rows of both spaces at a seeded sample of windows (all rows, in order, when n ≤ sample). */
export function sampleRows(
  high: Float64Array, n: number, d: number, low: Float32Array | Float64Array, dLow: number, options: SampleOptions,
): { high: Float64Array; low: Float64Array; n: number } {
  const m = options.sample ?? 5000;
  if (!Number.isInteger(m) || m < 4) throw new OptionError('sample', m, 'an integer of at least 4');
  const idx = sampleIndices(n, m, options.random);
  const h = new Float64Array(idx.length * d);
  const l = new Float64Array(idx.length * dLow);
  idx.forEach((w, r) => {
    h.set(high.subarray(w * d, w * d + d), r * d);
    for (let a = 0; a < dLow; a++) l[r * dLow + a] = low[w * dLow + a];
  });
  return { high: h, low: l, n: idx.length };
}

/** Distances from window i to every window in the metric (squared Euclidean / 1 − cos keep the order). */
function distanceRow(x: Float64Array, n: number, d: number, i: number, metric: Metric, out: Float64Array): void {
  const oi = i * d;
  if (metric === 'cosine') {
    let ni = 0;
    for (let t = 0; t < d; t++) ni += x[oi + t] ** 2;
    for (let j = 0; j < n; j++) {
      let dot = 0, nj = 0;
      for (let t = 0; t < d; t++) { dot += x[oi + t] * x[j * d + t]; nj += x[j * d + t] ** 2; }
      out[j] = ni > 0 && nj > 0 ? 1 - dot / Math.sqrt(ni * nj) : 1;
    }
    return;
  }
  for (let j = 0; j < n; j++) {
    let s = 0;
    for (let t = 0; t < d; t++) { const diff = x[oi + t] - x[j * d + t]; s += diff * diff; }
    out[j] = s;
  }
}
