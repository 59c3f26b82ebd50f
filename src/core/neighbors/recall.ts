import { OptionError } from '../errors';
import type { Knn, Metric } from './knn.types';
import { metricRows, toMetricDistances } from './rows';

/** Exact neighbours of some rows only (a sample), as needed for a recall figure at large n. */
export interface SampleKnn {
  k: number;
  /** The rows that were searched; omitted when every row 0..n−1 was (a full Knn). */
  rows?: ArrayLike<number>;
  /** rows.length × k neighbour indices, nearest first. */
  indices: Int32Array;
}

/**
 * Recall of an approximate neighbour graph: for each sampled row, the share of its exact k nearest
 * neighbours that the approximate list holds among its first k entries; averaged over the rows.
 */
export function neighbourRecall(approx: Knn, exact: SampleKnn): number {
  const k = exact.k;
  if (k > approx.k) throw new OptionError('k', k, `at most the approximate graph's k = ${approx.k}`);
  const m = exact.rows ? exact.rows.length : approx.n;
  if (m === 0) return 0;
  let found = 0;
  for (let s = 0; s < m; s++) {
    const row = exact.rows ? exact.rows[s] : s;
    const a = row * approx.k;
    for (let t = 0; t < k; t++) {
      const want = exact.indices[s * k + t];
      for (let u = 0; u < k; u++) {
        if (approx.indices[a + u] === want) {
          found++;
          break;
        }
      }
    }
  }
  return found / (m * k);
}

/**
 * Exact k nearest neighbours (self excluded, nearest first, ties to the lower index) of the given
 * rows by brute force against all n rows: O(rows · n · d), for recall figures on a sample.
 */
export function exactKnnOfRows(
  data: Float64Array, n: number, d: number, rows: ArrayLike<number>, k: number, metric: Metric,
): SampleKnn & { distances: Float64Array } {
  if (!Number.isInteger(k) || k < 1 || k > n - 1) throw new OptionError('k', k, `an integer from 1 to n - 1 = ${n - 1}`);
  const x = metricRows(data, n, d, metric);
  const m = rows.length;
  const indices = new Int32Array(m * k);
  const distances = new Float64Array(m * k);
  const bestD = new Float64Array(k);
  const bestI = new Int32Array(k);
  for (let s = 0; s < m; s++) {
    const q = rows[s];
    const oq = q * d;
    bestD.fill(Infinity);
    bestI.fill(-1);
    for (let j = 0; j < n; j++) {
      if (j === q) continue;
      let sum = 0;
      const oj = j * d;
      for (let t = 0; t < d; t++) {
        const diff = x[oq + t] - x[oj + t];
        sum += diff * diff;
      }
      // Sorted insertion into the k best; rows come in index order, so ties keep the lower index.
      if (!(sum < bestD[k - 1])) continue;
      let p = k - 1;
      while (p > 0 && bestD[p - 1] > sum) {
        bestD[p] = bestD[p - 1];
        bestI[p] = bestI[p - 1];
        p--;
      }
      bestD[p] = sum;
      bestI[p] = j;
    }
    indices.set(bestI, s * k);
    distances.set(bestD, s * k);
  }
  toMetricDistances(distances, metric);
  return { k, rows: Int32Array.from(rows), indices, distances };
}
