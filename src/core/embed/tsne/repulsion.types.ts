/** A way to compute the repulsive half of the t-SNE gradient. */
export interface Repulsion {
  /**
   * Writes Σ_{j≠i} w_ij² (y_i − y_j) for every i into `out` (n × 2) and returns
   * Z = Σ_i Σ_{j≠i} w_ij, with w_ij = 1 / (1 + |y_i − y_j|²); y is n × 2 interleaved.
   */
  compute(y: Float64Array, n: number, out: Float64Array): number;
}
