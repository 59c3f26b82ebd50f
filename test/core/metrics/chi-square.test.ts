import { describe, expect, it } from 'vitest';
import { chiSquareTest } from '../../../src/core/metrics/chi-square';
import { cramersV } from '../../../src/core/metrics/cramers-v';
import { chiSquareSurvival, logGamma, upperGammaQ } from '../../../src/core/metrics/gamma';

describe('logGamma and upperGammaQ', () => {
  it('match known values of Γ and of the regularized upper incomplete gamma', () => {
    // Γ(5) = 24, Γ(1/2) = √π (common practice).
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 12);
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 12);
    // scipy.special.gammaincc, SciPy 1.17.1 (computed).
    expect(upperGammaQ(0.5, 2)).toBeCloseTo(0.04550026389635857, 12);
    expect(upperGammaQ(5, 3)).toBeCloseTo(0.8152632445237722, 12);
    expect(upperGammaQ(10.5, 20)).toBeCloseTo(0.007436777297804687, 12);
    expect(upperGammaQ(100, 90)).toBeCloseTo(0.84177901081357, 10);
    expect(upperGammaQ(3, 0)).toBe(1);
  });

  it('gives the chi-square tail: 0.05 at 3.841459 (1 dof) and exp(-x/2) with 2 dof', () => {
    // 3.841459 is the 95% point of chi-square(1) in every printed table (common practice).
    expect(chiSquareSurvival(3.841458820694124, 1)).toBeCloseTo(0.05, 12);
    // With 2 degrees of freedom the survival function is exactly exp(-x/2) (common practice).
    expect(chiSquareSurvival(7, 2)).toBeCloseTo(Math.exp(-3.5), 14);
    expect(chiSquareSurvival(0, 4)).toBe(1);
  });
});

describe('chiSquareTest(counts)', () => {
  it('matches the scipy.stats.chi2_contingency docstring example', () => {
    // SciPy 1.17.1 chi2_contingency docstring: [[10, 10, 20], [20, 20, 20]] -> statistic
    // 2.7777777777777777, p 0.24935220877729622, dof 2, expected [[12, 12, 16], [18, 18, 24]]
    // (re-run with SciPy 1.17.1 to confirm).
    const t = chiSquareTest([[10, 10, 20], [20, 20, 20]]);
    expect(t.statistic).toBeCloseTo(2.7777777777777777, 12);
    expect(t.dof).toBe(2);
    expect(t.pValue).toBeCloseTo(0.24935220877729622, 12);
    expect(t.expected).toEqual([[12, 12, 16], [18, 18, 24]]);
    expect(t.n).toBe(100);
  });

  it('matches the published party identification by gender example', () => {
    // Agresti, An Introduction to Categorical Data Analysis (2nd ed., 2007), section 2.4, Table 2.5:
    // X² = 30.1 with df = 2, P < 0.001 (from memory); to more digits, scipy.stats.chi2_contingency
    // (SciPy 1.17.1, computed): 30.070149095754672, p 2.9535891832117595e-07.
    const t = chiSquareTest([[762, 327, 468], [484, 239, 477]]);
    expect(t.statistic).toBeCloseTo(30.070149095754672, 9);
    expect(t.dof).toBe(2);
    expect(t.pValue / 2.9535891832117595e-7).toBeCloseTo(1, 9);
  });

  it('leaves empty rows and columns out of the degrees of freedom', () => {
    const t = chiSquareTest([[10, 0, 20], [0, 0, 0], [20, 0, 20]]);
    expect(t.dof).toBe(1);
    expect(chiSquareTest([[5, 5]]).pValue).toBeNaN();
  });
});

describe('cramersV(counts)', () => {
  it('matches scipy.stats.contingency.association(method="cramer")', () => {
    // SciPy 1.17.1 association docstring: obs4x2 -> 0.18617813077483678.
    expect(cramersV([[100, 150], [203, 322], [420, 700], [320, 210]])).toBeCloseTo(0.18617813077483678, 12);
    // Same function on the Agresti table (SciPy 1.17.1, computed): 0.10443580235646777.
    expect(cramersV([[762, 327, 468], [484, 239, 477]])).toBeCloseTo(0.10443580235646777, 12);
  });

  it('is 1 for a one-to-one table and NaN with a single row', () => {
    expect(cramersV([[4, 0, 0], [0, 3, 0], [0, 0, 5]])).toBeCloseTo(1, 12);
    expect(cramersV([[4, 3]])).toBeNaN();
  });
});
