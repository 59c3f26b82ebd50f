import { describe, expect, it } from 'vitest';
import { squaredDistance } from '../../../src/core/cluster/distance';
import { distancesToCentres, nearestTwo } from '../../../src/core/cluster/nearest';
import { normal, seededRandom } from '../../../src/core/random';

// The blocked kernel must give exactly the bits of the one-at-a-time sum (same order of operations),
// so k-means results do not depend on which kernel ran.
describe('distancesToCentres', () => {
  for (const k of [1, 2, 3, 4, 5, 7, 8, 10, 13]) {
    it(`equals squaredDistance bit for bit (k = ${k})`, () => {
      const random = seededRandom(k);
      const d = 37;
      const data = Float64Array.from({ length: 5 * d }, () => normal(random) * 1e3);
      const centres = Float64Array.from({ length: k * d }, () => normal(random));
      const out = new Float64Array(k);
      for (let i = 0; i < 5; i++) {
        distancesToCentres(data, i * d, d, centres, k, out);
        for (let c = 0; c < k; c++) expect(Object.is(out[c], squaredDistance(data, i * d, centres, c * d, d))).toBe(true);
      }
    });
  }
});

describe('nearestTwo', () => {
  it('finds the nearest and second-nearest centre, ties to the lower index', () => {
    // Worked example: point (0, 0); centres at squared distances 4, 1, 1, 9.
    const data = Float64Array.of(0, 0);
    const centres = Float64Array.of(2, 0, 0, 1, 1, 0, 3, 0);
    const out = new Float64Array(3);
    nearestTwo(data, 0, 2, centres, 4, new Float64Array(4), out);
    expect(Array.from(out)).toEqual([1, 1, 1]);
  });
});
