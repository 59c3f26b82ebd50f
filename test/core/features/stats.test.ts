import { describe, expect, it } from 'vitest';
import { mean, pearson, percentileSorted, range, sdPopulation } from '../../../src/core/features/stats';

describe('sdPopulation', () => {
  it('sdPopulation([2,4,4,4,5,5,7,9]) = 2 (ddof 0)', () => {
    // Textbook population-SD example (mean 5, variance 4); numpy.std's default ddof = 0 gives 2.0
    // for this series (NumPy numpy.std documentation, "ddof" parameter).
    expect(sdPopulation([2, 4, 4, 4, 5, 5, 7, 9])).toBeCloseTo(2, 12);
  });

  it('is 0 for a constant slice and respects start/end', () => {
    expect(sdPopulation([9, 3, 3, 3, 9], 1, 4)).toBe(0);
    expect(mean([9, 3, 3, 3, 9], 1, 4)).toBe(3);
  });
});

describe('range', () => {
  it('is max − min, NaN if a sample is missing', () => {
    expect(range([3, -1, 4, 1, 5])).toBe(6);
    expect(range([1, NaN, 2])).toBeNaN();
  });
});

describe('percentileSorted', () => {
  it('interpolates linearly like numpy.percentile (method "linear")', () => {
    // NumPy numpy.percentile docstring: a = [[10, 7, 4], [3, 2, 1]], np.percentile(a, 50) = 3.5.
    const sorted = Float64Array.from([10, 7, 4, 3, 2, 1]).sort();
    expect(percentileSorted(sorted, 50)).toBe(3.5);
    // Position p/100·(n−1): for [1, 2, 3, 4] the 10th percentile is 1 + 0.3·(2 − 1) = 1.3 (common practice).
    expect(percentileSorted([1, 2, 3, 4], 10)).toBeCloseTo(1.3, 12);
    expect(percentileSorted([1, 2, 3, 4], 0)).toBe(1);
    expect(percentileSorted([1, 2, 3, 4], 100)).toBe(4);
  });
});

describe('pearson', () => {
  const x = [1, 2, 3, 4, 5, 6];
  it('is +1 and −1 for perfectly (anti)correlated series (textbook definition)', () => {
    expect(pearson(x, x.map((v) => 2 * v + 1))).toBeCloseTo(1, 12);
    expect(pearson(x, x.map((v) => -3 * v + 7))).toBeCloseTo(-1, 12);
  });

  it('matches Anscombe quartet set I, r = 0.816', () => {
    // F. J. Anscombe, "Graphs in Statistical Analysis", The American Statistician 27(1), 1973:
    // all four sets have correlation 0.816 (data of set I from memory).
    const ax = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
    const ay = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
    expect(pearson(ax, ay)).toBeCloseTo(0.816, 3);
  });

  it('returns 0 when one series is constant (our convention for an undefined correlation)', () => {
    expect(pearson(x, x.map(() => 1))).toBe(0);
  });
});
