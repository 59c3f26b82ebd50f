import { squaredDistance } from './distance';

/**
 * Per-window confidence 1 - d1/d2 from the distances to the nearest (d1) and second-nearest (d2)
 * centre: 0 on the boundary between two clusters, near 1 close to a centre. 0 when d2 is 0.
 */
export function centreConfidence(data: Float64Array, n: number, d: number, centres: Float64Array, k: number): Float32Array {
  const out = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    let d1 = Infinity;
    let d2 = Infinity;
    for (let c = 0; c < k; c++) {
      const dist = squaredDistance(data, i * d, centres, c * d, d);
      if (dist < d1) { d2 = d1; d1 = dist; } else if (dist < d2) d2 = dist;
    }
    out[i] = d2 > 0 && Number.isFinite(d2) ? 1 - Math.sqrt(d1) / Math.sqrt(d2) : 0;
  }
  return out;
}
