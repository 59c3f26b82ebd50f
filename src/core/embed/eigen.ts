export interface SymmetricEigen {
  /** Eigenvalues, largest first. */
  values: Float64Array;
  /** Eigenvectors as rows, in the order of `values`: vector k is vectors[k * d .. k * d + d). */
  vectors: Float64Array;
}

/**
 * Eigen-decomposition of a symmetric d × d matrix (row-major) by cyclic Jacobi rotations
 * (each rotation zeroes one off-diagonal pair; sweeps repeat until the off-diagonal mass is at
 * rounding level). Accurate for the small d of feature spaces; O(d³) per sweep.
 */
export function symmetricEigen(matrix: Float64Array, d: number, maxSweeps = 100): SymmetricEigen {
  const a = Float64Array.from(matrix);
  const v = new Float64Array(d * d);
  for (let i = 0; i < d; i++) v[i * d + i] = 1;
  let scale = 0;
  for (let i = 0; i < d * d; i++) scale += a[i] * a[i];
  for (let sweep = 0; sweep < maxSweeps; sweep++) {
    let off = 0;
    for (let p = 0; p < d; p++) for (let q = p + 1; q < d; q++) off += a[p * d + q] * a[p * d + q];
    if (off <= 1e-30 * scale || off === 0) break;
    for (let p = 0; p < d - 1; p++) {
      for (let q = p + 1; q < d; q++) {
        const apq = a[p * d + q];
        if (apq === 0) continue;
        const theta = (a[q * d + q] - a[p * d + p]) / (2 * apq);
        const t = (theta >= 0 ? 1 : -1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < d; k++) {
          const akp = a[k * d + p];
          const akq = a[k * d + q];
          a[k * d + p] = c * akp - s * akq;
          a[k * d + q] = s * akp + c * akq;
        }
        for (let k = 0; k < d; k++) {
          const apk = a[p * d + k];
          const aqk = a[q * d + k];
          a[p * d + k] = c * apk - s * aqk;
          a[q * d + k] = s * apk + c * aqk;
        }
        a[p * d + q] = 0;
        a[q * d + p] = 0;
        for (let k = 0; k < d; k++) {
          const vkp = v[k * d + p];
          const vkq = v[k * d + q];
          v[k * d + p] = c * vkp - s * vkq;
          v[k * d + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const order = Array.from({ length: d }, (_, i) => i).sort((i, j) => a[j * d + j] - a[i * d + i] || i - j);
  const values = new Float64Array(d);
  const vectors = new Float64Array(d * d);
  order.forEach((col, k) => {
    values[k] = a[col * d + col];
    for (let i = 0; i < d; i++) vectors[k * d + i] = v[i * d + col];
  });
  return { values, vectors };
}
