import { describe, expect, it } from 'vitest';
import {
  cutTree, hierarchical, leafOrder, linkageFromDistances, type Linkage, type MergeTree,
} from '../../../src/core/cluster/hierarchy';
import { CancelledError } from '../../../src/core/errors';
import type { JobContext } from '../../../src/core/job';

// Values read from the SciPy scipy/cluster/hierarchy/_hierarchy_impl.py docstrings (verified with
// SciPy 1.17.1); sources of the other cases beside them.
const X12 = Float64Array.from([0, 0, 0, 1, 1, 0, 0, 4, 0, 3, 1, 4, 4, 0, 3, 0, 4, 1, 4, 4, 3, 4, 4, 3]);
const S2 = Math.SQRT2;

const SCIPY_HEIGHTS: Record<Linkage, number[]> = {
  single: [1, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2],
  complete: [1, 1, 1, 1, S2, S2, S2, S2, 4.12310563, 4.12310563, 5.65685425],
  average: [1, 1, 1, 1, 1.20710678, 1.20710678, 1.20710678, 1.20710678, 3.39675184, 3.39675184, 4.09206523],
  ward: [1, 1, 1, 1, 1.29099445, 1.29099445, 1.29099445, 1.29099445, 5.77350269, 5.77350269, 8.16496581],
};

function groups(labels: Int32Array): number[][] {
  const by = new Map<number, number[]>();
  labels.forEach((c, i) => { by.set(c, [...(by.get(c) ?? []), i]); });
  return [...by.values()].sort((a, b) => a[0] - b[0]);
}

function checkStructure(t: MergeTree): void {
  const { n } = t;
  const used = new Uint8Array(2 * n - 1);
  for (let i = 0; i < n - 1; i++) {
    expect(t.left[i]).toBeLessThan(t.right[i]);
    expect(t.right[i]).toBeLessThan(n + i);
    expect(used[t.left[i]] + used[t.right[i]]).toBe(0);
    used[t.left[i]] = used[t.right[i]] = 1;
    if (i > 0) expect(t.height[i]).toBeGreaterThanOrEqual(t.height[i - 1]);
  }
  expect(t.size[n - 2]).toBe(n);
}

describe('hierarchical(data, n, d, { linkage })', () => {
  for (const linkage of ['single', 'complete', 'average', 'ward'] as const) {
    it(`gives SciPy's ${linkage} merge heights on the 12-point example`, async () => {
      const t = await hierarchical(X12, 12, 2, { linkage });
      // SciPy linkage(X, '${linkage}') docstring heights.
      SCIPY_HEIGHTS[linkage].forEach((h, i) => expect(t.height[i]).toBeCloseTo(h, 7));
      checkStructure(t);
    });
  }

  it("gives SciPy's full single-linkage Z on the 12-point example", async () => {
    const t = await hierarchical(X12, 12, 2, { linkage: 'single' });
    // SciPy single(X) docstring Z, rows [left, right, height, size].
    const Z = [[0, 1, 1, 2], [2, 12, 1, 3], [3, 4, 1, 2], [5, 14, 1, 3], [6, 7, 1, 2], [8, 16, 1, 3],
      [9, 10, 1, 2], [11, 18, 1, 3], [13, 15, 2, 6], [17, 20, 2, 9], [19, 21, 2, 12]];
    const got = Array.from({ length: 11 }, (_, i) => [t.left[i], t.right[i], t.height[i], t.size[i]]);
    expect(got).toEqual(Z);
  });

  it('matches a linkage of a condensed matrix of the same points', async () => {
    const D: number[] = [];
    for (let i = 0; i < 12; i++) for (let j = i + 1; j < 12; j++) D.push(Math.hypot(X12[2 * i] - X12[2 * j], X12[2 * i + 1] - X12[2 * j + 1]));
    for (const linkage of ['single', 'complete', 'average', 'ward'] as const) {
      const t = await linkageFromDistances(Float64Array.from(D), 12, { linkage });
      SCIPY_HEIGHTS[linkage].forEach((h, i) => expect(t.height[i]).toBeCloseTo(h, 7));
    }
  });

  it('rejects an unknown linkage and non-finite values', async () => {
    await expect(hierarchical(X12, 12, 2, { linkage: 'centroid' as Linkage })).rejects.toThrow(/linkage/);
    const bad = Float64Array.from(X12);
    bad[5] = NaN;
    await expect(hierarchical(bad, 12, 2, { linkage: 'ward' })).rejects.toThrow(/window 3, feature 2/);
  });

  it('reports progress and stops at a cancelled checkpoint', async () => {
    const fractions: number[] = [];
    let calls = 0;
    const ctx: JobContext = {
      progress: (_s, f) => fractions.push(f),
      checkpoint: () => (++calls > 3 ? Promise.reject(new CancelledError()) : Promise.resolve()),
    };
    // 4,000 windows: about 4000² × 4 / 2 units of work, several 2e7-unit slices, so the run checks in.
    const big = 4000;
    const data2 = Float64Array.from({ length: big * 4 }, (_, i) => (Math.sin(i * 12.9898) * 43758.5453) % 1);
    await expect(hierarchical(data2, big, 4, { linkage: 'ward' }, ctx)).rejects.toBeInstanceOf(CancelledError);
    expect(fractions.some((f) => f > 0 && f < 1)).toBe(true);
  });
});

