import { OptionError } from '../errors';
import type { Roles } from '../table/roles.types';
import { cellText, type Column, type Table } from '../table/table';
import type { ClusterIdentity } from './run-model';
import { columnWithRole } from './window-columns';

/** Consecutive windows of one class (or candidate) of one subject and session, merged. */
export interface Segment {
  subject: string;
  session: string;
  /** Seconds after `origin` (the first window of this subject and session). */
  onset: number;
  duration: number;
  /** Start time of the subject's and session's first window, in the table's seconds. */
  origin: number;
  /** The cluster's shown name: class name, else working name, else "candidate <number>". */
  trialType: string;
  /** The cluster's number (index + 1, as on screen). */
  cluster: number;
  /** Class name ('' for a candidate). */
  className: string;
  windows: number;
  meanConfidence: number;
}

export interface SegmentOptions {
  /** Also merge windows of clusters not promoted to a class (trial type = their shown name); default true. */
  includeCandidates?: boolean;
  /** Largest gap in seconds between one window's end and the next one's start that still joins them; default 0. */
  maxGap?: number;
}

/** Tolerance for comparing window times (floating-point sums of start + duration); common practice. */
const TIME_EPS = 1e-6;

/** Start and end in seconds of every window; throws when the table has no numeric start column. */
export function windowTimes(table: Table, roles: Roles): { start: Float64Array; end: Float64Array } {
  const start = columnWithRole(table, roles, 'start');
  if (!start || start.kind !== 'numeric') {
    throw new OptionError('events', start?.name ?? 'no start column', 'a numeric or ISO 8601 start column (role "start") to place event segments in time');
  }
  const endCol = columnWithRole(table, roles, 'end');
  const durCol = columnWithRole(table, roles, 'duration');
  const s = seconds(start);
  let e: Float64Array;
  if (endCol?.kind === 'numeric') e = seconds(endCol);
  else if (durCol?.kind === 'numeric') e = Float64Array.from(seconds(durCol), (d, i) => s[i] + d);
  else throw new OptionError('events', 'no end or duration column', 'an end column or a duration column (role "end" or "duration")');
  return { start: s, end: e };
}

function seconds(c: Column & { kind: 'numeric' }): Float64Array {
  const scale = c.time === 'milliseconds' ? 1e-3 : 1;
  return Float64Array.from(c.values, (v) => v * scale);
}

/**
 * Event segments: per subject and session (in text order), windows sorted by start; consecutive
 * windows with the same class (or candidate) whose gap is at most `maxGap` merge into one segment.
 * Windows in a set-aside cluster, and windows with a missing time, are left out and break segments.
 */
export function eventSegments(args: {
  table: Table;
  roles: Roles;
  /** Cluster per window (curated labels), one per table row. */
  labels: Int32Array;
  confidence: ArrayLike<number>;
  /** Identity per cluster index (clusterIdentities on the same curation). */
  identities: readonly ClusterIdentity[];
  options?: SegmentOptions;
}): Segment[] {
  const { table, roles, labels, confidence, identities } = args;
  const includeCandidates = args.options?.includeCandidates ?? true;
  const maxGap = args.options?.maxGap ?? 0;
  if (!(maxGap >= 0)) throw new OptionError('maxGap', maxGap, 'seconds >= 0');
  const { start, end } = windowTimes(table, roles);
  const subjectCol = columnWithRole(table, roles, 'subject');
  const sessionCol = columnWithRole(table, roles, 'session');
  const groups = new Map<string, { subject: string; session: string; rows: number[] }>();
  for (let i = 0; i < table.nRows; i++) {
    if (!Number.isFinite(start[i]) || !Number.isFinite(end[i])) continue;
    const subject = subjectCol ? cellText(subjectCol, i) : '';
    const session = sessionCol ? cellText(sessionCol, i) : '';
    const key = JSON.stringify([subject, session]);
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { subject, session, rows: [] }));
    g.rows.push(i);
  }
  const keys = [...groups.keys()].sort();
  const out: Segment[] = [];
  for (const key of keys) {
    const g = groups.get(key)!;
    g.rows.sort((a, b) => start[a] - start[b] || a - b);
    const origin = start[g.rows[0]];
    let open: { first: number; end: number; cluster: number; sum: number; n: number } | null = null;
    const close = () => {
      if (!open) return;
      const id = identities[open.cluster];
      out.push({
        subject: g.subject, session: g.session, origin,
        onset: start[open.first] - origin,
        duration: open.end - start[open.first],
        trialType: id.name,
        cluster: id.number, className: id.className,
        windows: open.n, meanConfidence: open.sum / open.n,
      });
      open = null;
    };
    for (const i of g.rows) {
      const c = labels[i];
      const id = identities[c];
      if (!id) throw new Error(`eventSegments: window ${i} is in cluster index ${c}, which has no identity`);
      const kept = !id.setAside && (includeCandidates || id.className !== '');
      if (open && (!kept || c !== open.cluster || start[i] > open.end + maxGap + TIME_EPS)) close();
      if (!kept) continue;
      if (open) {
        open.end = Math.max(open.end, end[i]);
        open.sum += confidence[i];
        open.n++;
      } else {
        open = { first: i, end: end[i], cluster: c, sum: confidence[i], n: 1 };
      }
    }
    close();
  }
  return out;
}
