import type { JobContext } from '../../job';
import { quietContext } from '../../job';
import { ActiveSet } from './active-set';
import { condensedIndex, type Condensed } from './condensed';
import { rawMerges, type RawMerges } from './merge-tree';
import { WorkMeter } from './work-meter';

export type ChainLinkage = 'ward' | 'average' | 'complete';

/** Lance–Williams update: distance from cluster i to x ∪ y (Ward on unsquared distances). */
function update(linkage: ChainLinkage, dxi: number, dyi: number, dxy: number, nx: number, ny: number, ni: number): number {
  if (linkage === 'complete') return dxi > dyi ? dxi : dyi;
  if (linkage === 'average') return (nx * dxi + ny * dyi) / (nx + ny);
  const t = 1 / (nx + ny + ni);
  return Math.sqrt(Math.max(0, (ni + nx) * t * dxi * dxi + (ni + ny) * t * dyi * dyi - ni * t * dxy * dxy));
}

/**
 * Nearest-neighbour chain on a condensed distance matrix (overwritten: the merged cluster's
 * distances are written into its surviving slot). Exact for the reducible linkages Ward, average
 * and complete; O(n²) time beyond the matrix, O(n) extra memory. `sizes` are the starting
 * cluster sizes (1 per item when absent).
 */
export async function nnChainCondensed(
  dist: Condensed, n: number, linkage: ChainLinkage, ctx: JobContext = quietContext, sizes?: ArrayLike<number>,
): Promise<RawMerges> {
  const raw = rawMerges(n);
  const size = new Float64Array(n);
  for (let i = 0; i < n; i++) size[i] = sizes ? sizes[i] : 1;
  const active = new ActiveSet(n);
  const chain = new Int32Array(n);
  let chainLength = 0;
  const meter = new WorkMeter(ctx, 'linkage', 5e7);
  for (let k = 0; k < n - 1; k++) {
    if (chainLength === 0) chain[chainLength++] = active.first();
    let x: number;
    let y = 0;
    let best: number;
    for (;;) {
      x = chain[chainLength - 1];
      if (chainLength > 1) {
        y = chain[chainLength - 2];
        best = dist[condensedIndex(n, x, y)];
      } else {
        best = Infinity;
      }
      const { list, length } = active.slots();
      const rowX = n * x - (x * (x + 1)) / 2 - x - 1;
      for (let t = 0; t < length; t++) {
        const i = list[t];
        if (i === x || !active.alive[i]) continue;
        const v = i > x ? dist[rowX + i] : dist[n * i - (i * (i + 1)) / 2 + (x - i - 1)];
        if (v < best) { best = v; y = i; }
      }
      if (meter.add(length)) await meter.checkIn(k / (n - 1));
      if (chainLength > 1 && y === chain[chainLength - 2]) break;
      chain[chainLength++] = y;
    }
    chainLength -= 2;
    if (x > y) { const t = x; x = y; y = t; }
    const nx = size[x];
    const ny = size[y];
    raw.a[k] = x;
    raw.b[k] = y;
    raw.height[k] = best;
    active.remove(x);
    size[x] = 0;
    size[y] = nx + ny;
    const { list, length } = active.slots();
    for (let t = 0; t < length; t++) {
      const i = list[t];
      if (i === y || !active.alive[i]) continue;
      const iy = condensedIndex(n, i, y);
      dist[iy] = update(linkage, dist[condensedIndex(n, i, x)], dist[iy], best, nx, ny, size[i]);
    }
  }
  return raw;
}
