/**
 * Cluster-wise Jaccard matching (Hennig 2007, "Cluster-wise assessment of cluster stability",
 * Computational Statistics & Data Analysis 52): each original cluster, restricted to the windows a
 * resample kept, is compared with every cluster of the resample's own clustering, and the largest
 * Jaccard similarity |A ∩ B| / |A ∪ B| is its similarity in that resample.
 */

export interface Matching {
  /** Per original cluster: the best Jaccard similarity over the resample's clusters (0..1). */
  jaccard: Float64Array;
  /** Per original cluster: the resample cluster that gave it (-1 when none overlapped). */
  counterpart: Int32Array;
}

/**
 * `original[i]` and `resample[i]` are the cluster of window i in the run and in the resample, over
 * the windows both clustered (the kept windows); -1 leaves a window out of that side (set-aside
 * noise). Clusters are 0..k−1 and 0..kr−1. A cluster with no kept windows gets similarity 0, as
 * in R fpc's clusterboot (`clujaccard(..., zerobyzero = 0)`, read in fpc 2.2-10).
 * O(n + k·kr).
 */
export function matchClusters(original: Int32Array, resample: Int32Array, k: number, kr: number): Matching {
  if (original.length !== resample.length) throw new Error(`label arrays differ in length: ${original.length} and ${resample.length}`);
  const overlap = new Float64Array(k * kr);
  const sizeA = new Float64Array(k);
  const sizeB = new Float64Array(kr);
  for (let i = 0; i < original.length; i++) {
    const a = original[i], b = resample[i];
    if (a >= k || b >= kr) throw new Error(`window ${i}: cluster ${a >= k ? a : b} out of range`);
    if (a >= 0) sizeA[a]++;
    if (b >= 0) sizeB[b]++;
    if (a >= 0 && b >= 0) overlap[a * kr + b]++;
  }
  const jaccard = new Float64Array(k);
  const counterpart = new Int32Array(k).fill(-1);
  for (let a = 0; a < k; a++) {
    let best = 0, at = -1;
    for (let b = 0; b < kr; b++) {
      const both = overlap[a * kr + b];
      if (both === 0) continue;
      const j = both / (sizeA[a] + sizeB[b] - both);
      if (j > best) { best = j; at = b; }
    }
    jaccard[a] = best;
    counterpart[a] = at;
  }
  return { jaccard, counterpart };
}
