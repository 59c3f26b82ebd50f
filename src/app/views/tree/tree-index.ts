import { leafOrder } from '../../../core/cluster/hierarchy/leaf-order';
import type { MergeTree } from '../../../core/cluster/hierarchy/merge-tree';

/**
 * Per-node facts the Tree view needs, built once per tree in O(n): where each node's leaves sit in
 * dendrogram order (a contiguous range [start, end)), its lowest-numbered leaf (which names its
 * cluster in a cut, as cutTree numbers clusters by their lowest leaf) and its window count.
 * Nodes are numbered as in the MergeTree: leaves 0..n-1, merge i is node n + i.
 */
export interface TreeIndex {
  tree: MergeTree;
  /** Leaves in dendrogram order. */
  order: Int32Array;
  /** Position of each leaf in `order`. */
  position: Int32Array;
  start: Int32Array;
  end: Int32Array;
  /** Any leaf of the node (its first in dendrogram order). */
  firstLeaf: Int32Array;
  /** Windows under the node (leaf weights on the two-stage path, else leaves). */
  windows: Int32Array;
  /** Height of the node (0 for leaves). */
  height: Float64Array;
}

export function indexTree(tree: MergeTree): TreeIndex {
  const { n } = tree;
  const nodes = Math.max(1, 2 * n - 1);
  const order = leafOrder(tree);
  const position = new Int32Array(n);
  for (let p = 0; p < n; p++) position[order[p]] = p;
  const start = new Int32Array(nodes), end = new Int32Array(nodes), firstLeaf = new Int32Array(nodes);
  const windows = new Int32Array(nodes), height = new Float64Array(nodes);
  for (let leaf = 0; leaf < n; leaf++) {
    start[leaf] = position[leaf];
    end[leaf] = position[leaf] + 1;
    firstLeaf[leaf] = leaf;
    windows[leaf] = tree.leafWeights ? tree.leafWeights[leaf] : 1;
  }
  // Merges come in height order, so both children of merge i exist before node n + i.
  for (let i = 0; i < n - 1; i++) {
    const node = n + i, l = tree.left[i], r = tree.right[i];
    start[node] = Math.min(start[l], start[r]);
    end[node] = Math.max(end[l], end[r]);
    firstLeaf[node] = start[l] <= start[r] ? firstLeaf[l] : firstLeaf[r];
    windows[node] = windows[l] + windows[r];
    height[node] = tree.height[i];
  }
  return { tree, order, position, start, end, firstLeaf, windows, height };
}

/** The root node's number. */
export function rootOf(index: TreeIndex): number {
  return Math.max(0, 2 * index.tree.n - 2);
}

/** Children of an internal node, left (earlier in dendrogram order) first; [] for a leaf. */
export function childrenOf(index: TreeIndex, node: number): number[] {
  const { n, left, right } = index.tree;
  if (node < n) return [];
  const l = left[node - n], r = right[node - n];
  return index.start[l] <= index.start[r] ? [l, r] : [r, l];
}

/**
 * Mask over windows under a node: window w belongs when its leaf (leafOf[w], or w itself when the
 * leaves are windows) lies in the node's range of the dendrogram order. Returns the mask and count.
 */
export function windowsUnder(index: TreeIndex, node: number, nWindows: number, leafOf?: Int32Array): { mask: Uint8Array; count: number } {
  const mask = new Uint8Array(nWindows);
  const s = index.start[node], e = index.end[node];
  let count = 0;
  for (let w = 0; w < nWindows; w++) {
    const p = index.position[leafOf ? leafOf[w] : w];
    if (p >= s && p < e) { mask[w] = 1; count++; }
  }
  return { mask, count };
}
