import { medianSorted, sortedColumn } from './column-stats';
import { subjectGroups } from './subject-groups';

export interface ImputeOptions {
  method: 'mean' | 'median';
  /** Subject code per row (-1 = none): fill from each subject's own statistic when given. */
  subjects?: Int32Array;
}

export interface ImputeEffect {
  filled: number;
  /** Values filled from the global statistic because the window's subject had no value (or no subject). */
  filledGlobally: number;
}

/**
 * Fills missing values (NaN) in place with the feature mean or median over its present values,
 * as scikit-learn's SimpleImputer does; with `subjects`, each subject's own statistic is used and
 * the global one where the subject has none.
 */
export function imputeInPlace(data: Float64Array, n: number, d: number, opts: ImputeOptions): ImputeEffect {
  // All statistics are taken before any value is filled.
  const global = columnStatistics(data, n, d, opts.method);
  const groups = opts.subjects ? subjectGroups(opts.subjects) : [];
  const perSubject = groups.map((rows) => columnStatistics(data, n, d, opts.method, rows));
  let filled = 0;
  let filledGlobally = 0;
  for (let i = 0; i < n; i++) {
    const s = opts.subjects ? opts.subjects[i] : -1;
    for (let j = 0; j < d; j++) {
      const o = i * d + j;
      if (data[o] === data[o]) continue;
      let v = s >= 0 ? perSubject[s][j] : NaN;
      if (v !== v) { v = global[j]; if (opts.subjects) filledGlobally++; }
      data[o] = v;
      filled++;
    }
  }
  return { filled, filledGlobally };
}

/** Mean or median of each column over its present values (among `rows` when given); NaN when none. */
export function columnStatistics(data: Float64Array, n: number, d: number, method: 'mean' | 'median', rows?: number[]): Float64Array {
  return Float64Array.from({ length: d }, (_, j) => {
    const sorted = sortedColumn(data, n, d, j, rows);
    if (sorted.length === 0) return NaN;
    if (method === 'median') return medianSorted(sorted);
    let sum = 0;
    for (let r = 0; r < sorted.length; r++) sum += sorted[r];
    return sum / sorted.length;
  });
}

/** Fills missing values of column j with values[j] in place (statistics fitted elsewhere); returns the count. */
export function fillColumnsInPlace(data: Float64Array, n: number, d: number, values: Float64Array): number {
  let filled = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) {
      const o = i * d + j;
      if (data[o] !== data[o]) { data[o] = values[j]; filled++; }
    }
  }
  return filled;
}
