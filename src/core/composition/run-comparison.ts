import { adjustedRandIndex } from '../metrics/ari';
import { contingency } from '../metrics/contingency';
import { nmiFromCounts } from '../metrics/nmi';

/** Where the windows of one cluster of run A went in run B. */
export interface ClusterMatch {
  /** Cluster of run A. */
  a: number;
  size: number;
  /** Cluster of run B holding most of them (lowest id on ties). */
  b: number;
  /** Share of the A cluster's windows that landed in `b`. */
  share: number;
}

/** Two runs over the same windows compared (for example before and after per-subject scaling). */
export interface RunComparison {
  windows: number;
  ari: number;
  nmi: number;
  /** counts[r][c]: windows in cluster a[r] of run A and cluster b[c] of run B. */
  contingency: { a: number[]; b: number[]; counts: number[][] };
  matches: ClusterMatch[];
}

/** Compares the cluster labels of two runs over the same windows, in the same order. */
export function compareRuns(a: ArrayLike<number>, b: ArrayLike<number>): RunComparison {
  if (a.length !== b.length) throw new Error(`the two runs hold different numbers of windows: ${a.length} and ${b.length}`);
  const t = contingency(a, b);
  const matches = t.counts.map((row, r): ClusterMatch => {
    const size = row.reduce((s, v) => s + v, 0);
    let best = 0;
    for (let c = 1; c < row.length; c++) if (row[c] > row[best]) best = c;
    return { a: t.rows[r], size, b: t.cols[best], share: size > 0 ? row[best] / size : 0 };
  });
  return {
    windows: a.length,
    ari: adjustedRandIndex(a, b),
    nmi: nmiFromCounts(t.counts),
    contingency: { a: t.rows, b: t.cols, counts: t.counts },
    matches,
  };
}
