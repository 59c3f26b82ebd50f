import { describe, expect, it } from 'vitest';
import { DISSOLUTION, summarizeStability } from '../../../src/core/stability/summarize';

describe('summarizeStability', () => {
  it('mean Jaccard, dissolved share and dissolving subjects: a worked example', () => {
    // Worked by hand. One cluster, four resamples leaving out subject A, A, B, C.
    // Jaccard 0.2, 0.5, 0.9, 0.3: mean 1.9 / 4 = 0.475; dissolved (≤ 0.5, R fpc clusterboot's
    // "smaller or equal") in resamples 1, 2 and 4: 3/4. Without A: 2 of 2 dissolved (1 > 3/4);
    // without B: 0 of 1 (not named); without C: 1 of 1 (1 > 3/4). A before C: same rate, more dissolutions.
    const [c] = summarizeStability(Float64Array.from([0.2, 0.5, 0.9, 0.3]), 1, [[0], [0], [1], [2]], ['A', 'B', 'C']);
    expect(DISSOLUTION).toBe(0.5);
    expect(c.meanJaccard).toBeCloseTo(0.475, 15);
    expect(c.dissolvedShare).toBe(0.75);
    expect(c.dissolvingSubjects).toEqual([
      { subject: 'A', leftOut: 2, dissolved: 2, share: 1 },
      { subject: 'C', leftOut: 1, dissolved: 1, share: 1 },
    ]);
  });

  it('names no subject when their absence does not raise the dissolution rate, and at most three', () => {
    // Cluster 0 dissolves in every resample: nobody's absence stands out. Cluster 1 dissolves only
    // without S1..S4 (resample 0 leaves all four out): the first three by name are kept.
    const jaccard = Float64Array.from([0.1, 0.4, 0.2, 0.9, 0.3, 0.8]);
    const out = summarizeStability(jaccard, 2, [[0, 1, 2, 3], [4], [5]], ['S1', 'S2', 'S3', 'S4', 'S5', 'S6']);
    expect(out[0].dissolvedShare).toBe(1);
    expect(out[0].dissolvingSubjects).toEqual([]);
    expect(out[1].dissolvedShare).toBeCloseTo(1 / 3, 15);
    expect(out[1].dissolvingSubjects.map((s) => s.subject)).toEqual(['S1', 'S2', 'S3']);
  });

  it('reports a cluster that was not assessed (NaN: set-aside noise) as null', () => {
    const out = summarizeStability(Float64Array.from([Number.NaN, 1]), 2, [[0]], ['A', 'B']);
    expect(out[0]).toEqual({ cluster: 0, meanJaccard: null, dissolvedShare: null, dissolvingSubjects: [] });
    expect(out[1].meanJaccard).toBe(1);
  });
});
