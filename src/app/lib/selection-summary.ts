import type { Roles } from '../../core/table/roles.types';
import { cellText, type Table } from '../../core/table/table';
import { columnWithRole } from './columns';

export interface SelectionSummaryData {
  /** Distinct subjects among the selected windows; null when the table has no subject column. */
  subjects: number | null;
  /** [cluster, windows] pairs, largest first. */
  clusters: [number, number][];
}

/** Subjects and clusters among the selected windows. */
export function summarizeSelection(mask: Uint8Array, labels: Int32Array, table: Table, roles: Roles): SelectionSummaryData {
  const subjectColumn = columnWithRole(table, roles, 'subject');
  const subjects = new Set<string>();
  const perCluster = new Map<number, number>();
  for (let i = 0; i < mask.length; i++) {
    if (!mask[i]) continue;
    if (subjectColumn) subjects.add(cellText(subjectColumn, i));
    perCluster.set(labels[i], (perCluster.get(labels[i]) ?? 0) + 1);
  }
  return {
    subjects: subjectColumn ? subjects.size : null,
    clusters: [...perCluster].sort((a, b) => b[1] - a[1]),
  };
}
