import { describe, expect, it } from 'vitest';
import { carryIdentities, withSavedIdentities } from '../../../src/core/curation/carry-identities';
import type { AnalysisResult } from '../../../src/core/analysis.types';
import { cutTree, hierarchical } from '../../../src/core/cluster/hierarchy';
import { seededRandom } from '../../../src/core/random';

const I = (a: number[]) => Int32Array.from(a);

describe('carryIdentities', () => {
  it('keeps indices through a split, a merge and a new cluster (worked by hand)', () => {
    // Windows 0..11. Before: cluster 0 = {0..4} (5), 1 = {5,6,7} (3), 2 = {8,9} (2), 3 = {10,11} (2).
    const previous = I([0, 0, 0, 0, 0, 1, 1, 1, 2, 2, 3, 3]);
    // The new cut (numbered by lowest window, as cutTree does): 0 = {0,1,2}, 1 = {3,4}, 2 = {5..9}, 3 = {10,11}.
    const cut = I([0, 0, 0, 1, 1, 2, 2, 2, 2, 2, 3, 3]);
    // Shared windows (cut × previous): c0: p0 3 · c1: p0 2 · c2: p1 3, p2 2 · c3: p3 2.
    // Best previous: c0 → 0, c1 → 0, c2 → 1 (3 > 2: the merge keeps the larger), c3 → 3.
    // Previous 0 is claimed by c0 (3 windows) and c1 (2): the larger part c0 keeps index 0.
    // c1 is unmatched: a fresh index after the previous maximum 3 → 4. Previous 2 is dropped into c2.
    const r = carryIdentities(previous, cut);
    expect(Array.from(r.indexOf)).toEqual([0, 4, 1, 3]);
    expect(r.origin).toEqual(['kept', 'new', 'kept', 'kept']);
    expect(Array.from(r.labels)).toEqual([0, 0, 0, 4, 4, 1, 1, 1, 1, 1, 3, 3]);
    expect(r.dropped).toEqual([{ index: 2, into: 2 }]);
    expect(r.slots).toBe(5);
  });

  it('gives fresh indices in the order of the cut numbering, after the previous maximum', () => {
    // Before: 0 = {0..5}, 1 = {6,7}. Cut: 0 = {0,1}, 1 = {2,3,4}, 2 = {5}, 3 = {6,7}.
    // c1 (3 windows of previous 0) keeps 0; c0 → 2, c2 → 3 (fresh, cut order); c3 keeps 1.
    const r = carryIdentities(I([0, 0, 0, 0, 0, 0, 1, 1]), I([0, 0, 1, 1, 1, 2, 3, 3]));
    expect(Array.from(r.indexOf)).toEqual([2, 0, 3, 1]);
    expect(Array.from(r.labels)).toEqual([2, 2, 0, 0, 0, 3, 1, 1]);
    expect(r.slots).toBe(4);
  });

  it('breaks ties by the lowest index', () => {
    // A merge of two equal clusters keeps the lower previous index.
    const merge = carryIdentities(I([3, 3, 1, 1]), I([0, 0, 0, 0]));
    expect(Array.from(merge.labels)).toEqual([1, 1, 1, 1]);
    expect(merge.dropped).toEqual([{ index: 3, into: 0 }]);
    // A split into equal halves: the lower cut number keeps the index, the other is fresh (max 0 → 1).
    const split = carryIdentities(I([0, 0, 0, 0]), I([0, 0, 1, 1]));
    expect(Array.from(split.labels)).toEqual([0, 0, 1, 1]);
    expect(split.origin).toEqual(['kept', 'new']);
  });

  it('leaves gaps where previous clusters were merged away, and counts slots from the highest index used', () => {
    // Before: 0 = {0,1,2}, 1 = {3}, 2 = {4,5}. The cut merges 1 into 0: index 1 is left empty.
    const r = carryIdentities(I([0, 0, 0, 1, 2, 2]), I([0, 0, 0, 0, 1, 1]));
    expect(Array.from(r.labels)).toEqual([0, 0, 0, 0, 2, 2]);
    expect(r.slots).toBe(3);
    expect(r.dropped).toEqual([{ index: 1, into: 0 }]);
  });

  it('gives a remembered index back to a cluster that shares a majority of windows with it both ways', () => {
    // Before: 0 = {0,1,2}, 1 = {3..7}; index 4 was {6,7} before an earlier re-cut merged it into 1.
    // Cut: 0 = {0,1,2}, 1 = {3,4,5}, 2 = {6,7}. c1 (3 windows) keeps 1; c2 shares 2 of 2 with index 4.
    const previous = I([0, 0, 0, 1, 1, 1, 1, 1]), cut = I([0, 0, 0, 1, 1, 1, 2, 2]);
    const r = carryIdentities(previous, cut, { remembered: [{ index: 4, windows: I([6, 7]) }] });
    expect(Array.from(r.labels)).toEqual([0, 0, 0, 1, 1, 1, 4, 4]);
    expect(r.origin).toEqual(['kept', 'kept', 'remembered']);
    expect(r.slots).toBe(5);
    // Without the memory, or when the overlap is not a majority of the remembered windows, it is fresh (2).
    expect(Array.from(carryIdentities(previous, cut).labels)).toEqual([0, 0, 0, 1, 1, 1, 2, 2]);
    const weak = carryIdentities(previous, cut, { remembered: [{ index: 4, windows: I([5, 6, 7, 3]) }] });
    expect(Array.from(weak.labels)).toEqual([0, 0, 0, 1, 1, 1, 2, 2]);
    // An index some cluster kept is never given a second time.
    const taken = carryIdentities(previous, cut, { remembered: [{ index: 1, windows: I([6, 7]) }] });
    expect(Array.from(taken.labels)).toEqual([0, 0, 0, 1, 1, 1, 2, 2]);
  });

  it('ignores windows without a previous cluster and refuses mismatched input', () => {
    const r = carryIdentities(I([-1, -1, 0, 0]), I([0, 0, 1, 1]));
    expect(Array.from(r.labels)).toEqual([1, 1, 0, 0]);
    expect(() => carryIdentities(I([0, 0]), I([0]))).toThrow(/2 previous labels for 1 windows/);
    expect(() => carryIdentities(I([0]), I([-1]))).toThrow(/not a cluster number/);
  });

  it('returns to the same labels when a tree is cut finer and back (nested cuts), same output every time', async () => {
    const rand = seededRandom(7);
    const n = 60, d = 2;
    const data = new Float64Array(n * d);
    for (let i = 0; i < n; i++) {
      const g = i % 6;
      data[i * d] = (g % 3) * 10 + rand();
      data[i * d + 1] = Math.floor(g / 3) * 10 + rand();
    }
    const tree = await hierarchical(data, n, d, { linkage: 'ward' });
    const at3 = cutTree(tree, { k: 3 });
    const to8 = carryIdentities(at3, cutTree(tree, { k: 8 }));
    // Going finer only splits: indices 0..2 each stay with one part, five fresh ones are 3..7.
    expect(new Set(to8.labels).size).toBe(8);
    expect(to8.slots).toBe(8);
    for (let i = 0; i < n; i++) if (to8.labels[i] < 3) expect(to8.labels[i]).toBe(at3[i]);
    const back = carryIdentities(to8.labels, cutTree(tree, { k: 3 }));
    expect(Array.from(back.labels)).toEqual(Array.from(at3));
    expect(back.dropped.map((x) => x.index)).toEqual([3, 4, 5, 6, 7]);
    expect(Array.from(carryIdentities(at3, cutTree(tree, { k: 8 })).labels)).toEqual(Array.from(to8.labels));
  });
});

