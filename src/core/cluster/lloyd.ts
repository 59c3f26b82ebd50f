import { squaredDistance } from './distance';
import { nearestTwo } from './nearest';

/**
 * The state of one k-means run, advanced by `lloydStep`. Assignment uses Hamerly's bounds (an
 * upper bound on each window's distance to its own centre, a lower bound on the distance to any
 * other) to skip windows whose cluster cannot change; the result equals plain Lloyd's.
 */
export interface LloydState {
  data: Float64Array;
  n: number;
  d: number;
  k: number;
  /** Current centres, row-major k × d. */
  centres: Float64Array;
  /** Cluster of each window under the centres before the last update (-1 before the first step). */
  labels: Int32Array;
  /** Squared distance of each window to its assigned centre (exact after `assign`). */
  distances: Float64Array;
  /** Upper bound on the distance to the own centre, lower bound on the distance to any other. */
  upper: Float64Array;
  lower: Float64Array;
  iterations: number;
  converged: boolean;
  /** Convergence when the summed squared centre shift is at most this. */
  tolerance: number;
}

export function initLloyd(data: Float64Array, n: number, d: number, centres: Float64Array, tolerance: number): LloydState {
  return {
    data, n, d, k: centres.length / d, centres: Float64Array.from(centres),
    labels: new Int32Array(n).fill(-1), distances: new Float64Array(n),
    upper: new Float64Array(n), lower: new Float64Array(n),
    iterations: 0, converged: false, tolerance,
  };
}

/** Nearest and second-nearest centre of window i: [index, squared d1, squared d2]; `scratch` holds k values. */
function scan(s: LloydState, i: number, scratch: Float64Array, out: Float64Array): void {
  nearestTwo(s.data, i * s.d, s.d, s.centres, s.k, scratch, out);
}

/** Exact assignment of every window to its nearest centre (ties to the lower index); returns how many changed. */
export function assign(s: LloydState): number {
  const { n, labels, distances, upper, lower } = s;
  const tmp = new Float64Array(3);
  const scratch = new Float64Array(s.k);
  let changed = 0;
  for (let i = 0; i < n; i++) {
    scan(s, i, scratch, tmp);
    if (labels[i] !== tmp[0]) { labels[i] = tmp[0]; changed++; }
    distances[i] = tmp[1];
    upper[i] = Math.sqrt(tmp[1]);
    lower[i] = Math.sqrt(tmp[2]);
  }
  return changed;
}

/** Assignment that rescans only windows whose bounds allow a change. */
function boundedAssign(s: LloydState): number {
  const { data, n, d, k, centres, labels, distances, upper, lower } = s;
  const half = new Float64Array(k).fill(Infinity);
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k; b++) {
      const dist = 0.5 * Math.sqrt(squaredDistance(centres, a * d, centres, b * d, d));
      if (dist < half[a]) half[a] = dist;
      if (dist < half[b]) half[b] = dist;
    }
  }
  const tmp = new Float64Array(3);
  const scratch = new Float64Array(k);
  let changed = 0;
  for (let i = 0; i < n; i++) {
    const a = labels[i];
    const m = Math.max(half[a], lower[i]);
    if (upper[i] <= m) continue;
    const own = squaredDistance(data, i * d, centres, a * d, d);
    upper[i] = Math.sqrt(own);
    distances[i] = own;
    if (upper[i] <= m) continue;
    scan(s, i, scratch, tmp);
    const best = tmp[0];
    // Keep the current cluster on exact ties, as the full scan would not prefer either.
    if (best !== a && tmp[1] < own) { labels[i] = best; changed++; }
    distances[i] = Math.min(own, tmp[1]);
    upper[i] = Math.sqrt(distances[i]);
    lower[i] = Math.sqrt(labels[i] === best ? tmp[2] : tmp[1]);
  }
  return changed;
}

/** Sum of squared distances of windows to their assigned centres (call after `assign`). */
export function inertia(s: LloydState): number {
  let total = 0;
  for (let i = 0; i < s.n; i++) total += s.distances[i];
  return total;
}

/** Exact squared distance of every window to its own (current) centre; tightens the upper bounds too. */
function refreshDistances(s: LloydState): void {
  const { data, n, d, centres, labels, distances, upper } = s;
  for (let i = 0; i < n; i++) {
    distances[i] = squaredDistance(data, i * d, centres, labels[i] * d, d);
    upper[i] = Math.sqrt(distances[i]);
  }
}

/**
 * One Lloyd iteration: assign, then move each centre to the mean of its windows. An emptied
 * cluster takes the window farthest (exactly measured) from its own centre. Marks the state converged when no
 * window changed cluster or the centres moved less than the tolerance.
 */
export function lloydStep(s: LloydState): void {
  const { data, n, d, k, centres, labels, distances, upper, lower } = s;
  let changed = s.iterations === 0 ? assign(s) : boundedAssign(s);
  const sums = new Float64Array(k * d);
  const counts = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    counts[c]++;
    const o = i * d;
    const co = c * d;
    for (let j = 0; j < d; j++) sums[co + j] += data[o + j];
  }
  let refreshed = false;
  for (let c = 0; c < k; c++) {
    if (counts[c] > 0) continue;
    // Windows skipped by the bounds hold distances to older centres: make them exact once.
    if (!refreshed) { refreshDistances(s); refreshed = true; }
    // Relocate an empty cluster to the farthest window of a cluster that can spare one.
    let far = -1;
    for (let i = 0; i < n; i++) if (counts[labels[i]] > 1 && (far < 0 || distances[i] > distances[far])) far = i;
    if (far < 0) continue;
    const from = labels[far];
    counts[from]--;
    for (let j = 0; j < d; j++) sums[from * d + j] -= data[far * d + j];
    labels[far] = c;
    changed++;
    distances[far] = 0;
    upper[far] = 0;
    lower[far] = 0;
    counts[c] = 1;
    for (let j = 0; j < d; j++) sums[c * d + j] = data[far * d + j];
  }
  const moved = new Float64Array(k);
  let shift = 0;
  for (let c = 0; c < k; c++) {
    if (counts[c] === 0) continue;
    const co = c * d;
    let m = 0;
    for (let j = 0; j < d; j++) {
      const v = sums[co + j] / counts[c];
      const t = v - centres[co + j];
      m += t * t;
      centres[co + j] = v;
    }
    shift += m;
    moved[c] = Math.sqrt(m);
  }
  // Keep the bounds valid for the moved centres.
  let top = 0;
  for (let c = 1; c < k; c++) if (moved[c] > moved[top]) top = c;
  let second = 0;
  for (let c = 0; c < k; c++) if (c !== top && moved[c] > second) second = moved[c];
  for (let i = 0; i < n; i++) {
    const a = labels[i];
    upper[i] += moved[a];
    lower[i] = Math.max(0, lower[i] - (a === top ? second : moved[top]));
  }
  s.iterations++;
  if ((changed === 0 && s.iterations > 1) || shift <= s.tolerance) s.converged = true;
}

/**
 * Lloyd from the given centres to convergence or `maxIterations`, checking in between iterations;
 * ends with an exact assignment so that labels, distances and `inertia` match the final centres.
 */
export async function runLloyd(
  data: Float64Array, n: number, d: number, centres: Float64Array, tolerance: number, maxIterations: number,
  checkpoint: () => Promise<void>, onIteration: (state: LloydState) => void = () => {},
): Promise<LloydState> {
  const state = initLloyd(data, n, d, centres, tolerance);
  while (!state.converged && state.iterations < maxIterations) {
    lloydStep(state);
    onIteration(state);
    await checkpoint();
  }
  assign(state);
  return state;
}
