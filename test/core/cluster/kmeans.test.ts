import { describe, expect, it } from 'vitest';
import { centreConfidence } from '../../../src/core/cluster/confidence';
import { kmeans } from '../../../src/core/cluster/kmeans';
import { kmeansPlusPlus } from '../../../src/core/cluster/kmeanspp';
import { relabelBySize } from '../../../src/core/cluster/relabel';
import { seededRandom } from '../../../src/core/random';
import { irisMatrix } from '../iris';

const opts = (k: number, seed: number, restarts = 10) => ({ k, restarts, maxIterations: 300, tol: 1e-4, random: seededRandom(seed) });

function nearest(centres: Float64Array, k: number, p: number[]): number {
  let best = 0;
  let bestD = Infinity;
  for (let c = 0; c < k; c++) {
    const dd = (centres[c * 2] - p[0]) ** 2 + (centres[c * 2 + 1] - p[1]) ** 2;
    if (dd < bestD) { bestD = dd; best = c; }
  }
  return best;
}

describe('kmeans(data, n, d, options)', () => {
  it('finds the scikit-learn KMeans docstring centres', async () => {
    // scikit-learn KMeans docstring: k = 2 -> centres (1, 2) and (10, 2).
    const X = Float64Array.from([1, 2, 1, 4, 1, 0, 10, 2, 10, 4, 10, 0]);
    const r = await kmeans(X, 6, 2, opts(2, 0));
    const centres = [[r.centres[0], r.centres[1]], [r.centres[2], r.centres[3]]].sort((a, b) => a[0] - b[0]);
    expect(centres).toEqual([[1, 2], [10, 2]]);
    // Points (0, 0) and (12, 3) go to centres (1, 2) and (10, 2).
    const c0 = nearest(r.centres, 2, [0, 0]);
    const c1 = nearest(r.centres, 2, [12, 3]);
    expect([r.centres[c0 * 2], r.centres[c0 * 2 + 1]]).toEqual([1, 2]);
    expect([r.centres[c1 * 2], r.centres[c1 * 2 + 1]]).toEqual([10, 2]);
    expect(r.converged).toBe(true);
  });

  it('reaches the R kmeans optimum on iris with restarts', async () => {
    // R kmeans(iris[, 1:4], 3) on the R/Fisher iris: sizes 50/62/38,
    // total within SS 78.85144, centres as listed.
    const { data, n, d } = irisMatrix();
    const r = await kmeans(data, n, d, opts(3, 7));
    expect(r.inertia).toBeCloseTo(78.85144, 4);
    const { sizes, centres } = relabelBySize(r.labels, r.centres, 3, d);
    expect(Array.from(sizes)).toEqual([62, 50, 38]);
    const expected = [
      [5.901613, 2.748387, 4.393548, 1.433871],
      [5.006, 3.428, 1.462, 0.246],
      [6.85, 3.073684, 5.742105, 2.071053],
    ];
    expected.forEach((row, c) => row.forEach((v, j) => expect(centres[c * 4 + j]).toBeCloseTo(v, 5)));
  });

  it('is deterministic for a seed', async () => {
    const { data, n, d } = irisMatrix();
    const a = await kmeans(data, n, d, opts(4, 3, 2));
    const b = await kmeans(data, n, d, opts(4, 3, 2));
    expect(b.labels).toEqual(a.labels);
    expect(b.inertia).toBe(a.inertia);
  });
});

describe('kmeansPlusPlus', () => {
  it('picks k distinct data points as centres', () => {
    const { data, n, d } = irisMatrix();
    const c = kmeansPlusPlus(data, n, d, 5, seededRandom(11));
    const rows = new Set<string>();
    for (let k = 0; k < 5; k++) {
      const row = Array.from(c.subarray(k * d, k * d + d));
      rows.add(row.join());
      let found = false;
      for (let i = 0; i < n && !found; i++) found = row.every((v, j) => data[i * d + j] === v);
      expect(found).toBe(true);
    }
    expect(rows.size).toBe(5);
  });
});

describe('relabelBySize and centreConfidence', () => {
  it('orders clusters by size, ties by first window', () => {
    const r = relabelBySize(Int32Array.from([2, 0, 0, 1, 1, 1]), Float64Array.from([0, 1, 2]), 3, 1);
    expect(Array.from(r.labels)).toEqual([2, 1, 1, 0, 0, 0]);
    expect(Array.from(r.centres)).toEqual([1, 0, 2]);
    expect(Array.from(r.sizes)).toEqual([3, 2, 1]);
  });

  it('is 1 - d1/d2: 0 midway, 1 on a centre', () => {
    const conf = centreConfidence(Float64Array.from([0, 5, 1, 10]), 4, 1, Float64Array.from([0, 10]), 2);
    // Distances: 0 -> (0, 10); 5 -> (5, 5); 1 -> (1, 9); 10 -> (0, 10). Definition: common practice.
    expect(Array.from(conf)).toEqual([1, 0, Math.fround(1 - 1 / 9), 1]);
  });
});
