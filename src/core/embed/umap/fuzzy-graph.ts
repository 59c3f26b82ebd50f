import type { Knn } from '../../neighbors/knn.types';

/** A sparse symmetric graph in CSR form: row i's edges are cols/weights[rowStart[i] .. rowStart[i + 1]). */
export interface SparseGraph {
  n: number;
  rowStart: Int32Array;
  cols: Int32Array;
  weights: Float64Array;
}

const SMOOTH_K_TOLERANCE = 1e-5;
const MIN_K_DIST_SCALE = 1e-3;
const SEARCH_STEPS = 64;

/**
 * Per-window distance to the nearest neighbour (rho, local connectivity 1) and the scale sigma at
 * which the memberships exp(−(d − rho) / sigma) of its neighbours sum to log2(neighbors), found by
 * bisection. `knn` excludes the window itself, so neighbors = knn.k + 1.
 */
export function smoothKnnDistances(knn: Knn): { rhos: Float64Array; sigmas: Float64Array } {
  return finish(smoothKnnSteps(knn));
}

/** Rows per slice between the yields of the step generators below. */
const ROWS_PER_YIELD = 16_384;

/** Runs a step generator to its end. */
function finish<T>(steps: Generator<void, T>): T {
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
  }
}

function* smoothKnnSteps(knn: Knn): Generator<void, { rhos: Float64Array; sigmas: Float64Array }> {
  const { n, k, distances } = knn;
  const target = Math.log2(k + 1);
  const rhos = new Float64Array(n);
  const sigmas = new Float64Array(n);
  let meanAll = 0;
  for (let e = 0; e < n * k; e++) meanAll += distances[e];
  meanAll /= n * (k + 1);
  for (let i = 0; i < n; i++) {
    const base = i * k;
    let rho = 0;
    let sum = 0;
    for (let t = 0; t < k; t++) {
      const dist = distances[base + t];
      sum += dist;
      if (rho === 0 && dist > 0) rho = dist;
    }
    let lo = 0;
    let hi = Infinity;
    let mid = 1;
    for (let step = 0; step < SEARCH_STEPS; step++) {
      let psum = 0;
      for (let t = 0; t < k; t++) {
        const excess = distances[base + t] - rho;
        psum += excess > 0 ? Math.exp(-excess / mid) : 1;
      }
      if (Math.abs(psum - target) < SMOOTH_K_TOLERANCE) break;
      if (psum > target) {
        hi = mid;
        mid = (lo + hi) / 2;
      } else {
        lo = mid;
        mid = hi === Infinity ? mid * 2 : (lo + hi) / 2;
      }
    }
    const floor = MIN_K_DIST_SCALE * (rho > 0 ? sum / (k + 1) : meanAll);
    rhos[i] = rho;
    sigmas[i] = Math.max(mid, floor);
    if ((i + 1) % ROWS_PER_YIELD === 0) yield;
  }
  return { rhos, sigmas };
}

/**
 * The fuzzy simplicial set of a neighbour graph: directed memberships w(i→j) =
 * exp(−(d − rho_i) / sigma_i) (1 within rho_i), symmetrised by the fuzzy union
 * w + w' − w·w'. Returned as CSR with both directions of every edge; edges of weight 0 are left out.
 */
export function fuzzySimplicialSet(knn: Knn): SparseGraph {
  return finish(fuzzySimplicialSteps(knn));
}

/** fuzzySimplicialSet awaiting `checkpoint` between slices of rows (the same graph). */
export async function fuzzySimplicialSetAsync(knn: Knn, checkpoint: () => Promise<void>): Promise<SparseGraph> {
  const steps = fuzzySimplicialSteps(knn);
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
    await checkpoint();
  }
}

function* fuzzySimplicialSteps(knn: Knn): Generator<void, SparseGraph> {
  const { n, k, indices, distances } = knn;
  const { rhos, sigmas } = yield* smoothKnnSteps(knn);
  const directed = new Float64Array(n * k);
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < k; t++) {
      const e = i * k + t;
      const j = indices[e];
      const excess = distances[e] - rhos[i];
      directed[e] = j < 0 || j === i ? 0 : excess <= 0 || sigmas[i] === 0 ? 1 : Math.exp(-excess / sigmas[i]);
    }
    if ((i + 1) % ROWS_PER_YIELD === 0) yield;
  }
  // COO of the union: an edge present both ways is emitted once from each side with the union
  // weight; an edge present one way only is emitted in both directions.
  const heads = new Int32Array(2 * n * k);
  const tails = new Int32Array(2 * n * k);
  const ws = new Float64Array(2 * n * k);
  let m = 0;
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < k; t++) {
      const e = i * k + t;
      const w = directed[e];
      if (w <= 0) continue;
      const j = indices[e];
      let back = -1;
      for (let u = 0; u < k; u++) {
        if (indices[j * k + u] === i) {
          back = directed[j * k + u];
          break;
        }
      }
      if (back > 0) {
        heads[m] = i; tails[m] = j; ws[m] = w + back - w * back; m++;
      } else {
        heads[m] = i; tails[m] = j; ws[m] = w; m++;
        heads[m] = j; tails[m] = i; ws[m] = w; m++;
      }
    }
    if ((i + 1) % ROWS_PER_YIELD === 0) yield;
  }
  yield;
  return toCsr(n, heads, tails, ws, m);
}

/** Stable counting sort of m COO entries by head into CSR. */
function toCsr(n: number, heads: Int32Array, tails: Int32Array, ws: Float64Array, m: number): SparseGraph {
  const rowStart = new Int32Array(n + 1);
  for (let e = 0; e < m; e++) rowStart[heads[e] + 1]++;
  for (let i = 0; i < n; i++) rowStart[i + 1] += rowStart[i];
  const fill = rowStart.slice(0, n);
  const cols = new Int32Array(m);
  const weights = new Float64Array(m);
  for (let e = 0; e < m; e++) {
    const p = fill[heads[e]]++;
    cols[p] = tails[e];
    weights[p] = ws[e];
  }
  return { n, rowStart, cols, weights };
}
