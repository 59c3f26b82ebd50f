import { childrenOf, rootOf, type TreeIndex } from './tree-index';

/** A node of the drawn (summarised) tree; `collapsed` nodes stand for a whole subtree. */
export interface SummaryNode {
  /** Node number in the MergeTree. */
  id: number;
  height: number;
  windows: number;
  /** Leaves of the MergeTree below (1 for a leaf). */
  leaves: number;
  collapsed: boolean;
  children?: SummaryNode[];
}

export interface SummaryOptions {
  /** At most this many terminals (leaves or collapsed subtrees) are drawn. */
  maxTerminals: number;
  /** Subtrees holding fewer than this share of all windows are not opened. */
  minShare: number;
}

export const DEFAULT_SUMMARY: SummaryOptions = { maxTerminals: 160, minShare: 0.002 };

/**
 * The top of the dendrogram: starting from the root, the highest open node is split into its two
 * children until `maxTerminals` terminals are shown; nodes with fewer than `minShare` of the windows
 * stay closed. Each closed internal node becomes one glyph with its window count, so a tree of any
 * size draws at most about 2 × maxTerminals branches.
 */
export function summarise(index: TreeIndex, options: SummaryOptions = DEFAULT_SUMMARY): SummaryNode {
  const { tree } = index;
  const root = rootOf(index);
  const total = index.windows[root] || 1;
  const minWindows = options.minShare * total;
  const open = new Set<number>();
  // Candidates to open, highest first (a small binary heap on height).
  const heap: number[] = [];
  const push = (node: number) => {
    heap.push(node);
    let i = heap.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (index.height[heap[p]] >= index.height[heap[i]]) break;
      [heap[p], heap[i]] = [heap[i], heap[p]];
      i = p;
    }
  };
  const pop = (): number => {
    const top = heap[0], last = heap.pop() as number;
    if (heap.length > 0) {
      heap[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1, r = l + 1;
        let m = i;
        if (l < heap.length && index.height[heap[l]] > index.height[heap[m]]) m = l;
        if (r < heap.length && index.height[heap[r]] > index.height[heap[m]]) m = r;
        if (m === i) break;
        [heap[m], heap[i]] = [heap[i], heap[m]];
        i = m;
      }
    }
    return top;
  };
  const openable = (node: number) => node >= tree.n && index.windows[node] >= minWindows;
  let terminals = 1;
  if (openable(root)) push(root);
  while (heap.length > 0 && terminals < options.maxTerminals) {
    const node = pop();
    open.add(node);
    terminals += 1;
    for (const c of childrenOf(index, node)) if (openable(c)) push(c);
  }
  const build = (node: number): SummaryNode => {
    const leaves = index.end[node] - index.start[node];
    const base = { id: node, height: index.height[node], windows: index.windows[node], leaves };
    if (!open.has(node)) return { ...base, collapsed: node >= tree.n };
    return { ...base, collapsed: false, children: childrenOf(index, node).map(build) };
  };
  return build(root);
}
