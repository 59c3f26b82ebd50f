import { describe, expect, it } from 'vitest';
import { rpTreeLeaves } from '../../../src/core/neighbors/rp-tree';
import { normal, seededRandom } from '../../../src/core/random';

describe('rpTreeLeaves', () => {
  const n = 1000;
  const d = 8;
  const random = seededRandom(4);
  const x = Float64Array.from({ length: n * d }, () => normal(random));

  it('puts every row in exactly one leaf of at most leafSize rows', () => {
    const { order, starts } = rpTreeLeaves(x, n, d, 20, seededRandom(1));
    expect(Array.from(order).sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i));
    expect(starts[0]).toBe(0);
    expect(starts[starts.length - 1]).toBe(n);
    for (let t = 0; t + 1 < starts.length; t++) {
      expect(starts[t + 1] - starts[t]).toBeGreaterThan(0);
      expect(starts[t + 1] - starts[t]).toBeLessThanOrEqual(20);
    }
  });

  it('splits duplicate rows too, and is seeded', () => {
    const same = new Float64Array(100 * 3).fill(1);
    const a = rpTreeLeaves(same, 100, 3, 10, seededRandom(2));
    const b = rpTreeLeaves(same, 100, 3, 10, seededRandom(2));
    expect(a.starts.length - 1).toBeGreaterThanOrEqual(10);
    expect(Array.from(a.order)).toEqual(Array.from(b.order));
  });

  it('keeps near rows together more often than chance (the point of the forest)', () => {
    // Pairs (i, i + n/2) are planted 0.01 apart; in a leaf of ≤ 20 of 1,000 rows a random pair
    // would share a leaf with probability < 0.02.
    const y = Float64Array.from(x);
    for (let i = 0; i < n / 2; i++) for (let t = 0; t < d; t++) y[(i + n / 2) * d + t] = y[i * d + t] + 0.01 * normal(random);
    const { order, starts } = rpTreeLeaves(y, n, d, 20, seededRandom(3));
    const leaf = new Int32Array(n);
    for (let t = 0; t + 1 < starts.length; t++) for (let p = starts[t]; p < starts[t + 1]; p++) leaf[order[p]] = t;
    let together = 0;
    for (let i = 0; i < n / 2; i++) if (leaf[i] === leaf[i + n / 2]) together++;
    expect(together / (n / 2)).toBeGreaterThan(0.5);
  });
});
