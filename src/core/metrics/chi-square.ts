import { margins } from './entropy';
import { chiSquareSurvival } from './gamma';

export interface ChiSquareTest {
  /** Pearson's X² = Σ (observed - expected)² / expected over cells of non-empty rows and columns. */
  statistic: number;
  /** (non-empty rows - 1) × (non-empty columns - 1). */
  dof: number;
  /** P(X² ≥ statistic) under independence (chi-square distribution); NaN when dof = 0. */
  pValue: number;
  /** Number of observations. */
  n: number;
  /** Expected count of each cell under independence (row sum × column sum / n). */
  expected: number[][];
}

/**
 * Pearson's chi-square test of independence on a contingency table, without continuity
 * correction. Empty rows and columns carry no information and are left out of the degrees of
 * freedom.
 */
export function chiSquareTest(counts: readonly (readonly number[])[]): ChiSquareTest {
  const { rows, cols, total } = margins(counts);
  const expected = counts.map((row, i) => row.map((_, j) => (total > 0 ? (rows[i] * cols[j]) / total : 0)));
  let statistic = 0;
  counts.forEach((row, i) => row.forEach((v, j) => {
    const e = expected[i][j];
    if (e > 0) statistic += ((v - e) * (v - e)) / e;
  }));
  const r = rows.filter((v) => v > 0).length;
  const c = cols.filter((v) => v > 0).length;
  const dof = Math.max(0, r - 1) * Math.max(0, c - 1);
  return { statistic, dof, pValue: dof > 0 ? chiSquareSurvival(statistic, dof) : NaN, n: total, expected };
}
