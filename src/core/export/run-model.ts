import { type BoundRule } from '../composition/bound-rule';
import { categoriesOf } from '../composition/categories';
import { composeColumn } from '../composition/compose-column';
import type { CurationState } from '../curation/curation.types';
import { initialCuration } from '../curation/initial-state';
import type { AnalysisResult } from '../analysis.types';
import type { Roles } from '../table/roles.types';
import { findColumn, type Table } from '../table/table';

/** A composition flag on one cluster: it is bound to few values of a column (subject, session, a metadata column). */
export interface ClusterFlag {
  column: string;
  role: 'subject' | 'session' | 'metadata';
  /** Short text for lists and file columns: "subject-bound", "session-bound", "site-bound". */
  text: string;
  /** The rule's reason, with its numbers. */
  reason: string;
}

/**
 * What a researcher sees of one cluster and what every export writes for it: one identity per
 * curated cluster index. The number is the index + 1 everywhere (screen, weak labels, events,
 * EDF+ annotations, label-first list, report, provenance, windows.csv, summary.json).
 */
export interface ClusterIdentity {
  /** Curated cluster index (0-based; the position in the curation's clusters). */
  index: number;
  /** The number shown and exported: index + 1. */
  number: number;
  /** Class name, else the working name, else "candidate <number>". */
  name: string;
  /** Class name once promoted ('' for a candidate and for a cluster set aside). */
  className: string;
  /** The user's working name ('' = none). */
  workingName: string;
  /** The colour the user chose ('' = the palette's colour for this index). */
  colour: string;
  setAside: boolean;
  /** Emptied by a merge or by moving every window out: no longer listed. */
  emptied: boolean;
  size: number;
  description: string;
  flags: ClusterFlag[];
}

/** Metadata columns with this many distinct values (inclusive) are judged for composition flags. */
export const FLAG_METADATA_VALUES = { min: 2, max: 50 } as const;

/** The number a cluster index is shown and exported as. */
export function clusterNumber(index: number): number {
  return index + 1;
}

/** The name shown for a cluster that has no class or working name. */
export function candidateName(index: number): string {
  return `candidate ${clusterNumber(index)}`;
}

/** "subject" → "subject-bound"; a metadata column keeps its own name ("site-bound"). */
function flagText(column: string, role: ClusterFlag['role']): string {
  return `${role === 'metadata' ? column : role}-bound`;
}

/** The columns whose composition raises flags: the subject and session columns, then categorical metadata columns. */
function flagColumns(table: Table, roles: Roles): { name: string; role: ClusterFlag['role'] }[] {
  const out: { name: string; role: ClusterFlag['role'] }[] = [];
  for (const role of ['subject', 'session'] as const) {
    const entry = roles.find((r) => r.role === role);
    if (entry && findColumn(table, entry.name)) out.push({ name: entry.name, role });
  }
  for (const r of roles) {
    if (r.role !== 'metadata') continue;
    const column = findColumn(table, r.name);
    if (!column) continue;
    const values = categoriesOf(column, table.nRows).names.length;
    if (values >= FLAG_METADATA_VALUES.min && values <= FLAG_METADATA_VALUES.max) out.push({ name: r.name, role: 'metadata' });
  }
  return out;
}

/**
 * Every cluster's identity in a curation: number, name, class, colour, set-aside, size and the
 * composition flags of the curated labels. With a table and its roles (one row per curated label),
 * each cluster is judged against the subject column, the session column and every metadata
 * column of 2–50 values by the bound rule (docs/subject-bound.md); without them no flags.
 */
export function clusterIdentities(args: {
  state: CurationState;
  table?: Table;
  roles?: Roles;
  rule?: Partial<BoundRule>;
}): ClusterIdentity[] {
  const { state } = args;
  const k = state.clusters.length;
  const sizes = new Int32Array(k);
  for (let i = 0; i < state.labels.length; i++) sizes[state.labels[i]]++;
  const flags: ClusterFlag[][] = Array.from({ length: k }, () => []);
  if (args.table && args.roles) {
    if (args.table.nRows !== state.labels.length) {
      throw new Error(`clusterIdentities: ${state.labels.length} labels for ${args.table.nRows} windows`);
    }
    for (const col of flagColumns(args.table, args.roles)) {
      const noun = col.role === 'metadata' ? col.name : col.role;
      const c = composeColumn(state.labels, k, findColumn(args.table, col.name), args.rule, noun);
      for (const m of c.clusters) {
        if (m.bound) flags[m.id].push({ column: col.name, role: col.role, text: flagText(col.name, col.role), reason: m.boundReason });
      }
    }
  }
  return state.clusters.map((note, index) => {
    const className = note.setAside ? '' : note.className;
    return {
      index,
      number: clusterNumber(index),
      name: note.className || note.name || candidateName(index),
      className,
      workingName: note.name,
      colour: note.colour,
      setAside: note.setAside,
      emptied: note.mergedInto >= 0 || sizes[index] === 0,
      size: sizes[index],
      description: note.description,
      flags: flags[index],
    };
  });
}

/** The identities of an uncurated run (the CLI's analyze): its labels as they came out. */
export function runIdentities(result: AnalysisResult, table?: Table, roles?: Roles, rule?: Partial<BoundRule>): ClusterIdentity[] {
  return clusterIdentities({ state: initialCuration(result.labels, result.cluster.k, result.cluster), table, roles, rule });
}

/** The flags of one cluster as one file cell: "subject-bound; site-bound" ('' = none). */
export function flagsCell(identity: ClusterIdentity): string {
  return identity.flags.map((f) => f.text).join('; ');
}

/**
 * The clustering record as the exports write it: the same fields, with HDBSCAN's noise cluster
 * given by its number (index + 1) like every other cluster reference in a file.
 */
export function exportedClusterRecord(c: AnalysisResult['cluster']): Record<string, unknown> {
  if (c.method === 'hdbscan' && c.noiseCluster !== null) return { ...c, noiseCluster: clusterNumber(c.noiseCluster) };
  return { ...c };
}

/** One cluster in provenance and summary files: its identity with its flags and reasons. */
export function identityRecord(id: ClusterIdentity): Record<string, unknown> {
  return {
    number: id.number,
    name: id.name,
    className: id.className,
    size: id.size,
    setAside: id.setAside,
    ...(id.emptied ? { emptied: true } : {}),
    flags: id.flags.map((f) => ({ column: f.column, flag: f.text, reason: f.reason })),
  };
}
