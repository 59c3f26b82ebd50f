import type { Metric } from './knn.types';

/**
 * The rows a neighbour search works on: the data itself for Euclidean, unit-length copies for
 * cosine (a zero row stays zero). On unit rows the squared Euclidean distance is 2 − 2 cos, a
 * monotone map of the cosine distance 1 − cos, so one kernel serves both metrics.
 */
export function metricRows(data: Float64Array, n: number, d: number, metric: Metric): Float64Array {
  if (metric === 'euclidean') return data;
  const out = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let t = 0; t < d; t++) s += data[i * d + t] ** 2;
    const inv = s > 0 ? 1 / Math.sqrt(s) : 0;
    for (let t = 0; t < d; t++) out[i * d + t] = data[i * d + t] * inv;
  }
  return out;
}

/** Squared Euclidean distances on metric rows → distances in the metric, in place. */
export function toMetricDistances(squared: Float64Array, metric: Metric): void {
  for (let t = 0; t < squared.length; t++) {
    squared[t] = metric === 'cosine' ? squared[t] / 2 : Math.sqrt(squared[t]);
  }
}
