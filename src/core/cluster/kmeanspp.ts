import type { Random } from '../random';
import { squaredDistance } from './distance';
import { distancesToCentres } from './nearest';

/**
 * k-means++ seeding (greedy variant): the first centre is a uniformly drawn window; each next
 * one is the best, by resulting total squared distance, of `trials` candidates drawn with
 * probability proportional to the squared distance to the nearest centre so far.
 * Default trials: 2 + floor(ln k). Returns centres row-major k × d.
 */
export function kmeansPlusPlus(
  data: Float64Array, n: number, d: number, k: number, random: Random, trials = 2 + Math.floor(Math.log(k)),
): Float64Array {
  const centres = new Float64Array(k * d);
  const first = Math.min(n - 1, Math.floor(random() * n));
  centres.set(data.subarray(first * d, first * d + d), 0);
  const closest = new Float64Array(n);
  for (let i = 0; i < n; i++) closest[i] = squaredDistance(data, i * d, centres, 0, d);
  const cumulative = new Float64Array(n);
  const candidateDist = new Float64Array(trials * n);
  const dists = new Float64Array(trials);
  for (let c = 1; c < k; c++) {
    let acc = 0;
    for (let i = 0; i < n; i++) { acc += closest[i]; cumulative[i] = acc; }
    // Draw every candidate first (the same draws in the same order), then measure them in one pass.
    const candidates = new Int32Array(trials);
    for (let t = 0; t < trials; t++) candidates[t] = acc > 0 ? searchSorted(cumulative, random() * acc) : Math.floor(random() * n);
    const rows = new Float64Array(trials * d);
    for (let t = 0; t < trials; t++) rows.set(data.subarray(candidates[t] * d, candidates[t] * d + d), t * d);
    const pots = new Float64Array(trials);
    for (let i = 0; i < n; i++) {
      distancesToCentres(data, i * d, d, rows, trials, dists);
      const near = closest[i];
      for (let t = 0; t < trials; t++) {
        const dist = Math.min(near, dists[t]);
        candidateDist[t * n + i] = dist;
        pots[t] += dist;
      }
    }
    let best = -1;
    let bestTrial = 0;
    let bestPotential = Infinity;
    for (let t = 0; t < trials; t++) {
      if (pots[t] < bestPotential) { bestPotential = pots[t]; best = candidates[t]; bestTrial = t; }
    }
    closest.set(candidateDist.subarray(bestTrial * n, bestTrial * n + n));
    centres.set(data.subarray(best * d, best * d + d), c * d);
  }
  return centres;
}

/** First index i with cumulative[i] > x (clamped to the last index). */
function searchSorted(cumulative: Float64Array, x: number): number {
  let lo = 0;
  let hi = cumulative.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (cumulative[mid] > x) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}
