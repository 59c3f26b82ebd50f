import { describe, expect, it } from 'vitest';
import { initLloyd, lloydStep } from '../../../src/core/cluster/lloyd';
import { normal, seededRandom } from '../../../src/core/random';

/**
 * Plain Lloyd written out as the textbook algorithm (common practice), with the empty-cluster rule
 * scikit-learn's KMeans uses (from memory): an emptied cluster takes the window farthest from its
 * own centre, measured exactly against the centres of this iteration; one window per empty cluster,
 * taken from clusters that keep at least one window. Updates `centres` in place; returns the labels
 * and how many windows were relocated.
 */
function referenceStep(data: Float64Array, n: number, d: number, centres: Float64Array, k: number): { labels: Int32Array; relocated: number } {
  const labels = new Int32Array(n);
  const dist = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let best = 0;
    let bd = Infinity;
    for (let c = 0; c < k; c++) {
      let s = 0;
      for (let j = 0; j < d; j++) s += (data[i * d + j] - centres[c * d + j]) ** 2;
      if (s < bd) { bd = s; best = c; }
    }
    labels[i] = best;
    dist[i] = bd;
  }
  const counts = new Float64Array(k);
  for (let i = 0; i < n; i++) counts[labels[i]]++;
  let relocated = 0;
  for (let c = 0; c < k; c++) {
    if (counts[c] > 0) continue;
    let far = -1;
    for (let i = 0; i < n; i++) if (counts[labels[i]] > 1 && (far < 0 || dist[i] > dist[far])) far = i;
    if (far < 0) continue;
    counts[labels[far]]--;
    labels[far] = c;
    dist[far] = 0;
    counts[c] = 1;
    relocated++;
  }
  const sums = new Float64Array(k * d);
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) sums[labels[i] * d + j] += data[i * d + j];
  for (let c = 0; c < k; c++) if (counts[c] > 0) for (let j = 0; j < d; j++) centres[c * d + j] = sums[c * d + j] / counts[c];
  return { labels, relocated };
}

describe('lloydStep when clusters empty out after the first iteration', () => {
  it('relocates by exact distances, as plain Lloyd does, on many small random cases', () => {
    // Tiny data with many clusters, so clusters empty out in later (bounded) iterations too. Before
    // the fix, windows skipped by the bounds kept distances to older centres and the relocation
    // could pick the wrong window (for example case 186 below, at the second iteration).
    let laterRelocations = 0;
    for (let seed = 1; seed <= 400; seed++) {
      const random = seededRandom(seed);
      const n = 10 + (seed % 13);
      const d = 1 + (seed % 3);
      const k = 3 + (seed % 9);
      const data = new Float64Array(n * d);
      for (let i = 0; i < data.length; i++) data[i] = normal(random) * 10;
      const init = new Float64Array(k * d);
      for (let i = 0; i < init.length; i++) init[i] = normal(random) * 10;
      const state = initLloyd(data, n, d, init, 0);
      const centres = Float64Array.from(init);
      for (let it = 0; it < 10; it++) {
        lloydStep(state);
        const { labels, relocated } = referenceStep(data, n, d, centres, k);
        if (it > 0) laterRelocations += relocated;
        expect(Array.from(state.labels), `case ${seed}, iteration ${it}`).toEqual(Array.from(labels));
        for (let c = 0; c < k * d; c++) expect(Math.abs(state.centres[c] - centres[c])).toBeLessThan(1e-9);
      }
    }
    // The cases do exercise relocation after the first, unbounded, iteration.
    expect(laterRelocations).toBeGreaterThanOrEqual(5);
  });
});
