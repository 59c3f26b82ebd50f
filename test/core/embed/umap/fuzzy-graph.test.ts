import { describe, expect, it } from 'vitest';
import { fuzzySimplicialSet, smoothKnnDistances } from '../../../../src/core/embed/umap/fuzzy-graph';
import type { Knn } from '../../../../src/core/neighbors/knn.types';

/** Three points on a line at 0, 1, 3; each lists the other two (k = 2, self excluded). */
const line: Knn = {
  n: 3,
  k: 2,
  indices: Int32Array.from([1, 2, 0, 2, 1, 0]),
  distances: Float64Array.from([1, 3, 1, 2, 2, 3]),
};

describe('smoothKnnDistances', () => {
  it('sets rho to the nearest distance and sigma so memberships sum to log2(k + 1)', () => {
    // UMAP's definition (McInnes, Healy & Melville 2018, section 3.1 / umap_.py smooth_knn_dist):
    // Σ_j exp(−(d_j − rho) / sigma) = log2(n_neighbors), n_neighbors counting the point itself.
    const { rhos, sigmas } = smoothKnnDistances(line);
    expect(Array.from(rhos)).toEqual([1, 1, 2]);
    for (let i = 0; i < 3; i++) {
      let sum = 0;
      for (let t = 0; t < 2; t++) sum += Math.exp(-Math.max(0, line.distances[i * 2 + t] - rhos[i]) / sigmas[i]);
      expect(sum).toBeCloseTo(Math.log2(3), 4);
    }
  });
});

describe('fuzzySimplicialSet', () => {
  it('is symmetric with the fuzzy union w + w′ − w·w′ of the directed memberships', () => {
    const { rhos, sigmas } = smoothKnnDistances(line);
    const g = fuzzySimplicialSet(line);
    const weight = (i: number, j: number) => {
      for (let e = g.rowStart[i]; e < g.rowStart[i + 1]; e++) if (g.cols[e] === j) return g.weights[e];
      return 0;
    };
    const directed = (i: number, j: number) => {
      const t = Array.from(line.indices.subarray(i * 2, i * 2 + 2)).indexOf(j);
      return Math.exp(-Math.max(0, line.distances[i * 2 + t] - rhos[i]) / sigmas[i]);
    };
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        if (i === j) {
          expect(weight(i, i)).toBe(0);
          continue;
        }
        const w = directed(i, j);
        const back = directed(j, i);
        expect(weight(i, j)).toBeCloseTo(w + back - w * back, 12);
        expect(weight(i, j)).toBe(weight(j, i));
      }
    }
    // Nearest neighbours are fully connected (membership 1 within rho).
    expect(weight(0, 1)).toBe(1);
  });

  it('keeps a one-way edge in both directions', () => {
    const oneWay: Knn = { n: 3, k: 1, indices: Int32Array.from([1, 0, 1]), distances: Float64Array.from([1, 1, 2]) };
    const g = fuzzySimplicialSet(oneWay);
    // Point 2 lists 1, but 1 does not list 2: the edge 2–1 appears from both ends.
    const row1 = Array.from(g.cols.subarray(g.rowStart[1], g.rowStart[2]));
    const row2 = Array.from(g.cols.subarray(g.rowStart[2], g.rowStart[3]));
    expect(row1.sort()).toEqual([0, 2]);
    expect(row2).toEqual([1]);
  });
});
