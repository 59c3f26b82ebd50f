import { describe, expect, it } from 'vitest';
import { clipInPlace } from '../../../src/core/recipe/clip';
import { iqrSorted, percentileSorted, sortedColumn } from '../../../src/core/recipe/column-stats';
import { columnStatistics, fillColumnsInPlace, imputeInPlace } from '../../../src/core/recipe/impute';
import { logInPlace } from '../../../src/core/recipe/log-transform';
import { minMaxInPlace } from '../../../src/core/recipe/minmax';
import { robustScaleInPlace } from '../../../src/core/recipe/robust';

const flat = (rows: number[][]) => Float64Array.from(rows.flat());

describe('robustScaleInPlace(data, n, d)', () => {
  it('matches the scikit-learn RobustScaler docstring example', () => {
    // scikit-learn sklearn/preprocessing/_data.py RobustScaler docstring.
    const x = flat([[1, -2, 2], [-2, 1, 3], [4, 1, -2]]);
    robustScaleInPlace(x, 3, 3);
    const expected = [[0, -2, 0], [-1, 0, 0.4], [1, 0, -1.6]].flat();
    expected.forEach((v, i) => expect(x[i]).toBeCloseTo(v, 12));
  });

  it('centres but does not divide a feature with zero IQR (scale 1, as RobustScaler), keeps NaN', () => {
    // Present values [5, 5, 5, 5, 9]: 25th and 75th percentiles are both 5.
    const x = Float64Array.from([5, 5, 5, 5, NaN, 9]);
    const e = robustScaleInPlace(x, 6, 1);
    expect(e.zeroSpreadFeatures).toEqual([0]);
    expect(Array.from(x.subarray(0, 4))).toEqual([0, 0, 0, 0]);
    expect(x[4]).toBeNaN();
    expect(x[5]).toBe(4);
  });
});

describe('percentiles and IQR (linear interpolation)', () => {
  it('matches scipy.stats.iqr docstring values, over all values and per column', () => {
    // scipy.stats.iqr docstring: x = [[10, 7, 4], [3, 2, 1]] -> 4.0; axis=0 -> [3.5, 2.5, 1.5].
    const x = flat([[10, 7, 4], [3, 2, 1]]);
    expect(iqrSorted(sortedColumn(x, 6, 1, 0))).toBe(4);
    expect([0, 1, 2].map((j) => iqrSorted(sortedColumn(x, 2, 3, j)))).toEqual([3.5, 2.5, 1.5]);
  });

  it('interpolates between closest ranks (numpy.percentile default "linear" method, from memory)', () => {
    const s = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    expect(percentileSorted(s, 10)).toBeCloseTo(1.9, 12);
    expect(percentileSorted(s, 90)).toBeCloseTo(9.1, 12);
    expect(percentileSorted(s, 50)).toBe(5.5);
    expect(percentileSorted(new Float64Array(0), 50)).toBeNaN();
  });
});

describe('imputation', () => {
  it('matches the scikit-learn SimpleImputer(strategy="mean") docstring example', () => {
    // scikit-learn sklearn/impute/_base.py SimpleImputer docstring: fit [[7,2,3],[4,NaN,6],[10,5,9]], transform
    // [[NaN,2,3],[4,NaN,6],[10,NaN,9]] -> [[7,2,3],[4,3.5,6],[10,3.5,9]].
    const fit = flat([[7, 2, 3], [4, NaN, 6], [10, 5, 9]]);
    const stats = columnStatistics(fit, 3, 3, 'mean');
    expect(Array.from(stats)).toEqual([7, 3.5, 6]);
    const x = flat([[NaN, 2, 3], [4, NaN, 6], [10, NaN, 9]]);
    expect(fillColumnsInPlace(x, 3, 3, stats)).toBe(3);
    expect(Array.from(x)).toEqual([[7, 2, 3], [4, 3.5, 6], [10, 3.5, 9]].flat());
    // Fitting on the fit matrix itself fills its one hole with the same mean.
    imputeInPlace(fit, 3, 3, { method: 'mean' });
    expect(fit[4]).toBe(3.5);
  });

  it('median per subject, falling back to the global median where a subject has no value', () => {
    // One feature; subjects 0 (values 1, 3, NaN), 1 (values 10, 20, 40, NaN), 2 (NaN only).
    const x = Float64Array.from([1, 3, NaN, 10, 20, 40, NaN, NaN]);
    const subjects = Int32Array.from([0, 0, 0, 1, 1, 1, 1, 2]);
    const e = imputeInPlace(x, 8, 1, { method: 'median', subjects });
    expect(x[2]).toBe(2); // median(1, 3)
    expect(x[6]).toBe(20); // median(10, 20, 40)
    expect(x[7]).toBe(10); // no value for subject 2: global median(1, 3, 10, 20, 40)
    expect(e).toEqual({ filled: 3, filledGlobally: 1 });
  });
});

describe('minMaxInPlace, logInPlace, clipInPlace', () => {
  it('min-max matches the scikit-learn MinMaxScaler docstring example (from memory)', () => {
    // scikit-learn MinMaxScaler docstring: [[-1, 2], [-0.5, 6], [0, 10], [1, 18]] ->
    // [[0, 0], [0.25, 0.25], [0.5, 0.5], [1, 1]] (from memory).
    const x = flat([[-1, 2], [-0.5, 6], [0, 10], [1, 18]]);
    minMaxInPlace(x, 4, 2);
    expect(Array.from(x)).toEqual([0, 0, 0.25, 0.25, 0.5, 0.5, 1, 1]);
  });

  it('log1p and signed log (common practice definitions)', () => {
    const x = flat([[0, -3], [Math.E - 1, 3], [-1, NaN]]);
    const a = Float64Array.from(x);
    const e = logInPlace(a, 3, 2, [0], 'log1p');
    expect(a[0]).toBe(0);
    expect(a[2]).toBeCloseTo(1, 15);
    expect(a[4]).toBeNaN(); // log1p(-1) is -Infinity: made missing
    expect(e).toEqual({ transformed: 2, madeMissing: 1 });
    expect(a[1]).toBe(-3); // column 1 not listed
    const b = Float64Array.from(x);
    logInPlace(b, 3, 2, [1], 'signed-log');
    expect(b[1]).toBeCloseTo(-Math.log(4), 15);
    expect(b[3]).toBeCloseTo(Math.log(4), 15);
    expect(b[5]).toBeNaN();
  });

  it('clips to the 10th and 90th percentiles', () => {
    const x = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    const e = clipInPlace(x, 10, 1, 10, 90);
    expect(x[0]).toBeCloseTo(1.9, 12);
    expect(x[9]).toBeCloseTo(9.1, 12);
    expect(Array.from(x.subarray(1, 9))).toEqual([2, 3, 4, 5, 6, 7, 8, 9]);
    expect([e.clippedLow, e.clippedHigh]).toEqual([1, 1]);
  });
});
