import type { JobContext } from '../../job';
import { quietContext } from '../../job';
import { rawMerges, type RawMerges } from './merge-tree';
import { WorkMeter } from './work-meter';

/**
 * Single linkage from a minimum spanning tree grown by Prim's algorithm: O(n²) distance
 * evaluations, O(n) memory. `distance(i, j)` gives the distance between items i and j. Each step
 * records the item added last and the next one (the pointer representation); sorted by height and
 * relabelled (toMergeTree) this is the single-linkage dendrogram. `unitCost` is the work of one
 * distance evaluation, for progress.
 */
export async function singleLinkageMst(
  n: number, distance: (i: number, j: number) => number, ctx: JobContext = quietContext, unitCost = 1,
): Promise<RawMerges> {
  const raw = rawMerges(n);
  const merged = new Uint8Array(n);
  const nearest = new Float64Array(n).fill(Infinity);
  const meter = new WorkMeter(ctx, 'linkage');
  let x = 0;
  for (let k = 0; k < n - 1; k++) {
    merged[x] = 1;
    let best = Infinity;
    let y = -1;
    for (let i = 0; i < n; i++) {
      if (merged[i]) continue;
      const v = distance(x, i);
      if (v < nearest[i]) nearest[i] = v;
      if (nearest[i] < best || y < 0) { best = nearest[i]; y = i; }
    }
    raw.a[k] = x;
    raw.b[k] = y;
    raw.height[k] = best;
    x = y;
    if (meter.add((n - k) * unitCost)) await meter.checkIn(1 - ((n - k) / n) ** 2);
  }
  return raw;
}
