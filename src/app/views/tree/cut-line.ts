import type { MergeTree } from '../../../core/cluster/hierarchy/merge-tree';

/** Clusters left when every merge at or below `height` is applied (SciPy's "distance" criterion). */
export function clustersAtHeight(tree: MergeTree, height: number): number {
  // Merges are in non-decreasing height: count those ≤ height by binary search.
  let lo = 0, hi = tree.height.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (tree.height[mid] <= height) lo = mid + 1;
    else hi = mid;
  }
  return tree.n - lo;
}

/**
 * A height that leaves exactly k clusters: midway between the merge that makes k clusters and the
 * next one (the top merge plus a margin for k = 1). Ties in height can make some k unreachable by a
 * height; then the nearest reachable count results.
 */
export function heightForClusters(tree: MergeTree, k: number): number {
  const m = tree.height.length;
  if (m === 0) return 0;
  const applied = Math.min(m, Math.max(0, tree.n - k));
  const below = applied > 0 ? tree.height[applied - 1] : 0;
  const above = applied < m ? tree.height[applied] : tree.height[m - 1] * 1.05;
  return (below + above) / 2;
}

/** Drag rates of the cut line: pixels of drag per merge step (the Tree's "Drag" choice; the middle one is the default). */
export const CUT_RATES: readonly { px: number; label: string }[] = [
  { px: 4, label: 'fast' },
  { px: 10, label: 'normal' },
  { px: 24, label: 'fine' },
];

/**
 * The cluster count a drag of the cut line reaches: the drag moves the cut by whole merges, one per
 * `pxPerMerge` pixels whatever the merge heights (so the low, crowded merges of a tree do not
 * rush by). `delta` > 0 is towards the leaves (more clusters). Kept within 2..max.
 */
export function clustersForDrag(startK: number, delta: number, pxPerMerge: number, max: number): number {
  const steps = Math.trunc(delta / Math.max(1, pxPerMerge));
  return Math.max(2, Math.min(max, startK + steps));
}
