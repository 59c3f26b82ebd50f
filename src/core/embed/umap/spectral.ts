import { quietContext, type JobContext } from '../../job';
import { normal, type Random } from '../../random';
import { symmetricEigen } from '../eigen';
import type { SparseGraph } from './fuzzy-graph';

/** Vectors iterated together: the 2 wanted plus guards that speed up convergence. */
const BLOCK = 4;
const MAX_ITERATIONS = 150;
const CHECK_EVERY = 10;
const TOLERANCE = 1e-6;

/**
 * Spectral starting layout: the eigenvectors of the normalized graph Laplacian
 * I − D^−1/2 W D^−1/2 with the 2 smallest non-trivial eigenvalues, found as the dominant
 * eigenvectors of (I + D^−1/2 W D^−1/2) / 2 by block subspace iteration with Rayleigh–Ritz,
 * the trivial vector D^1/2·1 projected out. Seeded start; returns n × 2 row-major, or null when
 * the iteration breaks down (the caller then starts from PCA or at random).
 */
export async function spectralLayout(
  graph: SparseGraph, random: Random, ctx: JobContext = quietContext,
): Promise<Float64Array | null> {
  const { n, rowStart, cols, weights } = graph;
  if (n < BLOCK + 2) return null;
  const invSqrtDeg = new Float64Array(n);
  const trivial = new Float64Array(n);
  let norm = 0;
  for (let i = 0; i < n; i++) {
    let deg = 0;
    for (let e = rowStart[i]; e < rowStart[i + 1]; e++) deg += weights[e];
    invSqrtDeg[i] = deg > 0 ? 1 / Math.sqrt(deg) : 0;
    trivial[i] = Math.sqrt(deg);
    norm += deg;
  }
  if (!(norm > 0)) return null;
  for (let i = 0; i < n; i++) trivial[i] /= Math.sqrt(norm);

  let q = new Float64Array(n * BLOCK); // column-major: vector c is q[c·n .. c·n + n)
  let next = new Float64Array(n * BLOCK);
  for (let e = 0; e < q.length; e++) q[e] = normal(random);
  orthonormalize(q, n, trivial);
  let previous: Float64Array = new Float64Array(BLOCK);
  for (let iter = 1; iter <= MAX_ITERATIONS; iter++) {
    await ctx.checkpoint();
    applyOperator(q, next, n, rowStart, cols, weights, invSqrtDeg);
    [q, next] = [next, q];
    orthonormalize(q, n, trivial);
    if (iter % CHECK_EVERY === 0 || iter === MAX_ITERATIONS) {
      await ctx.checkpoint(); // the check costs about one more iteration
      const values = rayleighRitz(q, next, n, rowStart, cols, weights, invSqrtDeg);
      if (!values) return null;
      let change = 0;
      for (let c = 0; c < 2; c++) change = Math.max(change, Math.abs(values[c] - previous[c]));
      previous = values;
      if (change < TOLERANCE) break;
    }
  }
  const out = new Float64Array(n * 2);
  for (let i = 0; i < n; i++) {
    out[2 * i] = q[i];
    out[2 * i + 1] = q[n + i];
  }
  for (let e = 0; e < out.length; e++) if (!Number.isFinite(out[e])) return null;
  return out;
}

/** out = (x + D^−1/2 W D^−1/2 x) / 2 for every column. */
function applyOperator(
  x: Float64Array, out: Float64Array, n: number,
  rowStart: Int32Array, cols: Int32Array, weights: Float64Array, invSqrtDeg: Float64Array,
): void {
  for (let c = 0; c < BLOCK; c++) {
    const o = c * n;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let e = rowStart[i]; e < rowStart[i + 1]; e++) s += weights[e] * invSqrtDeg[cols[e]] * x[o + cols[e]];
      out[o + i] = 0.5 * (x[o + i] + invSqrtDeg[i] * s);
    }
  }
}

/** Modified Gram–Schmidt of the columns against `trivial` and each other. */
function orthonormalize(q: Float64Array, n: number, trivial: Float64Array): void {
  for (let c = 0; c < BLOCK; c++) {
    const o = c * n;
    removeComponent(q, o, trivial, 0, n);
    for (let p = 0; p < c; p++) removeComponent(q, o, q, p * n, n);
    let s = 0;
    for (let i = 0; i < n; i++) s += q[o + i] * q[o + i];
    const inv = s > 0 ? 1 / Math.sqrt(s) : 0;
    for (let i = 0; i < n; i++) q[o + i] *= inv;
  }
}

function removeComponent(q: Float64Array, o: number, u: Float64Array, uo: number, n: number): void {
  let dot = 0;
  for (let i = 0; i < n; i++) dot += q[o + i] * u[uo + i];
  for (let i = 0; i < n; i++) q[o + i] -= dot * u[uo + i];
}

/** Rotates the columns of q onto the Ritz vectors (largest Ritz value first); returns the Ritz values. */
function rayleighRitz(
  q: Float64Array, scratch: Float64Array, n: number,
  rowStart: Int32Array, cols: Int32Array, weights: Float64Array, invSqrtDeg: Float64Array,
): Float64Array | null {
  applyOperator(q, scratch, n, rowStart, cols, weights, invSqrtDeg);
  const h = new Float64Array(BLOCK * BLOCK);
  for (let a = 0; a < BLOCK; a++) {
    for (let b = a; b < BLOCK; b++) {
      let s = 0;
      for (let i = 0; i < n; i++) s += q[a * n + i] * scratch[b * n + i];
      h[a * BLOCK + b] = s;
      h[b * BLOCK + a] = s;
    }
  }
  const { values, vectors } = symmetricEigen(h, BLOCK);
  if (!values.every(Number.isFinite)) return null;
  const rotated = new Float64Array(n * BLOCK);
  for (let c = 0; c < BLOCK; c++) {
    for (let a = 0; a < BLOCK; a++) {
      const w = vectors[c * BLOCK + a];
      if (w === 0) continue;
      for (let i = 0; i < n; i++) rotated[c * n + i] += w * q[a * n + i];
    }
  }
  q.set(rotated);
  return values;
}
