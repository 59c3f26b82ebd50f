import { describe, expect, it } from 'vitest';
import { approximateKnnLocal } from '../../../../src/core/embed/tsne/local-order';
import { quietContext } from '../../../../src/core/job';
import { exactKnnSync } from '../../../../src/core/neighbors/exact';
import { neighbourRecall } from '../../../../src/core/neighbors/recall';
import { normal, seededRandom } from '../../../../src/core/random';

/** Seeded Gaussian blobs: `centres` centres drawn from N(0, 4²), unit noise around them. */
function blobs(n: number, d: number, centres: number, seed: number): Float64Array {
  const random = seededRandom(seed);
  const c = Float64Array.from({ length: centres * d }, () => 4 * normal(random));
  const x = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    const b = Math.floor(random() * centres);
    for (let t = 0; t < d; t++) x[i * d + t] = c[b * d + t] + normal(random);
  }
  return x;
}

describe('approximateKnnLocal (NN-descent on rows in tree-leaf order)', () => {
  const n = 3000, d = 20, k = 15;
  const data = blobs(n, d, 10, 11);
  const search = (seed: number) => approximateKnnLocal(
    data, n, d, k, { metric: 'euclidean', random: seededRandom(5), ctx: quietContext }, seededRandom(seed),
  );

  it('maps the neighbours back to the original rows: distances are the rows\' Euclidean distances, recall >= 0.9', async () => {
    const knn = await search(1);
    let wrong = 0;
    for (let i = 0; i < n; i++) {
      for (let t = 0; t < k; t++) {
        const j = knn.indices[i * k + t];
        let s = 0;
        for (let c = 0; c < d; c++) s += (data[i * d + c] - data[j * d + c]) ** 2;
        // Euclidean distance by its definition.
        if (j === i || Math.abs(Math.sqrt(s) - knn.distances[i * k + t]) > 1e-9) wrong++;
      }
    }
    expect(wrong).toBe(0);
    // Same recall target as NN-descent itself (nndescent.test.ts); exact neighbours by brute force.
    expect(neighbourRecall(knn, exactKnnSync(data, n, d, k, 'euclidean'))).toBeGreaterThanOrEqual(0.9);
  });

  it('gives the same graph for the same seeds', async () => {
    const a = await search(1), b = await search(1);
    expect(b.indices).toEqual(a.indices);
    expect(b.distances).toEqual(a.distances);
  });
});
