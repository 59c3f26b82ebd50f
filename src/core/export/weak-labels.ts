import type { AnalysisResult } from '../analysis.types';
import type { Roles } from '../table/roles.types';
import type { Table } from '../table/table';
import { formatNumber, toCsv } from './csv';
import { windowColumns } from './window-columns';

export const WEAK_LABELS_HEADER = [
  'window_id', 'subject', 'session', 'start', 'end', 'cluster', 'class_name', 'confidence', 'set_aside',
];

/**
 * Per-window weak labels: the window's identity (from the column roles; '' where a role has no
 * column), its cluster index, the class name the user gave that cluster ('' while it is still a
 * candidate) and the assignment confidence, then set_aside (1 when the window's cluster was set
 * aside as noise: its class name is then blank; else 0), and `placed` (1 = the window was placed on
 * the Map from its sampled neighbours, 0 = embedded) only when the run sampled. With curation, pass the curated `labels`
 * (one per table row) and the per-cluster `setAside` flags; confidence stays the run's own.
 */
export function weakLabelsCsv(args: {
  table: Table;
  roles: Roles;
  result: AnalysisResult;
  /** Class name per cluster index; '' or missing for an unnamed candidate. */
  clusterNames: readonly (string | undefined)[];
  /** Cluster per window after curation; the run's labels when absent. */
  labels?: Int32Array;
  /** Set-aside flag per cluster index; none set aside when absent. */
  setAside?: readonly boolean[];
}): string {
  const { table, roles, result, clusterNames } = args;
  const labels = args.labels ?? result.labels;
  if (labels.length !== table.nRows) throw new Error(`weakLabelsCsv: ${labels.length} labels for ${table.nRows} windows`);
  const w = windowColumns(table, roles);
  const placed = result.placed;
  const rows: (string | number)[][] = new Array(table.nRows);
  for (let i = 0; i < table.nRows; i++) {
    const cluster = labels[i];
    const aside = args.setAside?.[cluster] === true;
    rows[i] = [
      w.id(i),
      w.subject(i),
      w.session(i),
      w.start(i),
      w.end(i),
      String(cluster),
      aside ? '' : (clusterNames[cluster] ?? ''),
      formatNumber(result.confidence[i], 4),
      aside ? '1' : '0',
    ];
    if (placed) rows[i].push(String(placed[i]));
  }
  return toCsv(placed ? [...WEAK_LABELS_HEADER, 'placed'] : WEAK_LABELS_HEADER, rows);
}
