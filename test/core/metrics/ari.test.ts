import { describe, expect, it } from 'vitest';
import { adjustedRandIndex, pairConfusion, randIndex } from '../../../src/core/metrics/ari';
import { contingency } from '../../../src/core/metrics/contingency';

// Values from scikit-learn sklearn/metrics/cluster/_supervised.py docstrings and
// JuliaStats/Clustering.jl test/randindex.jl.
describe('contingency(a, b)', () => {
  it('matches the scikit-learn contingency_matrix docstring', () => {
    const c = contingency([0, 0, 1, 1, 2, 2], [1, 0, 2, 1, 0, 2]);
    expect(c.counts).toEqual([[1, 1, 0], [0, 1, 1], [1, 0, 1]]);
    expect(c.rows).toEqual([0, 1, 2]);
    expect(c.cols).toEqual([0, 1, 2]);
  });
});

describe('pairConfusion and randIndex', () => {
  it('match the scikit-learn pair_confusion_matrix and rand_score docstrings', () => {
    expect(pairConfusion([0, 0, 1, 1], [1, 1, 0, 0])).toEqual([[8, 0], [0, 4]]);
    expect(pairConfusion([0, 0, 1, 2], [0, 0, 1, 1])).toEqual([[8, 2], [0, 2]]);
    expect(randIndex([0, 0, 1, 2], [0, 0, 1, 1])).toBeCloseTo(5 / 6, 12);
  });
});

describe('adjustedRandIndex(a, b)', () => {
  it('matches the scikit-learn adjusted_rand_score docstring', () => {
    expect(adjustedRandIndex([0, 0, 1, 1], [0, 0, 1, 1])).toBe(1);
    expect(adjustedRandIndex([0, 0, 1, 1], [1, 1, 0, 0])).toBe(1);
    expect(adjustedRandIndex([0, 0, 1, 2], [0, 0, 1, 1])).toBeCloseTo(4 / 7, 12);
    expect(adjustedRandIndex([0, 0, 1, 1], [0, 0, 1, 2])).toBeCloseTo(4 / 7, 12);
    expect(adjustedRandIndex([0, 0, 0, 0], [0, 1, 2, 3])).toBe(0);
    expect(adjustedRandIndex([0, 0, 1, 1], [0, 1, 0, 1])).toBeCloseTo(-0.5, 12);
  });

  it('matches the Clustering.jl randindex example', () => {
    const a = [1, 1, 1, 2, 2, 2, 3, 3, 3, 3];
    const b = [1, 1, 1, 1, 2, 2, 2, 2, 2, 2];
    expect(Math.abs(adjustedRandIndex(a, b) - 0.403669)).toBeLessThan(1e-6); // quoted to 6 decimals, truncated
    expect(randIndex(a, b)).toBeCloseTo(0.711111, 6);
  });

  it('rejects labellings of different lengths', () => {
    expect(() => adjustedRandIndex([0, 1], [0])).toThrow(/length/);
  });
});
