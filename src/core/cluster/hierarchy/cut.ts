import { OptionError } from '../../errors';
import type { MergeTree } from './merge-tree';

export type CutOptions = { k: number } | { height: number };

/**
 * Flat clusters of the leaves. `{ k }` applies the first n − k merges (in height order), leaving
 * k clusters; `{ height }` applies every merge at or below that height, so leaves in one cluster
 * are joined at a height ≤ h (SciPy's fcluster criterion "distance"). Labels are 0.. in the order of
 * each cluster's lowest leaf.
 */
export function cutTree(tree: MergeTree, cut: CutOptions): Int32Array {
  const { n } = tree;
  let merges: number;
  if ('k' in cut) {
    if (!Number.isInteger(cut.k) || cut.k < 1 || cut.k > n) throw new OptionError('k', cut.k, `an integer from 1 to ${n}`);
    merges = n - cut.k;
  } else {
    if (typeof cut.height !== 'number' || Number.isNaN(cut.height)) throw new OptionError('height', cut.height, 'a number');
    merges = 0;
    while (merges < n - 1 && tree.height[merges] <= cut.height) merges++;
  }
  // Union–find over nodes; node n + i joins left[i] and right[i].
  const parent = new Int32Array(2 * n - 1 > 0 ? 2 * n - 1 : 1);
  for (let i = 0; i < parent.length; i++) parent[i] = i;
  const find = (x: number): number => {
    let r = x;
    while (parent[r] !== r) r = parent[r];
    while (parent[x] !== r) { const next = parent[x]; parent[x] = r; x = next; }
    return r;
  };
  for (let i = 0; i < merges; i++) {
    parent[find(tree.left[i])] = n + i;
    parent[find(tree.right[i])] = n + i;
  }
  const ids = new Map<number, number>();
  const labels = new Int32Array(n);
  for (let leaf = 0; leaf < n; leaf++) {
    const root = find(leaf);
    let id = ids.get(root);
    if (id === undefined) { id = ids.size; ids.set(root, id); }
    labels[leaf] = id;
  }
  return labels;
}
