/** Distance between windows: Euclidean, or cosine distance 1 − cos(a, b). */
export type Metric = 'euclidean' | 'cosine';

/** k nearest neighbours of every window, row-major n × k. */
export interface Knn {
  n: number;
  k: number;
  /** n × k neighbour indices, self excluded, nearest first (ties: lower index first). */
  indices: Int32Array;
  /** n × k distances in the metric (Euclidean: not squared), matching `indices`. */
  distances: Float64Array;
}
