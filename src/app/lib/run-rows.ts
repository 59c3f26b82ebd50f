import type { AnalysisResult } from '../../core/analysis.types';

/** Table row of each analysed window (the identity when the recipe kept every window). */
export function resultRows(result: Pick<AnalysisResult, 'labels' | 'windows'>): Int32Array {
  if (result.windows) return result.windows;
  return Int32Array.from({ length: result.labels.length }, (_, i) => i);
}

/** Cluster of every table row; -1 for rows the run left out. */
export function tableLabels(result: Pick<AnalysisResult, 'labels' | 'windows'>, nRows: number): Int32Array {
  const out = new Int32Array(nRows).fill(-1);
  const rows = resultRows(result);
  for (let i = 0; i < rows.length; i++) out[rows[i]] = result.labels[i];
  return out;
}

/** A selection mask over the run's windows (result rows) holding the rows `pick` accepts. */
export function maskWhere(n: number, pick: (i: number) => boolean): Uint8Array {
  const mask = new Uint8Array(n);
  for (let i = 0; i < n; i++) if (pick(i)) mask[i] = 1;
  return mask;
}