describe('the Wikipedia 5-item matrix', () => {
  // Wikipedia "UPGMA" / "Complete-linkage clustering" example (the pages show the
  // first steps; the full merge heights computed with SciPy 1.17).
  // Items a..e; condensed order ab ac ad ae bc bd be cd ce de.
  const D = Float64Array.from([17, 21, 31, 23, 30, 34, 21, 28, 39, 43]);
  const cases: [Linkage, number[]][] = [
    ['single', [17, 21, 21, 28]],
    ['complete', [17, 23, 28, 43]],
    ['average', [17, 22, 28, 33]],
  ];
  for (const [linkage, heights] of cases) {
    it(`gives ${linkage} heights ${heights.join(', ')}`, async () => {
      const t = await linkageFromDistances(D, 5, { linkage });
      expect(Array.from(t.height)).toEqual(heights);
      checkStructure(t);
    });
  }
  it('leaves the input matrix unchanged', async () => {
    const copy = D.slice();
    await linkageFromDistances(D, 5, { linkage: 'average' });
    expect(D).toEqual(copy);
  });
});

describe('cutTree(tree, cut)', () => {
  it("gives SciPy's fcluster flat cuts by distance on the 12-point example", async () => {
    // SciPy fcluster docstring: single t=0.9 -> 12 clusters,
    // t=1 -> {0,1,2},{3,4,5},{6,7,8},{9,10,11}; ward t=1.1 -> 8 clusters, t=3 -> the same 4.
    const four = [[0, 1, 2], [3, 4, 5], [6, 7, 8], [9, 10, 11]];
    const single = await hierarchical(X12, 12, 2, { linkage: 'single' });
    expect(groups(cutTree(single, { height: 0.9 }))).toHaveLength(12);
    expect(groups(cutTree(single, { height: 1 }))).toEqual(four);
    const ward = await hierarchical(X12, 12, 2, { linkage: 'ward' });
    expect(groups(cutTree(ward, { height: 1.1 }))).toHaveLength(8);
    expect(groups(cutTree(ward, { height: 3 }))).toEqual(four);
  });

  it('cuts by number of clusters, labels in order of the lowest leaf', async () => {
    const ward = await hierarchical(X12, 12, 2, { linkage: 'ward' });
    expect(Array.from(cutTree(ward, { k: 4 }))).toEqual([0, 0, 0, 1, 1, 1, 2, 2, 2, 3, 3, 3]);
    expect(Array.from(cutTree(ward, { k: 1 }))).toEqual(new Array(12).fill(0));
    expect(Array.from(cutTree(ward, { k: 12 }))).toEqual(Array.from({ length: 12 }, (_, i) => i));
    expect(() => cutTree(ward, { k: 13 })).toThrow(/k/);
  });
});

describe('leafOrder(tree)', () => {
  it('lists every leaf once, each cluster of a cut contiguous', async () => {
    const ward = await hierarchical(X12, 12, 2, { linkage: 'ward' });
    const order = Array.from(leafOrder(ward));
    expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: 12 }, (_, i) => i));
    const labels = cutTree(ward, { k: 4 });
    const seq = order.map((leaf) => labels[leaf]);
    const runs = seq.filter((c, i) => i === 0 || c !== seq[i - 1]);
    expect(runs).toHaveLength(4);
  });

  it("follows left before right from the root (SciPy leaves_list on the single Z)", async () => {
    // Traversal of the SciPy single Z above, worked by hand from its rows: 22 = (19, 21),
    // 19 = (11, 18), 18 = (9, 10); 21 = (17, 20), 17 = (8, 16), 16 = (6, 7); 20 = (13, 15),
    // 13 = (2, 12), 12 = (0, 1); 15 = (5, 14), 14 = (3, 4).
    const single = await hierarchical(X12, 12, 2, { linkage: 'single' });
    expect(Array.from(leafOrder(single))).toEqual([11, 9, 10, 8, 6, 7, 2, 0, 1, 5, 3, 4]);
  });
});
