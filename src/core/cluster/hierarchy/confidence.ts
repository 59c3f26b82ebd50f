import { centreConfidence } from '../confidence';

/**
 * Per-window confidence of a flat cut, the same definition as for k-means: 1 − d1/d2 with d1, d2
 * the distances to the nearest and second-nearest cluster centroid (centroids of the cut's
 * clusters). O(n k d), defined for every window at any n; 0 on a boundary, near 1 at a centroid.
 */
export function cutConfidence(data: Float64Array, n: number, d: number, labels: Int32Array): Float32Array {
  let k = 0;
  for (let i = 0; i < n; i++) if (labels[i] + 1 > k) k = labels[i] + 1;
  const centres = new Float64Array(k * d);
  const counts = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    counts[c]++;
    for (let j = 0; j < d; j++) centres[c * d + j] += data[i * d + j];
  }
  for (let c = 0; c < k; c++) for (let j = 0; j < d; j++) centres[c * d + j] /= counts[c] || 1;
  return centreConfidence(data, n, d, centres, k);
}