describe('withSavedIdentities', () => {
  const tree = (labels: number[], k: number, centroids: number[]) => ({
    labels: I(labels), sizes: new Int32Array(k), centroids: Float64Array.from(centroids),
    cluster: { method: 'hierarchical', linkage: 'ward', k, path: 'exact', space: 'features' },
  }) as unknown as AnalysisResult;

  it('numbers a recomputed cut like the saved one (gaps kept), the means following their clusters', () => {
    // Saved (after re-cuts in the app): indices 0, 4 and 2; index 1 and 3 empty, k = 5 slots.
    const saved = tree([0, 0, 4, 4, 2], 5, []);
    // Recomputed: the same partition numbered by lowest window, 1-d means 10, 20, 30.
    const redone = tree([0, 0, 1, 1, 2], 3, [10, 20, 30]);
    const r = withSavedIdentities(saved, redone);
    expect(Array.from(r.labels)).toEqual([0, 0, 4, 4, 2]);
    expect(r.cluster.k).toBe(5);
    expect(Array.from(r.sizes)).toEqual([2, 0, 1, 0, 2]);
    expect(Array.from(r.centroids)).toEqual([10, 0, 30, 0, 20]);
  });

  it('leaves k-means results and results of another length as they are', () => {
    const km = { ...tree([1, 0], 2, [1, 2]), cluster: { method: 'kmeans', k: 2 } } as unknown as AnalysisResult;
    expect(withSavedIdentities(tree([0, 1], 2, []), km)).toBe(km);
    const short = tree([0], 1, [5]);
    expect(withSavedIdentities(tree([0, 1], 2, []), short)).toBe(short);
  });
});
