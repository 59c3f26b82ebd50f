import type { Moments } from './cohens-d';

/** Per-cluster and whole-table moments of every feature (missing values left out). */
export interface ClusterMoments {
  k: number;
  d: number;
  /** k × d, row-major: non-missing values of feature j in cluster c at [c * d + j]. */
  counts: Float64Array;
  means: Float64Array;
  /** Σ (x - cluster mean)² per cluster and feature. */
  ss: Float64Array;
  /** Per feature over all clustered windows. */
  total: { counts: Float64Array; means: Float64Array; ss: Float64Array };
}

/** Two passes over a row-major n × d matrix; windows with a cluster outside 0..k-1 are left out. */
export function clusterMoments(data: ArrayLike<number>, n: number, d: number, labels: ArrayLike<number>, k: number): ClusterMoments {
  const counts = new Float64Array(k * d);
  const sums = new Float64Array(k * d);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    if (c < 0 || c >= k) continue;
    for (let j = 0; j < d; j++) {
      const x = data[i * d + j];
      if (x === x) { counts[c * d + j]++; sums[c * d + j] += x; }
    }
  }
  const means = new Float64Array(k * d);
  for (let t = 0; t < means.length; t++) means[t] = counts[t] > 0 ? sums[t] / counts[t] : NaN;
  const ss = new Float64Array(k * d);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    if (c < 0 || c >= k) continue;
    for (let j = 0; j < d; j++) {
      const x = data[i * d + j];
      if (x === x) ss[c * d + j] += (x - means[c * d + j]) ** 2;
    }
  }
  const tc = new Float64Array(d);
  const tm = new Float64Array(d);
  const ts = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    let cnt = 0;
    let sum = 0;
    for (let c = 0; c < k; c++) { cnt += counts[c * d + j]; sum += sums[c * d + j]; }
    tc[j] = cnt;
    tm[j] = cnt > 0 ? sum / cnt : NaN;
    // Total SS = within-cluster SS + between-cluster SS.
    let s = 0;
    for (let c = 0; c < k; c++) {
      const m = counts[c * d + j];
      if (m > 0) s += ss[c * d + j] + m * (means[c * d + j] - tm[j]) ** 2;
    }
    ts[j] = s;
  }
  return { k, d, counts, means, ss, total: { counts: tc, means: tm, ss: ts } };
}

/** Moments of feature j over the windows of every cluster but `c`. */
export function restMoments(m: ClusterMoments, c: number, j: number): Moments {
  const { d, k } = m;
  let n = 0;
  let sum = 0;
  for (let o = 0; o < k; o++) if (o !== c && m.counts[o * d + j] > 0) { n += m.counts[o * d + j]; sum += m.counts[o * d + j] * m.means[o * d + j]; }
  const mean = n > 0 ? sum / n : NaN;
  let ss = 0;
  for (let o = 0; o < k; o++) {
    const cnt = m.counts[o * d + j];
    if (o !== c && cnt > 0) ss += m.ss[o * d + j] + cnt * (m.means[o * d + j] - mean) ** 2;
  }
  return { n, mean, ss };
}

/** Moments of feature j within cluster c. */
export function ownMoments(m: ClusterMoments, c: number, j: number): Moments {
  const t = c * m.d + j;
  return { n: m.counts[t], mean: m.means[t], ss: m.ss[t] };
}
