import { squaredDistance } from '../distance';

/** Pairwise distances of n items, the upper triangle row by row (SciPy's condensed form). */
export type Condensed = Float64Array | Float32Array;

/** Index of the pair (i, j), i ≠ j, in a condensed matrix of n items. */
export function condensedIndex(n: number, i: number, j: number): number {
  if (i > j) { const t = i; i = j; j = t; }
  return n * i - (i * (i + 1)) / 2 + (j - i - 1);
}

/** Above this many items, `condensedDistances` stores single precision (half the memory). */
export const DOUBLE_CONDENSED_MAX = 8192;

/**
 * Euclidean distances of the rows of a row-major n × d matrix, condensed. Float64 up to
 * DOUBLE_CONDENSED_MAX rows (n = 8,192: 256 MiB), Float32 above (n = 20,000: 763 MiB).
 */
export function condensedDistances(data: ArrayLike<number>, n: number, d: number, double = n <= DOUBLE_CONDENSED_MAX): Condensed {
  const size = (n * (n - 1)) / 2;
  const out = double ? new Float64Array(size) : new Float32Array(size);
  let k = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) out[k++] = Math.sqrt(squaredDistance(data, i * d, data, j * d, d));
  }
  return out;
}
