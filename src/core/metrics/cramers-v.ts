import { chiSquareTest } from './chi-square';
import { margins } from './entropy';

/**
 * Cramér's V of a contingency table: sqrt(X² / (n · (min(r, c) - 1))) over non-empty rows and
 * columns, without bias correction. 0 (no association) to 1 (each row value fixes the column);
 * NaN when either side holds fewer than two values.
 */
export function cramersV(counts: readonly (readonly number[])[], chi2 = chiSquareTest(counts).statistic): number {
  const { rows, cols, total } = margins(counts);
  const m = Math.min(rows.filter((v) => v > 0).length, cols.filter((v) => v > 0).length) - 1;
  if (m < 1 || total <= 0) return NaN;
  return Math.min(1, Math.sqrt(chi2 / (total * m)));
}
