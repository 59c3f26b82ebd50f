import type { AnalysisResult } from '../../../core/analysis.types';
import { compareRuns, type RunComparison } from '../../../core/composition/run-comparison';
import { tableLabels } from '../../lib/run-rows';

/** Two runs compared on the windows both of them analysed. */
export function compareResults(a: Pick<AnalysisResult, 'labels' | 'windows'>, b: Pick<AnalysisResult, 'labels' | 'windows'>, nRows: number): RunComparison {
  const la = tableLabels(a, nRows), lb = tableLabels(b, nRows);
  const keep: number[] = [];
  for (let i = 0; i < nRows; i++) if (la[i] >= 0 && lb[i] >= 0) keep.push(i);
  return compareRuns(Int32Array.from(keep, (i) => la[i]), Int32Array.from(keep, (i) => lb[i]));
}

/** A cluster of the earlier run whose windows mostly stay together is kept; below this share it dissolved. */
export const KEPT_SHARE = 0.6;

/** What became of each cluster of run A in run B, in words. */
export function fateText(share: number, to: string): string {
  const pct = `${Math.round(100 * share)}%`;
  return share >= KEPT_SHARE ? `kept: ${pct} went to ${to}` : `dissolved: at most ${pct} went to one cluster (${to})`;
}

/** Row shares of a contingency table (each row sums to 1; empty rows stay 0). */
export function rowShares(counts: readonly number[][]): number[][] {
  return counts.map((row) => {
    const s = row.reduce((a, v) => a + v, 0);
    return row.map((v) => (s > 0 ? v / s : 0));
  });
}
