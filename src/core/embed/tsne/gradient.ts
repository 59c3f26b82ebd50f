import { upperPairs, type Affinities } from './affinities';
import type { Repulsion } from './repulsion.types';

/** Work arrays of the gradient, allocated once per run. */
export interface GradientBuffers {
  attract: Float64Array;
  repel: Float64Array;
  /**
   * P's pairs above the diagonal (upperPairs), kept for the P they were taken from, and Σ p log p
   * (constant while P is), summed at the first cost.
   */
  pairs?: { of: Affinities; upper: Affinities; plogp?: number };
}

export function gradientBuffers(n: number): GradientBuffers {
  return { attract: new Float64Array(2 * n), repel: new Float64Array(2 * n) };
}

/**
 * t-SNE gradient into `grad` (n × 2): 4 · (exaggeration · Σ_j p_ij w_ij (y_i − y_j)
 * − Σ_j w_ij² (y_i − y_j) / Z), with w_ij = 1 / (1 + |y_i − y_j|²) and Z = Σ_{k≠l} w_kl; the
 * repulsive sums come from `repulsion` (Barnes–Hut or FFT interpolation), the attractive ones from
 * one pass over the pairs of the (symmetric) sparse P above its diagonal. Returns Z, and when
 * `wantCost` the KL divergence KL(P ‖ Q) of the un-exaggerated P.
 */
export function gradient(
  y: Float64Array, p: Affinities, repulsion: Repulsion, exaggeration: number,
  grad: Float64Array, buf: GradientBuffers, wantCost: boolean,
): { z: number; cost: number | undefined } {
  const z = repulsion.compute(y, p.n, buf.repel);
  return gradientAfterRepulsion(y, p, z, exaggeration, grad, buf, wantCost);
}

/**
 * The rest of `gradient` once the repulsion has filled `buf.repel` and returned Z (so that a driver
 * can pause between the two halves of a step): attraction, the gradient and, when asked, the cost.
 */
export function gradientAfterRepulsion(
  y: Float64Array, p: Affinities, z: number, exaggeration: number,
  grad: Float64Array, buf: GradientBuffers, wantCost: boolean,
): { z: number; cost: number | undefined } {
  const n = p.n;
  const { attract } = buf;
  // P is symmetric: each pair is visited once (j > i) and its force applied to both windows.
  if (buf.pairs?.of !== p) buf.pairs = { of: p, upper: upperPairs(p) };
  const { rowStart, columns, values } = buf.pairs.upper;
  attract.fill(0);
  const pairs = buf.pairs;
  const needPlogp = wantCost && pairs.plogp === undefined;
  let plogp = 0;
  let plogw = 0;
  for (let i = 0; i < n; i++) {
    const yi = y[2 * i], yj = y[2 * i + 1];
    let fx = 0, fy = 0;
    for (let e = rowStart[i]; e < rowStart[i + 1]; e++) {
      const j = columns[e];
      const dx = yi - y[2 * j], dy = yj - y[2 * j + 1];
      const w = 1 / (1 + dx * dx + dy * dy);
      const f = values[e] * w;
      const gx = f * dx, gy = f * dy;
      fx += gx; fy += gy;
      attract[2 * j] -= gx; attract[2 * j + 1] -= gy;
      if (wantCost && values[e] > 0) {
        if (needPlogp) plogp += values[e] * Math.log(values[e]);
        plogw += values[e] * Math.log(w);
      }
    }
    attract[2 * i] += fx; attract[2 * i + 1] += fy;
  }
  // Each pair stands for p_ij and p_ji.
  if (needPlogp) pairs.plogp = 2 * plogp;
  plogw *= 2;
  const { repel } = buf;
  const invZ = 1 / z;
  for (let t = 0; t < 2 * n; t++) grad[t] = 4 * (exaggeration * attract[t] - repel[t] * invZ);
  // KL = Σ p log p − Σ p log w + log Z, as Σ p = 1.
  return { z, cost: wantCost ? (pairs.plogp as number) - plogw + Math.log(z) : undefined };
}
