import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS, type FeatureMatrix } from '../../src/core/analysis.types';
import { quietContext } from '../../src/core/job';
import { recutJob } from '../../src/worker/recut-job';

// Three groups of four windows on a line (one feature): at 0, 10 and 20, with small offsets.
const values = [0, 1, 0.5, 0.2, 10, 11, 10.5, 10.2, 20, 21, 20.5, 20.2];
const matrix: FeatureMatrix = { data: Float64Array.from(values), n: 12, d: 1, featureNames: ['x'] };
const coords = new Float32Array(24);

describe('recut job', () => {
  it('gives an index without windows (a gap a re-cut leaves) no centre: confidence and silhouette equal those of the compact labels', async () => {
    const compact = Int32Array.from([0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2]);
    // The same clusters as indices 0, 3 and 5: indices 1, 2 and 4 have no window.
    const gapped = Int32Array.from(compact, (c) => [0, 3, 5][c]);
    const a = await recutJob({ matrix, params: DEFAULT_ANALYSIS_PARAMS, labels: compact, coords }, quietContext);
    const b = await recutJob({ matrix, params: DEFAULT_ANALYSIS_PARAMS, labels: gapped, coords }, quietContext);
    expect(Array.from(b.confidence)).toEqual(Array.from(a.confidence));
    // The silhouette numbers clusters itself: the same with or without the gaps.
    expect(b.silhouette).toBe(a.silhouette);
    expect(a.silhouette).toBeGreaterThan(0.5);
    // Every window is nearer its own group's centre than any other: confidence well above 0.
    for (const c of a.confidence) expect(c).toBeGreaterThan(0.5);
    // Means: one row per index, zeros for the empty ones, the groups' means where they are.
    const d = b.centroids.length / 6;
    expect(b.centroids.length).toBe(6 * d);
    for (const gap of [1, 2, 4]) for (let j = 0; j < d; j++) expect(b.centroids[gap * d + j]).toBe(0);
    for (const [from, to] of [[0, 0], [1, 3], [2, 5]]) {
      for (let j = 0; j < d; j++) expect(b.centroids[to * d + j]).toBeCloseTo(a.centroids[from * d + j], 12);
    }
  });
});
