import type { AnalysisResult } from '../analysis.types';
import type { Roles } from '../table/roles.types';
import type { Table } from '../table/table';
import { formatNumber, toCsv } from './csv';
import { flagsCell, type ClusterIdentity } from './run-model';
import { windowColumns } from './window-columns';

export const WEAK_LABELS_HEADER = [
  'window_id', 'subject', 'session', 'start', 'end', 'cluster', 'cluster_name', 'class_name', 'confidence', 'set_aside', 'flags',
];

/**
 * Per-window weak labels: the window's identity (from the column roles; '' where a role has no
 * column); its cluster's number (index + 1, as on screen) and name (class name, else working name,
 * else "candidate N"); the class name ('' while the cluster is still a candidate, and when it is
 * set aside); the run's assignment confidence; set_aside (1 when the window's cluster was set aside
 * as noise, else 0); the cluster's composition flags ("subject-bound; site-bound", '' = none); and
 * `placed` (1 = placed on the Map from its sampled neighbours, 0 = embedded) only when the run
 * sampled. `labels` are the curated labels (one per table row); `identities` come from
 * clusterIdentities on the same curation.
 */
export function weakLabelsCsv(args: {
  table: Table;
  roles: Roles;
  result: AnalysisResult;
  identities: readonly ClusterIdentity[];
  /** Cluster per window after curation; the run's labels when absent. */
  labels?: Int32Array;
}): string {
  const { table, roles, result, identities } = args;
  const labels = args.labels ?? result.labels;
  if (labels.length !== table.nRows) throw new Error(`weakLabelsCsv: ${labels.length} labels for ${table.nRows} windows`);
  const w = windowColumns(table, roles);
  const placed = result.placed;
  const flags = identities.map(flagsCell);
  const rows: (string | number)[][] = new Array(table.nRows);
  for (let i = 0; i < table.nRows; i++) {
    const c = labels[i];
    const id = identities[c];
    if (!id) throw new Error(`weakLabelsCsv: window ${i} is in cluster index ${c}, which has no identity (${identities.length} clusters)`);
    rows[i] = [
      w.id(i),
      w.subject(i),
      w.session(i),
      w.start(i),
      w.end(i),
      String(id.number),
      id.name,
      id.className,
      formatNumber(result.confidence[i], 4),
      id.setAside ? '1' : '0',
      flags[c],
    ];
    if (placed) rows[i].push(String(placed[i]));
  }
  return toCsv(placed ? [...WEAK_LABELS_HEADER, 'placed'] : WEAK_LABELS_HEADER, rows);
}
