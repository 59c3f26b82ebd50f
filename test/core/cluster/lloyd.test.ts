import { describe, expect, it } from 'vitest';
import { kmeansPlusPlus } from '../../../src/core/cluster/kmeanspp';
import { initLloyd, lloydStep } from '../../../src/core/cluster/lloyd';
import { normal, seededRandom } from '../../../src/core/random';

/** Plain Lloyd (full scan every iteration), written out as the textbook algorithm (common practice). */
function naiveStep(data: Float64Array, n: number, d: number, centres: Float64Array, k: number): Int32Array {
  const labels = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let best = 0;
    let bd = Infinity;
    for (let c = 0; c < k; c++) {
      let s = 0;
      for (let j = 0; j < d; j++) s += (data[i * d + j] - centres[c * d + j]) ** 2;
      if (s < bd) { bd = s; best = c; }
    }
    labels[i] = best;
  }
  const sums = new Float64Array(k * d);
  const counts = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    counts[labels[i]]++;
    for (let j = 0; j < d; j++) sums[labels[i] * d + j] += data[i * d + j];
  }
  for (let c = 0; c < k; c++) if (counts[c] > 0) for (let j = 0; j < d; j++) centres[c * d + j] = sums[c * d + j] / counts[c];
  return labels;
}

describe('lloydStep with bounds', () => {
  it('follows plain Lloyd iteration by iteration on overlapping blobs', () => {
    const random = seededRandom(5);
    const n = 1500, d = 6, k = 7;
    const data = new Float64Array(n * d);
    for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) data[i * d + j] = (i % 5) * 0.8 * (j === i % d ? 1 : 0) + normal(random);
    const init = kmeansPlusPlus(data, n, d, k, seededRandom(9));
    const state = initLloyd(data, n, d, init, 0);
    const centres = Float64Array.from(init);
    for (let it = 0; it < 25; it++) {
      lloydStep(state);
      const labels = naiveStep(data, n, d, centres, k);
      expect(state.labels).toEqual(labels);
      for (let c = 0; c < k * d; c++) expect(state.centres[c]).toBeCloseTo(centres[c], 10);
    }
  });
});
