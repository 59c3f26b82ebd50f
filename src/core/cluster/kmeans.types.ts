/** What k-means returns (kmeans.ts), also what its refinement (refine.ts) starts from. */
export interface KMeansResult {
  /** Cluster per window, 0..k-1 (in the order the run produced them). */
  labels: Int32Array;
  centres: Float64Array;
  inertia: number;
  /** Lloyd iterations of the kept run, its refinement included. */
  iterations: number;
  /** Without refinement: the kept run met the tolerance. With it: the refinement reached a fixed point. */
  converged: boolean;
  /** Split–merge moves accepted after the restarts. */
  refinements: number;
}
