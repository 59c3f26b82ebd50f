import { squaredDistance } from './distance';

/**
 * One split–merge move for a converged k-means partition: merge the two clusters a, b whose
 * merge raises the within-cluster sum of squares least (Ward's cost nₐn_b/(nₐ+n_b)·‖cₐ−c_b‖²) and
 * split a third cluster s in two by 2-means on its windows (gain: its sum of squares minus the two
 * halves'). The move frees one centre where two clusters share a blob and spends it where one
 * cluster covers two: the local optimum Lloyd cannot leave by itself.
 */
export interface SplitMergeMove {
  merged: [number, number];
  split: number;
  /** Predicted change of the total sum of squares (merge cost − split gain); negative is better. */
  predicted: number;
  /** k centres for Lloyd to start from: the merged mean, the two halves' means, the others unchanged. */
  centres: Float64Array;
}

/** Size and mean (row-major k × d) of each cluster. */
export interface ClusterSummary {
  counts: Float64Array;
  means: Float64Array;
}

export function summarize(data: Float64Array, n: number, d: number, k: number, labels: Int32Array): ClusterSummary {
  const counts = new Float64Array(k);
  const means = new Float64Array(k * d);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    counts[c]++;
    for (let j = 0; j < d; j++) means[c * d + j] += data[i * d + j];
  }
  for (let c = 0; c < k; c++) if (counts[c] > 0) for (let j = 0; j < d; j++) means[c * d + j] /= counts[c];
  return { counts, means };
}

/** Ward's merge cost; an empty cluster merges for free (its centre is spare). */
export function mergeCost(s: ClusterSummary, d: number, a: number, b: number): number {
  const na = s.counts[a];
  const nb = s.counts[b];
  if (na === 0 || nb === 0) return 0;
  return (na * nb / (na + nb)) * squaredDistance(s.means, a * d, s.means, b * d, d);
}

/** Windows of each cluster, grouped: `order[start[c] .. start[c + 1])` are cluster c's windows. */
function groupByCluster(labels: Int32Array, k: number): { order: Int32Array; start: Int32Array } {
  const start = new Int32Array(k + 1);
  for (let i = 0; i < labels.length; i++) start[labels[i] + 1]++;
  for (let c = 0; c < k; c++) start[c + 1] += start[c];
  const fill = start.slice(0, k);
  const order = new Int32Array(labels.length);
  for (let i = 0; i < labels.length; i++) order[fill[labels[i]]++] = i;
  return { order, start };
}

/**
 * Windows per cluster used to estimate its split (evenly spaced in window order; the gain is scaled
 * to the cluster's size). The estimate only chooses the move: Lloyd then runs on all windows and
 * the move is kept only if the exact inertia drops.
 */
const SPLIT_SAMPLE = 1024;

/** At most `size` of `members`, evenly spaced (all of them when there are few). */
function strideSample(members: Int32Array, size: number): Int32Array {
  const m = members.length;
  if (m <= size) return members;
  const out = new Int32Array(size);
  for (let t = 0; t < size; t++) out[t] = members[Math.floor((t * m) / size)];
  return out;
}

/** Power-iteration steps for the principal direction, 2-means iterations per split (bounded work). */
const POWER_STEPS = 4;
const TWO_MEANS_STEPS = 12;

/**
 * Best two-way split of one cluster's windows (deterministic, no random draws): cut across the
 * principal direction (power iteration started from the window farthest from the mean) through the
 * mean, then 2-means from the two sides. Returns the two means (2 × d) and the gain in sum of squares
 * (about `mean`) over `members`.
 */
