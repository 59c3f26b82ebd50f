import { chiSquareSurvival } from '../metrics/gamma';
import { averageRanks } from './ranks';

export interface KruskalWallis {
  /** H statistic, corrected for ties; NaN when every value is tied or fewer than 2 groups have values. */
  h: number;
  /** Non-empty groups - 1. */
  dof: number;
  /** Chi-square approximation of P(H ≥ h) under equal distributions. */
  pValue: number;
  /** Values used (missing values and negative groups left out). */
  n: number;
}

/**
 * Kruskal–Wallis H test across groups 0..k-1 of one feature: whether the groups' values come from
 * one distribution, on ranks (robust to outliers and scale). NaN values and negative group ids are
 * left out.
 */
export function kruskalWallis(values: ArrayLike<number>, groups: ArrayLike<number>, k: number): KruskalWallis {
  const kept: number[] = [];
  for (let i = 0; i < values.length; i++) if (values[i] === values[i] && groups[i] >= 0 && groups[i] < k) kept.push(i);
  const n = kept.length;
  const { ranks, tieSum } = averageRanks(kept.map((i) => values[i]));
  const rankSums = new Float64Array(k);
  const sizes = new Float64Array(k);
  kept.forEach((i, r) => { rankSums[groups[i]] += ranks[r]; sizes[groups[i]]++; });
  let nonEmpty = 0;
  let s = 0;
  for (let g = 0; g < k; g++) if (sizes[g] > 0) { nonEmpty++; s += (rankSums[g] * rankSums[g]) / sizes[g]; }
  const dof = nonEmpty - 1;
  const correction = n > 1 ? 1 - tieSum / (n * n * n - n) : 0;
  if (dof < 1 || !(correction > 0)) return { h: NaN, dof: Math.max(dof, 0), pValue: NaN, n };
  const h = ((12 / (n * (n + 1))) * s - 3 * (n + 1)) / correction;
  const hClamped = Math.max(0, h);
  return { h: hClamped, dof, pValue: chiSquareSurvival(hClamped, dof), n };
}
