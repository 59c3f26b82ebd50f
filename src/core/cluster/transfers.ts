import { squaredDistance } from './distance';

/**
 * Single-window transfers (Hartigan's criterion): moving window x from cluster a (nₐ windows, mean
 * cₐ) to cluster b changes the total sum of squares by n_b/(n_b+1)·‖x−c_b‖² − nₐ/(nₐ−1)·‖x−cₐ‖²,
 * means updated exactly. A Lloyd fixed point can still hold windows near a boundary whose transfer
 * lowers the total; this pass moves them until none does. Every Lloyd move is also such a transfer,
 * so the result stays a Lloyd fixed point. A pass costs one scan of every window against every mean.
 */
export interface TransferResult {
  labels: Int32Array;
  /** Means of the final clusters, row-major k × d. */
  centres: Float64Array;
  /** Exact within-cluster sum of squares of `labels`. */
  inertia: number;
  transfers: number;
}

/** `fallback` (k × d) gives the centre of any cluster left without windows. */
export function transferPasses(
  data: Float64Array, n: number, d: number, labelsIn: Int32Array, fallback: Float64Array, maxPasses: number,
): TransferResult {
  const k = fallback.length / d;
  const labels = Int32Array.from(labelsIn);
  const counts = new Float64Array(k);
  const sums = new Float64Array(k * d);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    counts[c]++;
    for (let j = 0; j < d; j++) sums[c * d + j] += data[i * d + j];
  }
  const means = Float64Array.from(fallback);
  const refresh = (c: number) => { if (counts[c] > 0) for (let j = 0; j < d; j++) means[c * d + j] = sums[c * d + j] / counts[c]; };
  for (let c = 0; c < k; c++) refresh(c);
  let transfers = 0;
  for (let pass = 0; pass < maxPasses && k > 1; pass++) {
    let smallest = Infinity;
    for (let c = 0; c < k; c++) if (counts[c] > 0 && counts[c] < smallest) smallest = counts[c];
    let moved = 0;
    for (let i = 0; i < n; i++) {
      const a = labels[i];
      const na = counts[a];
      if (na <= 1) continue;
      const o = i * d;
      const own = squaredDistance(data, o, means, a * d, d);
      const ownCost = (na / (na - 1)) * own;
      // Cheap screen: a transfer needs some mean b with ‖x−c_b‖² < ownCost·(n_b+1)/n_b ≤ ownCost·(smallest+1)/smallest.
      const reach = ownCost * ((smallest + 1) / smallest);
      let target = -1;
      let bestCost = ownCost;
      for (let b = 0; b < k; b++) {
        if (b === a) continue;
        const dist = squaredDistance(data, o, means, b * d, d);
        if (dist >= reach) continue;
        const nb = counts[b];
        const cost = nb === 0 ? 0 : (nb / (nb + 1)) * dist;
        if (cost < bestCost) { bestCost = cost; target = b; }
      }
      if (target < 0) continue;
      labels[i] = target;
      counts[a]--;
      counts[target]++;
      for (let j = 0; j < d; j++) { sums[a * d + j] -= data[o + j]; sums[target * d + j] += data[o + j]; }
      refresh(a);
      refresh(target);
      moved++;
    }
    transfers += moved;
    if (moved === 0) break;
  }
  // Exact means and sum of squares from scratch (no drift from the running sums).
  counts.fill(0);
  sums.fill(0);
  for (let i = 0; i < n; i++) {
    counts[labels[i]]++;
    for (let j = 0; j < d; j++) sums[labels[i] * d + j] += data[i * d + j];
  }
  for (let c = 0; c < k; c++) refresh(c);
  let inertia = 0;
  for (let i = 0; i < n; i++) inertia += squaredDistance(data, i * d, means, labels[i] * d, d);
  return { labels, centres: means, inertia, transfers };
}
