import { describe, expect, it } from 'vitest';
import { kmeans } from '../../../src/core/cluster/kmeans';
import { daviesBouldin } from '../../../src/core/metrics/davies-bouldin';
import { seededRandom } from '../../../src/core/random';
import { irisMatrix } from '../iris';

// Values from scikit-learn sklearn/metrics/cluster/tests/test_unsupervised.py and (iris, R/Fisher
// version) computed with NumPy 2.4 / SciPy 1.17.

describe('daviesBouldin(data, n, d, labels)', () => {
  it('is 2·sqrt(0.5)/3 on the scikit-learn four-block example', () => {
    // X = [[0,0],[1,1]]*5 + [[3,3],[4,4]]*5 + [[0,4],[1,3]]*5 + [[3,1],[4,0]]*5; labels 0..3 in blocks of 10:
    // 40 rows (the scikit-learn test has 40 labels: 4 blocks of 10).
    const rows: number[] = [];
    for (const pair of [[0, 0, 1, 1], [3, 3, 4, 4], [0, 4, 1, 3], [3, 1, 4, 0]]) for (let r = 0; r < 5; r++) rows.push(...pair);
    const labels = Int32Array.from({ length: 40 }, (_, i) => Math.floor(i / 10));
    expect(daviesBouldin(Float64Array.from(rows), 40, 2, labels)).toBeCloseTo((2 * Math.sqrt(0.5)) / 3, 10);
  });

  it('gives 0.41667 for X = [[0,0],[2,2],[3,3],[5,5]], labels [0,0,1,2]', () => {
    // scikit-learn test_davies_bouldin_score (a singleton cluster's scatter is 0).
    expect(daviesBouldin(Float64Array.from([0, 0, 2, 2, 3, 3, 5, 5]), 4, 2, [0, 0, 1, 2])).toBeCloseTo(5 / 12, 10);
  });

  it('is 0 when all samples are equal or the cluster means coincide', () => {
    // scikit-learn test_davies_bouldin_score: np.zeros((10, 4)) -> 0.0; [[-1,-1],[1,1]]*10 -> 0.0.
    expect(daviesBouldin(new Float64Array(10 * 4), 10, 4, Int32Array.from({ length: 10 }, (_, i) => i % 2))).toBe(0);
    const X = Float64Array.from({ length: 40 }, (_, i) => (Math.floor(i / 2) % 2 === 0 ? -1 : 1));
    expect(daviesBouldin(X, 20, 2, Int32Array.from({ length: 20 }, (_, i) => (i < 10 ? 0 : 1)))).toBe(0);
  });

  it('gives 0.6619715 for the k-means partition of iris', async () => {
    // The iris k-means partition (sizes 50/62/38): value computed with NumPy 2.4 / SciPy 1.17.
    const { data, n, d } = irisMatrix();
    const km = await kmeans(data, n, d, { k: 3, restarts: 10, maxIterations: 300, tol: 1e-4, random: seededRandom(7) });
    expect(daviesBouldin(data, n, d, km.labels)).toBeCloseTo(0.6619715, 6);
  });
});
