import { describe, expect, it } from 'vitest';
import { kmeans } from '../../../src/core/cluster/kmeans';
import { calinskiHarabasz } from '../../../src/core/metrics/calinski-harabasz';
import { seededRandom } from '../../../src/core/random';
import { irisMatrix } from '../iris';

// Values from scikit-learn sklearn/metrics/cluster/tests/test_unsupervised.py and (iris, R/Fisher
// version) computed with NumPy 2.4 / SciPy 1.17.

/** Python's `[[a, b], [c, e]] * 5` for each block, then the blocks one after another. */
function repeatedPairs(blocks: number[][]): Float64Array {
  const rows: number[] = [];
  for (const pair of blocks) for (let r = 0; r < 5; r++) rows.push(...pair);
  return Float64Array.from(rows);
}

describe('calinskiHarabasz(data, n, d, labels)', () => {
  it('is 45·36/(5·3) = 108 on the scikit-learn four-block example', () => {
    // X = [[0,0],[1,1]]*5 + [[3,3],[4,4]]*5 + [[0,4],[1,3]]*5 + [[3,1],[4,0]]*5; labels 0..3 in blocks of 10:
    // 40 rows (the scikit-learn test has 40 labels: 4 blocks of 10).
    const X = repeatedPairs([[0, 0, 1, 1], [3, 3, 4, 4], [0, 4, 1, 3], [3, 1, 4, 0]]);
    const labels = Int32Array.from({ length: 40 }, (_, i) => Math.floor(i / 10));
    expect(calinskiHarabasz(X, 40, 2, labels)).toBeCloseTo(45 * 36 / (5 * 3), 10);
  });

  it('is 1 when all samples are equal and 0 when the cluster means are equal', () => {
    // scikit-learn test_calinski_harabasz_score: np.zeros((10, 4)) -> 1.0;
    // [[-1, -1], [1, 1]] * 10 with labels [0]*10 + [1]*10 -> 0.0.
    expect(calinskiHarabasz(new Float64Array(10 * 4), 10, 4, Int32Array.from({ length: 10 }, (_, i) => i % 2))).toBe(1);
    const X = Float64Array.from({ length: 40 }, (_, i) => (Math.floor(i / 2) % 2 === 0 ? -1 : 1));
    const labels = Int32Array.from({ length: 20 }, (_, i) => (i < 10 ? 0 : 1));
    expect(calinskiHarabasz(X, 20, 2, labels)).toBeCloseTo(0, 12);
  });

  it('gives 561.6278 for the k-means partition of iris', async () => {
    // The iris k-means partition (sizes 50/62/38): value computed with NumPy 2.4 / SciPy 1.17.
    const { data, n, d } = irisMatrix();
    const km = await kmeans(data, n, d, { k: 3, restarts: 10, maxIterations: 300, tol: 1e-4, random: seededRandom(7) });
    expect(calinskiHarabasz(data, n, d, km.labels)).toBeCloseTo(561.6278, 3);
  });

  it('is undefined (NaN) for one cluster or one window per cluster', () => {
    expect(calinskiHarabasz(Float64Array.from([1, 2, 3]), 3, 1, [0, 0, 0])).toBeNaN();
    expect(calinskiHarabasz(Float64Array.from([1, 2, 3]), 3, 1, [0, 1, 2])).toBeNaN();
  });
});
