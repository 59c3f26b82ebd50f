import type { JobContext } from '../../job';
import { quietContext } from '../../job';
import { ActiveSet } from './active-set';
import { rawMerges, type RawMerges } from './merge-tree';
import { WorkMeter } from './work-meter';

/**
 * Ward's linkage by the nearest-neighbour chain on cluster centroids, without a distance matrix:
 * the Ward distance between clusters a and b is sqrt(2 nₐ n_b / (nₐ + n_b)) · ‖cₐ − c_b‖, which is
 * the Lance–Williams Ward distance SciPy reports (equal to the Euclidean distance for two single
 * windows). O(n² d) time, O(n d) memory. `weights` are the starting cluster sizes (two-stage:
 * windows per micro-cluster, with the micro-cluster centroids as rows).
 */
export async function wardFromPoints(
  data: ArrayLike<number>, n: number, d: number, ctx: JobContext = quietContext, weights?: ArrayLike<number>,
): Promise<RawMerges> {
  const raw = rawMerges(n);
  const centre = Float64Array.from({ length: n * d }, (_, i) => data[i]);
  const size = new Float64Array(n);
  for (let i = 0; i < n; i++) size[i] = weights ? weights[i] : 1;
  const active = new ActiveSet(n);
  const chain = new Int32Array(n);
  let chainLength = 0;
  const found = new Float64Array(1);
  const meter = new WorkMeter(ctx, 'linkage');
  const total = (n * n * d) / 2 + 1;
  let work = 0;

  for (let k = 0; k < n - 1; k++) {
    if (chainLength === 0) chain[chainLength++] = active.first();
    let x: number;
    let y = 0;
    let best: number;
    for (;;) {
      x = chain[chainLength - 1];
      if (chainLength > 1) {
        y = chain[chainLength - 2];
        best = wardCost(centre, size, d, x, y);
      } else {
        best = Infinity;
      }
      const { list, length } = active.slots();
      y = nearestWard(centre, size, d, list, length, active.alive, x, y, best, found);
      best = found[0];
      work += length * d;
      if (meter.add(length * d)) await meter.checkIn(work / total);
      if (chainLength > 1 && y === chain[chainLength - 2]) break;
      chain[chainLength++] = y;
    }
    chainLength -= 2;
    if (x > y) { const t = x; x = y; y = t; }
    const nx = size[x];
    const ny = size[y];
    raw.a[k] = x;
    raw.b[k] = y;
    raw.height[k] = Math.sqrt(2 * best);
    const xo = x * d;
    const yo = y * d;
    for (let j = 0; j < d; j++) centre[yo + j] = (nx * centre[xo + j] + ny * centre[yo + j]) / (nx + ny);
    size[x] = 0;
    size[y] = nx + ny;
    active.remove(x);
  }
  return raw;
}

/** Half the squared Ward distance: nₐ n_b / (nₐ + n_b) · ‖cₐ − c_b‖² (monotone in the distance). */
function wardCost(centre: Float64Array, size: Float64Array, d: number, a: number, b: number): number {
  const ao = a * d;
  const bo = b * d;
  let s = 0;
  let j = 0;
  for (; j + 8 <= d; j += 8) {
    const u0 = centre[ao + j] - centre[bo + j];
    const u1 = centre[ao + j + 1] - centre[bo + j + 1];
    const u2 = centre[ao + j + 2] - centre[bo + j + 2];
    const u3 = centre[ao + j + 3] - centre[bo + j + 3];
    const u4 = centre[ao + j + 4] - centre[bo + j + 4];
    const u5 = centre[ao + j + 5] - centre[bo + j + 5];
    const u6 = centre[ao + j + 6] - centre[bo + j + 6];
    const u7 = centre[ao + j + 7] - centre[bo + j + 7];
    s += (u0 * u0 + u1 * u1) + (u2 * u2 + u3 * u3) + ((u4 * u4 + u5 * u5) + (u6 * u6 + u7 * u7));
  }
  for (; j < d; j++) { const u = centre[ao + j] - centre[bo + j]; s += u * u; }
  return ((size[a] * size[b]) / (size[a] + size[b])) * s;
}

/**
 * The live cluster nearest to x by Ward cost, starting from (y, best); ties keep the earlier
 * candidate. Returns it and writes its cost to found[0]. A plain function so that the engine
 * optimizes the hot loop on its own.
 */
function nearestWard(
  centre: Float64Array, size: Float64Array, d: number, list: Int32Array, length: number, alive: Uint8Array,
  x: number, y: number, best: number, found: Float64Array,
): number {
  const sx = size[x];
  const xo = x * d;
  for (let t = 0; t < length; t++) {
    const i = list[t];
    if (i === x || alive[i] === 0) continue;
    const si = size[i];
    const factor = (sx * si) / (sx + si);
    // Partial distance, four running sums: give up on i once the sum of squares alone shows it
    // cannot win (with a margin far above rounding, so only clear losers are dropped).
    const limit = (best / factor) * (1 + 1e-9);
    const io = i * d;
    let s = 0;
    let j = 0;
    while (j + 8 <= d) {
      const u0 = centre[xo + j] - centre[io + j];
      const u1 = centre[xo + j + 1] - centre[io + j + 1];
      const u2 = centre[xo + j + 2] - centre[io + j + 2];
      const u3 = centre[xo + j + 3] - centre[io + j + 3];
      const u4 = centre[xo + j + 4] - centre[io + j + 4];
      const u5 = centre[xo + j + 5] - centre[io + j + 5];
      const u6 = centre[xo + j + 6] - centre[io + j + 6];
      const u7 = centre[xo + j + 7] - centre[io + j + 7];
      s += (u0 * u0 + u1 * u1) + (u2 * u2 + u3 * u3) + ((u4 * u4 + u5 * u5) + (u6 * u6 + u7 * u7));
      j += 8;
      if (s > limit) break;
    }
    if (s > limit) continue;
    for (; j < d; j++) { const u = centre[xo + j] - centre[io + j]; s += u * u; }
    const v = factor * s;
    if (v < best) { best = v; y = i; }
  }
  found[0] = best;
  return y;
}
