import { squaredDistance } from '../cluster/distance';

/** Points as a row-major n × d matrix (a FeatureMatrix fits). */
export interface Points {
  data: ArrayLike<number>;
  n: number;
  d: number;
}

/**
 * Silhouette of every point given a function filling the distances from point i to all points:
 * s = (b - a) / max(a, b), a = mean distance within its cluster, b = lowest mean distance to
 * another cluster; 0 for a point alone in its cluster. NaN everywhere when fewer than 2
 * clusters are present (the silhouette is undefined).
 */
export function silhouetteWith(
  n: number, labels: ArrayLike<number>, distancesFrom: (i: number, out: Float64Array) => void,
): Float64Array {
  const { codes, count } = compact(labels, n);
  const out = new Float64Array(n);
  if (count < 2) return out.fill(NaN);
  const sizes = new Float64Array(count);
  for (let i = 0; i < n; i++) sizes[codes[i]]++;
  const row = new Float64Array(n);
  const sums = new Float64Array(count);
  for (let i = 0; i < n; i++) {
    const own = codes[i];
    if (sizes[own] <= 1) { out[i] = 0; continue; }
    distancesFrom(i, row);
    sums.fill(0);
    for (let j = 0; j < n; j++) sums[codes[j]] += row[j];
    const a = sums[own] / (sizes[own] - 1);
    let b = Infinity;
    for (let c = 0; c < count; c++) if (c !== own && sizes[c] > 0) b = Math.min(b, sums[c] / sizes[c]);
    const m = Math.max(a, b);
    out[i] = m > 0 ? (b - a) / m : 0;
  }
  return out;
}

/** Silhouette of every point, Euclidean distances. O(n² d). */
export function silhouetteSamples(points: Points, labels: ArrayLike<number>): Float64Array {
  const { data, n, d } = points;
  return silhouetteWith(n, labels, (i, out) => {
    for (let j = 0; j < n; j++) out[j] = Math.sqrt(squaredDistance(data, i * d, data, j * d, d));
  });
}

/** Silhouette of every point from a precomputed n × n distance matrix (row-major). */
export function silhouetteFromDistances(distances: ArrayLike<number>, n: number, labels: ArrayLike<number>): Float64Array {
  return silhouetteWith(n, labels, (i, out) => {
    for (let j = 0; j < n; j++) out[j] = distances[i * n + j];
  });
}

/** Mean silhouette over all points (NaN when fewer than 2 clusters). */
export function meanSilhouette(points: Points, labels: ArrayLike<number>): number {
  return mean(silhouetteSamples(points, labels));
}

export function mean(xs: Float64Array): number {
  let s = 0;
  for (let i = 0; i < xs.length; i++) s += xs[i];
  return xs.length > 0 ? s / xs.length : NaN;
}

function compact(labels: ArrayLike<number>, n: number): { codes: Int32Array; count: number } {
  const ids = new Map<number, number>();
  const codes = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let c = ids.get(labels[i]);
    if (c === undefined) { c = ids.size; ids.set(labels[i], c); }
    codes[i] = c;
  }
  return { codes, count: ids.size };
}

/**
 * Mean silhouette of the windows `sample` picks from a row-major n × d matrix (the run's way of
 * keeping the O(m²) silhouette affordable on large tables).
 */
export function silhouetteOfSample(data: Float64Array, d: number, sample: Int32Array, labels: ArrayLike<number>): number {
  const m = sample.length;
  const sampled = new Float64Array(m * d);
  const sampledLabels = new Int32Array(m);
  for (let s = 0; s < m; s++) {
    sampled.set(data.subarray(sample[s] * d, sample[s] * d + d), s * d);
    sampledLabels[s] = labels[sample[s]];
  }
  return mean(silhouetteSamples({ data: sampled, n: m, d }, sampledLabels));
}
