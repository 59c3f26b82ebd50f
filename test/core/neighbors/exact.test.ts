import { describe, expect, it } from 'vitest';
import { CancelledError } from '../../../src/core/errors';
import { exactKnn, exactKnnSync } from '../../../src/core/neighbors/exact';
import type { Metric } from '../../../src/core/neighbors/knn.types';
import { normal, randomInt, seededRandom } from '../../../src/core/random';

/** Reference: every distance, sorted by (distance, index) — brute force by definition. */
function bruteForce(x: Float64Array, n: number, d: number, k: number, metric: Metric) {
  const indices: number[][] = [];
  const distances: number[][] = [];
  for (let i = 0; i < n; i++) {
    const all: [number, number][] = [];
    for (let j = 0; j < n; j++) {
      if (j === i) continue;
      let dot = 0, ni = 0, nj = 0, ss = 0;
      for (let t = 0; t < d; t++) {
        const a = x[i * d + t], b = x[j * d + t];
        dot += a * b; ni += a * a; nj += b * b; ss += (a - b) ** 2;
      }
      all.push([metric === 'euclidean' ? Math.sqrt(ss) : 1 - dot / Math.sqrt(ni * nj), j]);
    }
    all.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
    indices.push(all.slice(0, k).map((p) => p[1]));
    distances.push(all.slice(0, k).map((p) => p[0]));
  }
  return { indices, distances };
}

function gaussian(n: number, d: number, seed: number): Float64Array {
  const random = seededRandom(seed);
  return Float64Array.from({ length: n * d }, () => normal(random));
}

describe('exactKnn', () => {
  for (const metric of ['euclidean', 'cosine'] as const) {
    it(`exactKnnSync equals brute force (${metric})`, () => {
      const n = 150, d = 7, k = 12;
      const x = gaussian(n, d, 4);
      const got = exactKnnSync(x, n, d, k, metric);
      const want = bruteForce(x, n, d, k, metric);
      expect(got.n).toBe(n);
      expect(got.k).toBe(k);
      for (let i = 0; i < n; i++) {
        expect(Array.from(got.indices.subarray(i * k, i * k + k))).toEqual(want.indices[i]);
        for (let t = 0; t < k; t++) expect(got.distances[i * k + t]).toBeCloseTo(want.distances[i][t], 10);
      }
    });
  }

  it('exactKnnSync breaks distance ties by the lower index, like brute force', () => {
    // Small integer grid: many exactly equal distances.
    const random = seededRandom(2);
    const n = 90, d = 2, k = 8;
    const x = Float64Array.from({ length: n * d }, () => randomInt(random, 4));
    const got = exactKnnSync(x, n, d, k, 'euclidean');
    const want = bruteForce(x, n, d, k, 'euclidean');
    for (let i = 0; i < n; i++) expect(Array.from(got.indices.subarray(i * k, i * k + k))).toEqual(want.indices[i]);
  });

  it('exactKnn (async, sliced) equals exactKnnSync and checks in with the context', async () => {
    const n = 1300, d = 5, k = 6;
    const x = gaussian(n, d, 8);
    let checkpoints = 0;
    const got = await exactKnn(x, n, d, k, 'euclidean', { progress() {}, checkpoint: () => { checkpoints++; return Promise.resolve(); } });
    const sync = exactKnnSync(x, n, d, k, 'euclidean');
    expect(got.indices).toEqual(sync.indices);
    expect(got.distances).toEqual(sync.distances);
    expect(checkpoints).toBeGreaterThanOrEqual(3);
  });

  it('exactKnn stops when the job is cancelled', async () => {
    const x = gaussian(1200, 3, 1);
    let calls = 0;
    const ctx = { progress() {}, checkpoint: () => (++calls > 1 ? Promise.reject(new CancelledError()) : Promise.resolve()) };
    await expect(exactKnn(x, 1200, 3, 5, 'euclidean', ctx)).rejects.toBeInstanceOf(CancelledError);
  });

  it('exactKnn rejects k outside 1..n-1 and unknown metrics', () => {
    const x = gaussian(10, 2, 1);
    expect(() => exactKnnSync(x, 10, 2, 10, 'euclidean')).toThrow(/k/);
    expect(() => exactKnnSync(x, 10, 2, 0, 'euclidean')).toThrow(/k/);
    expect(() => exactKnnSync(x, 10, 2, 3, 'manhattan' as Metric)).toThrow(/metric/);
  });
});