export function splitCluster(
  data: Float64Array, d: number, members: Int32Array, mean: Float64Array,
): { halves: Float64Array; gain: number } {
  const m = members.length;
  const halves = new Float64Array(2 * d);
  if (m < 2) return { halves, gain: 0 };
  let far = members[0];
  let farDist = -1;
  let sse = 0;
  for (const i of members) {
    const dist = squaredDistance(data, i * d, mean, 0, d);
    sse += dist;
    if (dist > farDist) { farDist = dist; far = i; }
  }
  if (!(sse > 0)) return { halves, gain: 0 };
  let v = new Float64Array(d);
  for (let j = 0; j < d; j++) v[j] = data[far * d + j] - mean[j];
  for (let step = 0; step < POWER_STEPS; step++) {
    const w = new Float64Array(d);
    for (const i of members) {
      let p = 0;
      for (let j = 0; j < d; j++) p += (data[i * d + j] - mean[j]) * v[j];
      for (let j = 0; j < d; j++) w[j] += p * (data[i * d + j] - mean[j]);
    }
    let norm = 0;
    for (let j = 0; j < d; j++) norm += w[j] * w[j];
    if (!(norm > 0)) break;
    norm = Math.sqrt(norm);
    for (let j = 0; j < d; j++) w[j] /= norm;
    v = w;
  }
  const side = new Uint8Array(m);
  for (let t = 0; t < m; t++) {
    const i = members[t];
    let p = 0;
    for (let j = 0; j < d; j++) p += (data[i * d + j] - mean[j]) * v[j];
    side[t] = p > 0 ? 1 : 0;
  }
  for (let step = 0; step <= TWO_MEANS_STEPS; step++) {
    if (!halfMeans(data, d, members, side, halves)) return { halves, gain: 0 };
    if (step === TWO_MEANS_STEPS) break;
    let changed = 0;
    for (let t = 0; t < m; t++) {
      const o = members[t] * d;
      const s = squaredDistance(data, o, halves, d, d) < squaredDistance(data, o, halves, 0, d) ? 1 : 0;
      if (s !== side[t]) { side[t] = s; changed++; }
    }
    if (changed === 0) break;
  }
  let after = 0;
  for (let t = 0; t < m; t++) after += squaredDistance(data, members[t] * d, halves, side[t] * d, d);
  return { halves, gain: Math.max(0, sse - after) };
}

/** Means of the two sides into `halves`; false when a side is empty. */
function halfMeans(data: Float64Array, d: number, members: Int32Array, side: Uint8Array, halves: Float64Array): boolean {
  halves.fill(0);
  const count = [0, 0];
  for (let t = 0; t < members.length; t++) {
    const h = side[t];
    count[h]++;
    const o = members[t] * d;
    for (let j = 0; j < d; j++) halves[h * d + j] += data[o + j];
  }
  if (count[0] === 0 || count[1] === 0) return false;
  for (let h = 0; h < 2; h++) for (let j = 0; j < d; j++) halves[h * d + j] /= count[h];
  return true;
}

/**
 * The most promising split–merge move for the partition `labels` (k ≥ 3 clusters), or null when
 * no move is predicted to lower the total sum of squares by more than `minGain`.
 */
export function proposeMove(
  data: Float64Array, n: number, d: number, k: number, labels: Int32Array, minGain: number,
): SplitMergeMove | null {
  if (k < 3) return null;
  const s = summarize(data, n, d, k, labels);
  const { order, start } = groupByCluster(labels, k);
  const gains = new Float64Array(k);
  const halves: Float64Array[] = [];
  for (let c = 0; c < k; c++) {
    const members = strideSample(order.subarray(start[c], start[c + 1]), SPLIT_SAMPLE);
    const split = splitCluster(data, d, members, s.means.subarray(c * d, c * d + d));
    gains[c] = split.gain * (s.counts[c] / Math.max(1, members.length));
    halves.push(split.halves);
  }
  let best: { a: number; b: number; split: number; predicted: number } | null = null;
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k; b++) {
      const cost = mergeCost(s, d, a, b);
      for (let c = 0; c < k; c++) {
        if (c === a || c === b || gains[c] <= 0) continue;
        const predicted = cost - gains[c];
        if (predicted < -minGain && (!best || predicted < best.predicted)) best = { a, b, split: c, predicted };
      }
    }
  }
  if (!best) return null;
  const { a, b, split } = best;
  const centres = Float64Array.from(s.means);
  const na = s.counts[a];
  const nb = s.counts[b];
  for (let j = 0; j < d; j++) {
    if (na + nb > 0) centres[a * d + j] = (na * s.means[a * d + j] + nb * s.means[b * d + j]) / (na + nb);
    centres[b * d + j] = halves[split][j];
    centres[split * d + j] = halves[split][d + j];
  }
  return { merged: [a, b], split, predicted: best.predicted, centres };
}
