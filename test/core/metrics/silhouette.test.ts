import { describe, expect, it } from 'vitest';
import { meanSilhouette, silhouetteFromDistances, silhouetteSamples } from '../../../src/core/metrics/silhouette';
import { irisMatrix } from '../iris';
import { kmeans } from '../../../src/core/cluster/kmeans';
import { seededRandom } from '../../../src/core/random';

// Sources beside each case: scikit-learn test_unsupervised.py, Clustering.jl test/silhouette.jl, and one
// value computed with NumPy 2.4 / SciPy 1.17 on iris.
describe('silhouette', () => {
  it('matches the scikit-learn per-sample example, a singleton scoring 0', () => {
    // scikit-learn sklearn/metrics/cluster/tests/test_unsupervised.py.
    const s = silhouetteSamples({ data: [0, 1, 1, 2, 3, 3], n: 6, d: 1 }, [0, 1, 1, 1, 2, 2]);
    [0, 0.5, 0.5, 0, 1, 1].forEach((v, i) => expect(s[i]).toBeCloseTo(v, 12));
  });

  it('matches the scikit-learn precomputed example (1/6)', () => {
    // scikit-learn sklearn/metrics/cluster/tests/test_unsupervised.py (metric="precomputed").
    const s = silhouetteFromDistances([0, 1, 2, 1, 0, 1, 2, 1, 0], 3, [0, 0, 1]);
    expect((s[0] + s[1] + s[2]) / 3).toBeCloseTo(1 / 6, 12);
  });

  it('matches the Clustering.jl silhouette examples', () => {
    // JuliaStats/Clustering.jl test/silhouette.jl.
    const D = [0, 1, 2, 3, 1, 0, 1, 2, 2, 1, 0, 1, 3, 2, 1, 0];
    const cases: [number[], number[]][] = [
      [[1, 1, 2, 2], [0.6, 1 / 3, 1 / 3, 0.6]],
      [[1, 2, 1, 2], [0, -0.5, -0.5, 0]],
      [[1, 1, 1, 2], [0.5, 0.5, -1 / 3, 0]],
    ];
    for (const [labels, expected] of cases) {
      const s = silhouetteFromDistances(D, 4, labels);
      expected.forEach((v, i) => expect(s[i]).toBeCloseTo(v, 12));
    }
  });

  it('gives the reference value for the iris k-means partition', async () => {
    // k-means partition of iris (R/Fisher, sizes 50/62/38): silhouette 0.5528190, computed with
    // NumPy 2.4 / SciPy 1.17 on that partition.
    const m = irisMatrix();
    const r = await kmeans(m.data, m.n, m.d, { k: 3, restarts: 10, maxIterations: 300, tol: 1e-4, random: seededRandom(7) });
    expect(meanSilhouette(m, r.labels)).toBeCloseTo(0.552819, 6);
  });

  it('is NaN when only one cluster is present', () => {
    expect(meanSilhouette({ data: [0, 1, 2], n: 3, d: 1 }, [4, 4, 4])).toBeNaN();
  });
});
