import { describe, expect, it } from 'vitest';
import { neighbourhoodPreservation, sampledNeighbourhoodPreservation } from '../../../src/core/metrics/neighbourhood';
import { sampledTrustworthiness, trustworthiness } from '../../../src/core/metrics/trustworthiness';
import { normal, seededRandom } from '../../../src/core/random';

const X = Float64Array.from([0, 1, 2, 3, 4]);
const EMBEDDED = Float64Array.from([0, 2, 4, 1, 3]);

describe('trustworthiness', () => {
  it('trustworthiness of the shuffled 1-D example is 0.2', () => {
    // scikit-learn sklearn/manifold/tests/test_t_sne.py test_trustworthiness:
    // X = [0..4], embedding [[0],[2],[4],[1],[3]], n_neighbors = 1 -> 0.2.
    expect(trustworthiness(X, 5, 1, EMBEDDED, 1, 1)).toBeCloseTo(0.2, 12);
  });

  it('trustworthiness of any affine map is 1', () => {
    // Same scikit-learn test: an affine transform of X keeps every neighbourhood -> 1.0.
    const random = seededRandom(3);
    const n = 60;
    const high = new Float64Array(n * 3);
    for (let t = 0; t < high.length; t++) high[t] = normal(random);
    const low = new Float32Array(n * 3);
    for (let i = 0; i < n; i++) for (let a = 0; a < 3; a++) low[i * 3 + a] = -2.5 * high[i * 3 + a] + 7;
    expect(trustworthiness(high, n, 3, low, 3, 5)).toBeCloseTo(1, 12);
    expect(trustworthiness(high, n, 3, low, 3, 5, 'cosine')).toBeLessThan(1); // translation breaks cosine ranks
  });

  it('trustworthiness rejects k at or above n / 2', () => {
    // The formula needs k < n / 2 (Venna & Kaski 2001; scikit-learn raises ValueError likewise).
    expect(() => trustworthiness(X, 5, 1, EMBEDDED, 1, 3)).toThrow(/k/);
  });

  it('sampledTrustworthiness equals the full value when n fits in the sample, and is seeded otherwise', () => {
    const random = seededRandom(11);
    const n = 300;
    const high = new Float64Array(n * 4);
    for (let t = 0; t < high.length; t++) high[t] = normal(random);
    const low = new Float64Array(n * 2);
    for (let i = 0; i < n; i++) { low[2 * i] = high[i * 4]; low[2 * i + 1] = high[i * 4 + 1]; }
    const full = trustworthiness(high, n, 4, low, 2, 10);
    expect(sampledTrustworthiness(high, n, 4, low, 2, 10, { sample: 5000, random: seededRandom(1) })).toBe(full);
    const a = sampledTrustworthiness(high, n, 4, low, 2, 10, { sample: 100, random: seededRandom(5) });
    const b = sampledTrustworthiness(high, n, 4, low, 2, 10, { sample: 100, random: seededRandom(5) });
    expect(a).toBe(b);
    expect(a).toBeGreaterThan(0.5);
    expect(a).toBeLessThan(1);
  });
});

describe('neighbourhoodPreservation', () => {
  it('neighbourhoodPreservation of the shuffled 1-D example is 0 (worked by hand)', () => {
    // Worked by hand, ties to the lower index: original nearest 0→1, 1→0, 2→1, 3→2, 4→3;
    // map nearest 0→3, 1→3, 2→4, 3→0, 4→1: no neighbour kept.
    expect(neighbourhoodPreservation(X, 5, 1, EMBEDDED, 1, 1)).toBe(0);
    // With k = 2: window 1 original {0,2}, map {3,4}: none; window 3 original {2,4}, map {0,1}: none.
    // Window 0: original {1,2}, map {3,1}: keeps 1. Window 2: original {1,3}, map {4,1}: keeps 1.
    // Window 4: original {3,2}, map {1,2}: keeps 2. Kept 3 of 10.
    expect(neighbourhoodPreservation(X, 5, 1, EMBEDDED, 1, 2)).toBeCloseTo(0.3, 12);
  });

  it('neighbourhoodPreservation of an affine map is 1 and the sampled variant agrees on small n', () => {
    const random = seededRandom(9);
    const n = 80;
    const high = new Float64Array(n * 2);
    for (let t = 0; t < high.length; t++) high[t] = normal(random);
    const low = high.map((v) => 3 * v - 1);
    expect(neighbourhoodPreservation(high, n, 2, low, 2, 10)).toBe(1);
    expect(sampledNeighbourhoodPreservation(high, n, 2, low, 2, 10, { random: seededRandom(1) })).toBe(1);
  });
});
