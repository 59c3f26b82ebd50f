import { adjustedRandIndex } from '../metrics/ari';
import { contingency } from '../metrics/contingency';
import { homogeneityFromCounts } from '../metrics/homogeneity';
import { nmiFromCounts } from '../metrics/nmi';
import { purityFromCounts } from '../metrics/purity';
import type { Column } from '../table/table';
import { categoriesOf } from './categories';

/**
 * Agreement of the clusters with a partial label column, computed only on the windows that carry
 * a label. Every figure holds for those `labelledWindows` windows, not for the whole table.
 */
export interface LabelAgreement {
  column: string;
  labelledWindows: number;
  totalWindows: number;
  /** Says in words that the figures come from the labelled windows only. */
  note: string;
  ari: number;
  nmi: number;
  /** Purity of clusters against labels (each cluster counted as its most frequent label). */
  purity: number;
  homogeneity: number;
  completeness: number;
  vMeasure: number;
  /** counts[r][c]: labelled windows in cluster clusters[r] with label labels[c]. */
  contingency: { clusters: number[]; labels: string[]; counts: number[][] };
}

/**
 * Compares cluster labels with a label column on its labelled windows (missing cells, and
 * windows with a negative cluster such as set-aside windows, are left out). Null when no window
 * is both labelled and clustered.
 */
export function labelAgreement(clusters: ArrayLike<number>, label: Column): LabelAgreement | null {
  const cats = categoriesOf(label, clusters.length);
  const rows: number[] = [];
  for (let i = 0; i < clusters.length; i++) if (cats.codes[i] >= 0 && clusters[i] >= 0) rows.push(i);
  if (rows.length === 0) return null;
  const a = Int32Array.from(rows, (i) => clusters[i]);
  const b = Int32Array.from(rows, (i) => cats.codes[i]);
  const table = contingency(a, b);
  const transposed = table.cols.map((_, j) => table.counts.map((row) => row[j]));
  const h = homogeneityFromCounts(transposed);
  const n = rows.length;
  return {
    column: label.name,
    labelledWindows: n,
    totalWindows: clusters.length,
    note: `computed on the ${n} of ${clusters.length} windows that carry a label in "${label.name}"`,
    ari: adjustedRandIndex(a, b),
    nmi: nmiFromCounts(table.counts),
    purity: purityFromCounts(table.counts),
    homogeneity: h.homogeneity,
    completeness: h.completeness,
    vMeasure: h.vMeasure,
    contingency: { clusters: table.rows, labels: table.cols.map((c) => cats.names[c]), counts: table.counts },
  };
}
