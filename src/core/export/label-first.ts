import { formatNumber, toCsv } from './csv';
import type { Roles } from '../table/roles.types';
import type { Table } from '../table/table';
import type { ClusterIdentity } from './run-model';
import { windowColumns } from './window-columns';

export interface LabelFirstRow {
  /** Cluster index (0-based). */
  cluster: number;
  className: string;
  /** typical: the cluster's most confident windows (far from any other centre); borderline: its least. */
  kind: 'typical' | 'borderline';
  rank: number;
  window: number;
  confidence: number;
}

export const LABEL_FIRST_HEADER = ['class_name', 'cluster', 'cluster_name', 'kind', 'rank', 'window_id', 'subject', 'session', 'start', 'end', 'confidence'];

/**
 * "Label these first": for each cluster (classes, and candidates unless `classesOnly`), the `perKind`
 * windows with the highest confidence (most typical) and the `perKind` with the lowest (most
 * borderline, not repeating a typical one). Ties go to the lower window index. Set-aside clusters
 * are left out.
 */
export function labelFirstList(args: {
  labels: Int32Array;
  confidence: ArrayLike<number>;
  /** Identity per cluster index (clusterIdentities on the same curation). */
  identities: readonly ClusterIdentity[];
  perKind?: number;
  classesOnly?: boolean;
}): LabelFirstRow[] {
  const perKind = args.perKind ?? 5;
  if (!Number.isInteger(perKind) || perKind < 1) throw new Error(`labelFirstList: perKind must be an integer >= 1, got ${perKind}`);
  const members = new Map<number, number[]>();
  for (let i = 0; i < args.labels.length; i++) {
    const c = args.labels[i];
    const id = args.identities[c];
    if (!id) throw new Error(`labelFirstList: window ${i} is in cluster index ${c}, which has no identity`);
    if (id.setAside) continue;
    if (args.classesOnly && !id.className) continue;
    const m = members.get(c);
    if (m) m.push(i);
    else members.set(c, [i]);
  }
  const conf = (i: number) => (Number.isFinite(args.confidence[i]) ? args.confidence[i] : -Infinity);
  const out: LabelFirstRow[] = [];
  for (const c of [...members.keys()].sort((a, b) => a - b)) {
    const byConf = members.get(c)!.sort((a, b) => conf(b) - conf(a) || a - b);
    const typical = byConf.slice(0, perKind);
    const rest = byConf.slice(typical.length);
    const borderline = rest.reverse().sort((a, b) => conf(a) - conf(b) || a - b).slice(0, perKind);
    const className = args.identities[c].className;
    typical.forEach((w, r) => out.push({ cluster: c, className, kind: 'typical', rank: r + 1, window: w, confidence: args.confidence[w] }));
    borderline.forEach((w, r) => out.push({ cluster: c, className, kind: 'borderline', rank: r + 1, window: w, confidence: args.confidence[w] }));
  }
  return out;
}

/** The list as CSV with each window's identity columns; clusters by number and name, as on screen. */
export function labelFirstCsv(table: Table, roles: Roles, rows: readonly LabelFirstRow[], identities: readonly ClusterIdentity[]): string {
  const w = windowColumns(table, roles);
  return toCsv(LABEL_FIRST_HEADER, rows.map((r) => [
    r.className, String(identities[r.cluster].number), identities[r.cluster].name, r.kind, String(r.rank),
    w.id(r.window), w.subject(r.window), w.session(r.window), w.start(r.window), w.end(r.window),
    formatNumber(r.confidence, 4),
  ]));
}
