import type { AnalysisResult } from '../analysis.types';
import type { Roles } from '../table/roles.types';
import type { Table } from '../table/table';
import { formatNumber, toCsv } from './csv';
import { windowColumns } from './window-columns';

export const WEAK_LABELS_HEADER = [
  'window_id', 'subject', 'session', 'start', 'end', 'cluster', 'class_name', 'confidence',
];

/**
 * Per-window weak labels: the window's identity (from the column roles; '' where a role has no
 * column), its cluster index, the class name the user gave that cluster ('' while it is still a
 * candidate) and the assignment confidence.
 */
export function weakLabelsCsv(args: {
  table: Table;
  roles: Roles;
  result: AnalysisResult;
  /** Class name per cluster index; '' or missing for an unnamed candidate. */
  clusterNames: readonly (string | undefined)[];
}): string {
  const { table, roles, result, clusterNames } = args;
  const w = windowColumns(table, roles);
  const rows: (string | number)[][] = new Array(table.nRows);
  for (let i = 0; i < table.nRows; i++) {
    const cluster = result.labels[i];
    rows[i] = [
      w.id(i),
      w.subject(i),
      w.session(i),
      w.start(i),
      w.end(i),
      String(cluster),
      clusterNames[cluster] ?? '',
      formatNumber(result.confidence[i], 4),
    ];
  }
  return toCsv(WEAK_LABELS_HEADER, rows);
}
