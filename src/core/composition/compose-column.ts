import { chiSquareTest } from '../metrics/chi-square';
import { cramersV } from '../metrics/cramers-v';
import { nmiFromCounts } from '../metrics/nmi';
import type { Column } from '../table/table';
import { boundRule, judgeBound, type BoundRule } from './bound-rule';
import { categoriesOf, withMissingAsValue } from './categories';
import { clusterMix, type ClusterMix, type CohortMix } from './cluster-mix';

/** One cluster's mix of a column's values, with the bound verdict. */
export interface ComposedCluster extends ClusterMix {
  bound: boolean;
  boundReason: string;
}

/** How clusters and one categorical column go together (the Mix view; a bias check). */
export interface ColumnComposition {
  /** Column name ('' without a column). */
  column: string;
  cohort: CohortMix;
  clusters: ComposedCluster[];
  /** NMI between clusters and the column (arithmetic-mean normalization). */
  nmi: number;
  /** Cramér's V between clusters and the column (NaN when either holds one value). */
  cramersV: number;
  /** Pearson chi-square test of independence of clusters and the column. */
  chiSquare: { statistic: number; dof: number; pValue: number };
  rule: BoundRule;
}

/**
 * Composition of clusters 0..k-1 by a categorical column (subject, session, device, site, group).
 * Missing cells count as one value named ''. `noun` names the column's values in reasons.
 */
export function composeColumn(
  labels: ArrayLike<number>, k: number, column: Column | undefined, rule: Partial<BoundRule> = {}, noun = 'subject',
): ColumnComposition {
  const r = boundRule(rule);
  const cats = withMissingAsValue(categoriesOf(column, labels.length));
  const table = clusterMix(labels, k, cats);
  const test = chiSquareTest(table.counts);
  return {
    column: column?.name ?? '',
    cohort: table.cohort,
    clusters: table.clusters.map((m) => {
      const v = judgeBound(m, table.cohort, r, noun);
      return { ...m, bound: v.bound, boundReason: v.reason };
    }),
    nmi: nmiFromCounts(table.counts),
    cramersV: cramersV(table.counts, test.statistic),
    chiSquare: { statistic: test.statistic, dof: test.dof, pValue: test.pValue },
    rule: r,
  };
}
