/** Linkage criteria on Euclidean distance. */
export type Linkage = 'ward' | 'average' | 'complete' | 'single';
export const LINKAGES: readonly Linkage[] = ['ward', 'average', 'complete', 'single'];

/**
 * A dendrogram as n - 1 merges, numbered like SciPy's linkage matrix: leaves are 0..n-1 and merge i
 * creates node n + i from `left[i]` and `right[i]` (left < right after relabelling) at `height[i]`;
 * `size[i]` counts the windows below it. Merges are in non-decreasing height.
 */
export interface MergeTree {
  /** Leaves. */
  n: number;
  left: Int32Array;
  right: Int32Array;
  height: Float64Array;
  size: Int32Array;
  /** Two-stage trees: windows per micro-cluster leaf (sizes then count windows, not leaves). */
  leafWeights?: Int32Array;
}

/**
 * Merges as found by an algorithm, each joining two cluster *slots* (a leaf index standing for the
 * cluster it now represents). `toMergeTree` turns them into a MergeTree.
 */
export interface RawMerges {
  n: number;
  a: Int32Array;
  b: Int32Array;
  height: Float64Array;
}

export function rawMerges(n: number): RawMerges {
  const m = Math.max(0, n - 1);
  return { n, a: new Int32Array(m), b: new Int32Array(m), height: new Float64Array(m) };
}

/**
 * Stable sort of the merges by height, then node numbering by union–find: each merge joins the
 * current clusters of its two slots, the smaller node id on the left, and creates node n + i.
 * `weights` (windows per leaf) set the sizes; 1 per leaf when absent.
 */
export function toMergeTree(raw: RawMerges, weights?: Int32Array): MergeTree {
  const { n } = raw;
  const m = raw.height.length;
  const order = Array.from({ length: m }, (_, i) => i).sort((x, y) => raw.height[x] - raw.height[y] || x - y);
  const parent = new Int32Array(2 * n - 1 > 0 ? 2 * n - 1 : 1);
  for (let i = 0; i < parent.length; i++) parent[i] = i;
  const nodeSize = new Int32Array(parent.length);
  for (let i = 0; i < n; i++) nodeSize[i] = weights ? weights[i] : 1;
  const find = (x: number): number => {
    let r = x;
    while (parent[r] !== r) r = parent[r];
    while (parent[x] !== r) { const next = parent[x]; parent[x] = r; x = next; }
    return r;
  };
  const tree: MergeTree = {
    n, left: new Int32Array(m), right: new Int32Array(m), height: new Float64Array(m), size: new Int32Array(m),
  };
  if (weights) tree.leafWeights = weights;
  order.forEach((src, i) => {
    const ra = find(raw.a[src]);
    const rb = find(raw.b[src]);
    const node = n + i;
    tree.left[i] = Math.min(ra, rb);
    tree.right[i] = Math.max(ra, rb);
    tree.height[i] = raw.height[src];
    parent[ra] = node;
    parent[rb] = node;
    nodeSize[node] = nodeSize[ra] + nodeSize[rb];
    tree.size[i] = nodeSize[node];
  });
  return tree;
}
