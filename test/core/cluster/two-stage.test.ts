import { describe, expect, it } from 'vitest';
import {
  clusterHierarchy, cutConfidence, cutTree, hierarchical, twoStageHierarchy, windowLabels,
} from '../../../src/core/cluster/hierarchy';
import { adjustedRandIndex } from '../../../src/core/metrics/ari';
import { normal, seededRandom } from '../../../src/core/random';

function blobs(n: number, d: number, k: number, seed: number): { data: Float64Array; truth: Int32Array } {
  const random = seededRandom(seed);
  const centres = Float64Array.from({ length: k * d }, () => 6 * normal(random));
  const data = new Float64Array(n * d);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    truth[i] = i % k;
    for (let j = 0; j < d; j++) data[i * d + j] = centres[truth[i] * d + j] + normal(random);
  }
  return { data, truth };
}

describe('twoStageHierarchy(data, n, d, options)', () => {
  it('builds a tree over micro-clusters whose weights count every window', async () => {
    const { data, truth } = blobs(3000, 6, 4, 5);
    const r = await twoStageHierarchy(data, 3000, 6, { linkage: 'ward', microClusters: 60, seed: 1 });
    const leaves = r.tree.n;
    expect(leaves).toBeLessThanOrEqual(60);
    expect(r.tree.leafWeights).toBeDefined();
    const weights = r.tree.leafWeights as Int32Array;
    expect(weights.reduce((s, w) => s + w, 0)).toBe(3000);
    expect(r.tree.size[leaves - 2]).toBe(3000);
    const counts = new Int32Array(leaves);
    r.assignment.forEach((leaf) => counts[leaf]++);
    expect(counts).toEqual(weights);
    // Well separated planted blobs (common practice: such blobs are recovered exactly).
    const labels = windowLabels(cutTree(r.tree, { k: 4 }), r.assignment);
    expect(adjustedRandIndex(labels, truth)).toBeCloseTo(1, 12);
  });

  it('fits micro-clusters on a sample when there are many windows each: centroids are the means of their windows', async () => {
    // 3,000 windows, 60 micro-clusters: more than 16 windows each, so Lloyd runs on a seeded sample.
    const { data } = blobs(3000, 6, 4, 5);
    const a = await twoStageHierarchy(data, 3000, 6, { linkage: 'ward', microClusters: 60, seed: 1 });
    const b = await twoStageHierarchy(data, 3000, 6, { linkage: 'ward', microClusters: 60, seed: 1 });
    expect(b.assignment).toEqual(a.assignment);
    const d = 6, leaves = a.tree.n;
    const sums = new Float64Array(leaves * d);
    const counts = new Int32Array(leaves);
    a.assignment.forEach((leaf, i) => {
      counts[leaf]++;
      for (let j = 0; j < d; j++) sums[leaf * d + j] += data[i * d + j];
    });
    for (let t = 0; t < leaves * d; t++) expect(a.centroids[t]).toBeCloseTo(sums[t] / counts[Math.floor(t / d)], 10);
    // (That this sampled fit still recovers the planted blobs is checked by the first test, same call.)
  });

  it('equals exact Ward when every micro-cluster is one window', async () => {
    const { data } = blobs(40, 3, 3, 9);
    const r = await twoStageHierarchy(data, 40, 3, { linkage: 'ward', microClusters: 40, seed: 2 });
    const exact = await hierarchical(data, 40, 3, { linkage: 'ward' });
    expect(r.tree.n).toBe(40);
    const sortedExact = Array.from(exact.height);
    const sortedTwo = Array.from(r.tree.height);
    sortedExact.forEach((h, i) => expect(sortedTwo[i]).toBeCloseTo(h, 9));
  });

  it('is chosen by clusterHierarchy above the threshold, exact below', async () => {
    const { data } = blobs(500, 3, 3, 4);
    const small = await clusterHierarchy(data, 500, 3, { linkage: 'average', seed: 1 });
    expect(small.path).toBe('exact');
    expect(small.tree.n).toBe(500);
    const big = await clusterHierarchy(data, 500, 3, { linkage: 'average', seed: 1, threshold: 400, microClusters: 50 });
    expect(big.path).toBe('two-stage');
    expect(big.tree.n).toBeLessThanOrEqual(50);
    expect(big.assignment).toHaveLength(500);
  });
});

describe('cutConfidence(data, n, d, labels)', () => {
  it('is 1 − d1/d2 to the cut centroids: 0 midway, 1 on a centroid', () => {
    // Centroids 0 and 10 on a line (1-D): windows at 0, 10 sit on them; 5 is midway.
    const data = Float64Array.from([-1, 0, 1, 9, 10, 11, 5]);
    const conf = cutConfidence(data, 7, 1, Int32Array.from([0, 0, 0, 1, 1, 1, 0]));
    // Cluster 0 = {-1, 0, 1, 5}: centroid 1.25; cluster 1 centroid 10.
    expect(conf[1]).toBeCloseTo(1 - 1.25 / 10, 12);
    expect(conf[4]).toBeCloseTo(1, 12);
    expect(conf[6]).toBeCloseTo(1 - 3.75 / 5, 12);
  });
});
