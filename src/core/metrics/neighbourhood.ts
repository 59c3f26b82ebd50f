import { OptionError } from '../errors';
import { exactKnnSync } from '../neighbors/exact';
import type { Metric } from '../neighbors/knn.types';
import { sampleRows, type SampleOptions } from './trustworthiness';

/**
 * Neighbourhood preservation: the mean over windows of the fraction of each window's k nearest
 * neighbours in the original space (in `metric`) that are also among its k nearest in the map
 * (Euclidean). 1 = every neighbourhood kept; about k / n for a random map.
 */
export function neighbourhoodPreservation(
  high: Float64Array, n: number, d: number, low: Float32Array | Float64Array, dLow: number, k: number,
  metric: Metric = 'euclidean',
): number {
  if (!Number.isInteger(k) || k < 1 || k > n - 1) throw new OptionError('k', k, `an integer from 1 to n - 1 = ${n - 1}`);
  const a = exactKnnSync(high, n, d, k, metric);
  const b = exactKnnSync(Float64Array.from(low.subarray(0, n * dLow)), n, dLow, k, 'euclidean');
  const mark = new Int32Array(n).fill(-1);
  let kept = 0;
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < k; t++) mark[a.indices[i * k + t]] = i;
    for (let t = 0; t < k; t++) if (mark[b.indices[i * k + t]] === i) kept++;
  }
  return kept / (n * k);
}

/** Neighbourhood preservation within a seeded sample of up to `sample` windows (default 5000). */
export function sampledNeighbourhoodPreservation(
  high: Float64Array, n: number, d: number, low: Float32Array | Float64Array, dLow: number, k: number,
  options: SampleOptions,
): number {
  const s = sampleRows(high, n, d, low, dLow, options);
  return neighbourhoodPreservation(s.high, s.n, d, s.low, dLow, k, options.metric);
}
