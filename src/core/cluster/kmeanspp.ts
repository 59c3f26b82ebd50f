import type { Random } from '../random';
import { squaredDistance } from './distance';

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
  const candidateDist = new Float64Array(n);
  const bestDist = new Float64Array(n);
  for (let c = 1; c < k; c++) {
    let acc = 0;
    for (let i = 0; i < n; i++) { acc += closest[i]; cumulative[i] = acc; }
    let best = -1;
    let bestPotential = Infinity;
    for (let t = 0; t < trials; t++) {
      const candidate = acc > 0 ? searchSorted(cumulative, random() * acc) : Math.floor(random() * n);
      let pot = 0;
      for (let i = 0; i < n; i++) {
        const dist = Math.min(closest[i], squaredDistance(data, i * d, data, candidate * d, d));
        candidateDist[i] = dist;
        pot += dist;
      }
      if (pot < bestPotential) {
        bestPotential = pot;
        best = candidate;
        bestDist.set(candidateDist);
      }
    }
    centres.set(data.subarray(best * d, best * d + d), c * d);
    closest.set(bestDist);
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
