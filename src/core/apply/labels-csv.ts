import { formatNumber, toCsv } from '../export/csv';
import { windowColumns } from '../export/window-columns';
import type { Roles } from '../table/roles.types';
import type { Table } from '../table/table';
import { clusterIdentity } from './cluster-name';
import type { StudyModel } from './study-model';

export const APPLY_LABELS_HEADER = [
  'window_id', 'subject', 'session', 'start', 'end', 'cluster', 'cluster_name', 'class_name', 'set_aside', 'confidence',
];

/**
 * One input's labels: per labelled window (input row `rows[i]`) its identity columns (through the
 * study's roles; '' where the input has no such column; without an id column the id is the row's
 * 0-based number in this input), then its curated cluster (index + 1), the cluster's name, its class
 * name ('' while a candidate, and when set aside, as in the weak labels), set_aside (1/0) and the
 * confidence (4 significant digits). Deterministic text: same model and input, same bytes.
 */
export function applyLabelsCsv(args: { table: Table; roles: Roles; model: StudyModel; rows: Int32Array; labels: Int32Array; confidence: Float32Array }): string {
  const { table, roles, model, rows, labels, confidence } = args;
  const w = windowColumns(table, roles);
  const out: string[][] = new Array(rows.length);
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    const g = labels[i];
    const note = model.notes[g];
    const { number, name } = clusterIdentity(g, note);
    const aside = note?.setAside === true;
    out[i] = [w.id(r), w.subject(r), w.session(r), w.start(r), w.end(r), String(number), name, aside ? '' : note?.className ?? '', aside ? '1' : '0', formatNumber(confidence[i], 4)];
  }
  return toCsv(APPLY_LABELS_HEADER, out);
}
