import type { MergeTree } from './merge-tree';

/**
 * Leaves in dendrogram order: depth first from the root, left child before right (SciPy's
 * leaves_list). Several roots (a forest) are never produced by `toMergeTree`; n = 1 gives [0].
 */
export function leafOrder(tree: MergeTree): Int32Array {
  const { n } = tree;
  const out = new Int32Array(n);
  if (n === 1) return out;
  const stack = [2 * n - 2];
  let w = 0;
  while (stack.length > 0) {
    const node = stack.pop() as number;
    if (node < n) { out[w++] = node; continue; }
    const i = node - n;
    stack.push(tree.right[i], tree.left[i]);
  }
  return out;
}
