import { describe, expect, it } from 'vitest';
import { baselineRecipe } from '../../../src/core/recipe/baseline';
import { zscoreInPlace } from '../../../src/core/recipe/zscore';

describe('zscoreInPlace(data, n, d)', () => {
  it('matches the scipy.stats.zscore docstring example (ddof 0)', () => {
    // SciPy scipy.stats.zscore docstring; the docstring prints 4 decimals.
    const a = Float64Array.from([0.7972, 0.0767, 0.4383, 0.7866, 0.8091, 0.1954, 0.6307, 0.6599, 0.1065, 0.0508]);
    zscoreInPlace(a, 10, 1);
    const expected = [1.1273, -1.247, -0.0552, 1.0923, 1.1664, -0.8559, 0.5786, 0.6748, -1.1488, -1.3324];
    expected.forEach((v, i) => expect(a[i]).toBeCloseTo(v, 3));
  });

  it("matches scipy.stats.zscore(nan_policy='omit'), NaN kept", () => {
    // SciPy scipy.stats.zscore docstring, nan_policy='omit' example.
    const a = Float64Array.from([25.11, 30.1, NaN, 32.02, 43.15]);
    zscoreInPlace(a, 5, 1);
    const expected = [-1.13490897, -0.37830299, NaN, -0.08718406, 1.60039602];
    expect(a[2]).toBeNaN();
    [0, 1, 3, 4].forEach((i) => expect(a[i]).toBeCloseTo(expected[i], 7));
  });

  it('scales columns independently and sets constant columns to 0', () => {
    const a = Float64Array.from([1, 5, 10, 2, 5, NaN, 3, 5, 30]);
    const effect = zscoreInPlace(a, 3, 3);
    expect(effect.constantFeatures).toEqual([1]);
    // Column 0 = [1,2,3]: mean 2, sd sqrt(2/3) (ddof 0, common practice).
    expect(a[0]).toBeCloseTo(-1 / Math.sqrt(2 / 3), 12);
    expect([a[1], a[4], a[7]]).toEqual([0, 0, 0]);
    expect(a[5]).toBeNaN();
    expect(a[2]).toBeCloseTo(-1, 12);
    expect(a[8]).toBeCloseTo(1, 12);
  });
});

describe('baselineRecipe(matrix)', () => {
  it('z-scores, fills missing with 0 and records both steps without touching the input', () => {
    const data = Float64Array.from([1, NaN, 2, 4, 3, 8]);
    const out = baselineRecipe({ data, n: 3, d: 2, featureNames: ['a', 'b'] });
    expect(data[1]).toBeNaN();
    expect(out.data[1]).toBe(0);
    expect(out.recipe.map((s) => s.step)).toEqual(['zscore', 'impute']);
    expect(out.recipe[0].effect).toMatchObject({ features: 2, constantFeatures: [], missingValues: 1 });
    expect(out.recipe[1].effect).toEqual({ filled: 1 });
  });
});
