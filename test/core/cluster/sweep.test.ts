import { describe, expect, it } from 'vitest';
import { kmeansPlusPlus } from '../../../src/core/cluster/kmeanspp';
import { sweepK } from '../../../src/core/cluster/sweep';
import { OptionError } from '../../../src/core/errors';
import { seededRandom } from '../../../src/core/random';
import { irisMatrix } from '../iris';

describe('sweepK(data, n, d, options)', () => {
  it('reports the R iris k-means optimum and the computed metrics at k = 3', async () => {
    const { data, n, d } = irisMatrix();
    const rows = await sweepK(data, n, d, { kMin: 2, kMax: 5, seed: 1, restarts: 10, silhouetteSample: 1000 });
    expect(rows.map((r) => r.k)).toEqual([2, 3, 4, 5]);
    const k3 = rows[1];
    // R kmeans(iris[, 1:4], 3) total within SS 78.85144 (acceptance: ≤ 78.86).
    expect(k3.inertia).toBeLessThanOrEqual(78.86);
    expect(k3.inertia).toBeCloseTo(78.85144, 4);
    // Iris k-means partition, computed with NumPy 2.4 / SciPy 1.17: silhouette 0.5528190,
    // Calinski–Harabasz 561.6278, Davies–Bouldin 0.6619715.
    expect(k3.silhouette).toBeCloseTo(0.552819, 6);
    expect(k3.calinskiHarabasz).toBeCloseTo(561.6278, 3);
    expect(k3.daviesBouldin).toBeCloseTo(0.6619715, 6);
    // The elbow curve never rises with k when each k keeps its best of 10 restarts (common practice).
    for (let i = 1; i < rows.length; i++) expect(rows[i].inertia).toBeLessThan(rows[i - 1].inertia);
  });

  it('gives the same row for a k whatever the swept range, and samples the silhouette', async () => {
    const { data, n, d } = irisMatrix();
    const wide = await sweepK(data, n, d, { kMin: 2, kMax: 4, seed: 5, restarts: 2, silhouetteSample: 60 });
    const narrow = await sweepK(data, n, d, { kMin: 4, kMax: 4, seed: 5, restarts: 2, silhouetteSample: 60 });
    expect(narrow[0]).toEqual(wide[2]);
    const full = await sweepK(data, n, d, { kMin: 4, kMax: 4, seed: 5, restarts: 2, silhouetteSample: 150 });
    expect(full[0].inertia).toBe(narrow[0].inertia);
    expect(full[0].silhouette).not.toBe(narrow[0].silhouette);
    expect(full[0].calinskiHarabasz).toBe(narrow[0].calinskiHarabasz);
  });

  it('rejects a bad range at the edge', async () => {
    const { data, n, d } = irisMatrix();
    const base = { seed: 1, restarts: 1, silhouetteSample: 100 };
    await expect(sweepK(data, n, d, { ...base, kMin: 1, kMax: 3 })).rejects.toBeInstanceOf(OptionError);
    await expect(sweepK(data, n, d, { ...base, kMin: 4, kMax: 3 })).rejects.toThrow(/kMax/);
    await expect(sweepK(data, n, d, { ...base, kMin: 2, kMax: 150 })).rejects.toThrow(/less than the number of windows/);
  });
});

describe('kmeansPlusPlus trials', () => {
  it('draws 2 + floor(ln k) candidates per centre after the first', () => {
    // k-means++ as in scikit-learn (Arthur & Vassilvitskii 2007; sklearn/cluster/_kmeans.py): 2 + floor(ln k) local trials per centre.
    const { data, n, d } = irisMatrix();
    for (const k of [3, 8, 12]) {
      const base = seededRandom(1);
      let calls = 0;
      kmeansPlusPlus(data, n, d, k, () => { calls++; return base(); });
      expect(calls).toBe(1 + (k - 1) * (2 + Math.floor(Math.log(k))));
    }
  });
});
