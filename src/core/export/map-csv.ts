import type { AnalysisResult } from '../analysis.types';
import type { Roles } from '../table/roles.types';
import type { Table } from '../table/table';
import { formatNumber, toCsv } from './csv';
import type { ClusterIdentity } from './run-model';
import { windowColumns } from './window-columns';

export const MAP_CSV_HEADER = ['id', 'subject', 'start', 'end', 'x', 'y', 'cluster', 'cluster_name', 'confidence'];

/**
 * The CLI's per-window table: identity columns, map coordinates, the cluster's number (index + 1)
 * and name (as the app shows them) and confidence, then `placed` (1 = placed from its sampled neighbours, 0 = embedded) only when the
 * run sampled, and `noise` (1 = in no dense cluster: the set-aside last cluster) only for HDBSCAN
 * runs. Numbers are formatted deterministically, so the same run gives the same bytes.
 */
export function mapCsv(args: { table: Table; roles: Roles; result: AnalysisResult; identities: readonly ClusterIdentity[] }): string {
  const { table, roles, result, identities } = args;
  const w = windowColumns(table, roles);
  const rows: (string | number)[][] = new Array(table.nRows);
  const placed = result.placed;
  const noise = result.cluster.method === 'hdbscan' ? result.cluster.noiseCluster ?? -1 : null;
  for (let i = 0; i < table.nRows; i++) {
    rows[i] = [
      w.id(i),
      w.subject(i),
      w.start(i),
      w.end(i),
      formatNumber(result.coords[2 * i]),
      formatNumber(result.coords[2 * i + 1]),
      String(identities[result.labels[i]].number),
      identities[result.labels[i]].name,
      formatNumber(result.confidence[i], 4),
    ];
    if (placed) rows[i].push(String(placed[i]));
    if (noise !== null) rows[i].push(result.labels[i] === noise ? '1' : '0');
  }
  const header = [...MAP_CSV_HEADER, ...(placed ? ['placed'] : []), ...(noise !== null ? ['noise'] : [])];
  return toCsv(header, rows);
}
