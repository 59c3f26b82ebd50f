import { describe, expect, it } from 'vitest';
import { conditionalProbabilities, symmetrize } from '../../../../src/core/embed/tsne';
import { exactKnnSync } from '../../../../src/core/neighbors/exact';
import { normal, seededRandom } from '../../../../src/core/random';

function neighbourSquares(n: number, d: number, k: number, seed: number) {
  const random = seededRandom(seed);
  const x = Float64Array.from({ length: n * d }, () => normal(random));
  const knn = exactKnnSync(x, n, d, k, 'euclidean');
  return { knn, sq: knn.distances.map((v) => v * v) };
}

describe('conditionalProbabilities', () => {
  it('each row has exp(entropy) = perplexity to 3 decimals', () => {
    // scikit-learn sklearn/manifold/tests/test_t_sne.py test_binary_search / test_binary_search_neighbors:
    // 50 points from randn(50, 2), perplexity 25,
    // exp of each row's entropy equals the perplexity to 3 decimals; neighbours k = 3 · perplexity + 1 here.
    const n = 200, k = 76, perplexity = 25;
    const { sq } = neighbourSquares(n, 2, k, 0);
    const p = conditionalProbabilities(sq, n, k, perplexity);
    for (let i = 0; i < n; i++) {
      let h = 0, sum = 0;
      for (let t = 0; t < k; t++) {
        const v = Math.max(p[i * k + t], Number.EPSILON);
        h -= v * Math.log(v);
        sum += p[i * k + t];
      }
      expect(sum).toBeCloseTo(1, 12);
      expect(Math.exp(h)).toBeCloseTo(perplexity, 3);
    }
  });

  it('calibrates rows whose distances are all far away (no underflow)', () => {
    const n = 40, k = 20;
    const { sq } = neighbourSquares(n, 3, k, 1);
    const far = sq.map((v) => v * 1e4 + 1e6);
    const p = conditionalProbabilities(far, n, k, 5);
    for (let i = 0; i < n; i++) {
      let h = 0;
      for (let t = 0; t < k; t++) { const v = p[i * k + t]; if (v > 0) h -= v * Math.log(v); }
      expect(Math.exp(h)).toBeCloseTo(5, 3);
    }
  });
});

describe('symmetrize', () => {
  it('gives a symmetric P with unit total mass and no self entries', () => {
    const n = 120, k = 10;
    const { knn, sq } = neighbourSquares(n, 4, k, 2);
    const cond = conditionalProbabilities(sq, n, k, 3);
    const p = symmetrize(knn.indices, cond, n, k);
    const dense = new Float64Array(n * n);
    let total = 0;
    for (let i = 0; i < n; i++) {
      for (let e = p.rowStart[i]; e < p.rowStart[i + 1]; e++) {
        expect(p.columns[e]).not.toBe(i);
        expect(dense[i * n + p.columns[e]]).toBe(0); // each column once per row
        dense[i * n + p.columns[e]] = p.values[e];
        total += p.values[e];
      }
    }
    expect(total).toBeCloseTo(1, 12);
    // p_ij = (p(j|i) + p(i|j)) / 2n (common practice, van der Maaten 2014, symmetric SNE)
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(dense[i * n + j]).toBeCloseTo(dense[j * n + i], 15);
    const i0 = 0, j0 = knn.indices[0];
    const back = Array.from(knn.indices.subarray(j0 * k, j0 * k + k)).indexOf(i0);
    expect(dense[i0 * n + j0]).toBeCloseTo((cond[0] + (back >= 0 ? cond[j0 * k + back] : 0)) / (2 * n), 15);
  });
});
