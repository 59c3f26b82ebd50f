export interface ClusterMeans {
  /** Distinct clusters found. */
  k: number;
  /** Cluster of each window as 0..k-1, in order of first appearance. */
  codes: Int32Array;
  counts: Float64Array;
  /** Centroids, row-major k × d. */
  means: Float64Array;
}

/** Centroid and size of every cluster present in `labels` (any integers). */
export function clusterMeans(data: ArrayLike<number>, n: number, d: number, labels: ArrayLike<number>): ClusterMeans {
  if (data.length !== n * d || labels.length !== n) {
    throw new Error(`cluster metrics: ${data.length} values and ${labels.length} labels do not fit n = ${n}, d = ${d}`);
  }
  const ids = new Map<number, number>();
  const codes = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let c = ids.get(labels[i]);
    if (c === undefined) { c = ids.size; ids.set(labels[i], c); }
    codes[i] = c;
  }
  const k = ids.size;
  const counts = new Float64Array(k);
  const means = new Float64Array(k * d);
  for (let i = 0; i < n; i++) {
    const co = codes[i] * d;
    counts[codes[i]]++;
    for (let j = 0; j < d; j++) means[co + j] += data[i * d + j];
  }
  for (let c = 0; c < k; c++) for (let j = 0; j < d; j++) means[c * d + j] /= counts[c];
  return { k, codes, counts, means };
}
