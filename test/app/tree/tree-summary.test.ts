/**
 * The Tree view's helpers on SciPy's documented 12-point example
 * (scipy/cluster/hierarchy/_hierarchy_impl.py docstrings, verified with SciPy 1.17.1; the values are
 * copied here, no file is read).
 */
import { describe, expect, it } from 'vitest';
import { hierarchical } from '../../../src/core/cluster/hierarchy';
import { CUT_RATES, clustersAtHeight, clustersForDrag, heightForClusters } from '../../../src/app/views/tree/cut-line';
import { summarise } from '../../../src/app/views/tree/summary';
import { indexTree, rootOf, windowsUnder } from '../../../src/app/views/tree/tree-index';

const X = new Float64Array([0, 0, 0, 1, 1, 0, 0, 4, 0, 3, 1, 4, 4, 0, 3, 0, 4, 1, 4, 4, 3, 4, 4, 3]);

async function wardTree() {
  return hierarchical(X, 12, 2, { linkage: 'ward' });
}

describe('tree cut line', () => {
  it('counts clusters at a height as SciPy fcluster(criterion="distance") does', async () => {
    const tree = await wardTree();
    // SciPy docstring: ward, t = 1.1 -> 8 clusters; t = 3 -> 4 clusters.
    expect(clustersAtHeight(tree, 1.1)).toBe(8);
    expect(clustersAtHeight(tree, 3)).toBe(4);
  });

  it('places the line for k clusters between the merges that bound k', async () => {
    const tree = await wardTree();
    // Ward heights (SciPy docstring): 1 ×4, 1.29099445 ×4, 5.77350269 ×2, 8.16496581.
    expect(heightForClusters(tree, 4)).toBeCloseTo((1.29099445 + 5.77350269) / 2, 6);
    for (const k of [2, 4, 8, 12]) expect(clustersAtHeight(tree, heightForClusters(tree, k))).toBe(k);
    // Two merges tie at 5.77350269, so no height leaves exactly 3 clusters: the line lands on the tie (2).
    expect(clustersAtHeight(tree, heightForClusters(tree, 3))).toBe(2);
  });
});

describe('dragging the cut by merge steps', () => {
  it('moves one merge per rate pixels, whole steps only, within 2..max', () => {
    // Start at 8 clusters, 10 px per merge: 45 px towards the leaves opens 4 merges (12), not 12.
    expect(clustersForDrag(8, 45, 10, 255)).toBe(12);
    expect(clustersForDrag(8, 9, 10, 255)).toBe(8);
    expect(clustersForDrag(8, -45, 10, 255)).toBe(4);
    expect(clustersForDrag(8, -1000, 10, 255)).toBe(2);
    expect(clustersForDrag(8, 1000, 10, 20)).toBe(20);
    // The fine rate needs 24 px a step: the same 45 px is one merge.
    expect(clustersForDrag(8, 45, 24, 255)).toBe(9);
    expect(CUT_RATES.map((r) => r.px)).toEqual([4, 10, 24]);
  });
});

describe('tree index and summary', () => {
  it('gives each node its windows as one contiguous range of the dendrogram order', async () => {
    const tree = await wardTree();
    const index = indexTree(tree);
    const root = rootOf(index);
    expect(index.windows[root]).toBe(12);
    expect(windowsUnder(index, root, 12).count).toBe(12);
    // The four groups of three (SciPy: ward t = 3 -> {0,1,2},{3,4,5},{6,7,8},{9,10,11}) are nodes of 3 windows.
    const threes: number[][] = [];
    for (let i = 0; i < tree.n - 1; i++) {
      if (tree.size[i] !== 3) continue;
      const { mask } = windowsUnder(index, tree.n + i, 12);
      threes.push([...mask.keys()].filter((w) => mask[w] === 1));
    }
    expect(threes.sort((a, b) => a[0] - b[0])).toEqual([[0, 1, 2], [3, 4, 5], [6, 7, 8], [9, 10, 11]]);
  });

  it('opens the highest merges first and collapses the rest with their counts', async () => {
    const tree = await wardTree();
    const s = summarise(indexTree(tree), { maxTerminals: 4, minShare: 0 });
    const terminals: { windows: number; collapsed: boolean }[] = [];
    const walk = (n: typeof s) => (n.children ? n.children.forEach(walk) : terminals.push({ windows: n.windows, collapsed: n.collapsed }));
    walk(s);
    expect(terminals).toHaveLength(4);
    expect(terminals.every((t) => t.windows === 3 && t.collapsed)).toBe(true);
    expect(s.windows).toBe(12);
  });
});
