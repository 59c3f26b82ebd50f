import type { Column } from '../table/table';

/** Who is in one cluster: the subject mix that shows whether a cluster marks behaviour or a person. */
export interface ClusterComposition {
  id: number;
  size: number;
  /** Subject with the most windows in the cluster ('' without a subject column or when empty). */
  topSubject: string;
  /** Share of the cluster's windows that belong to the top subject (0 when empty). */
  topSubjectShare: number;
  /** Number of distinct subjects with at least one window in the cluster. */
  subjects: number;
  /** exp(Shannon entropy) of the subject shares: how many subjects the cluster "really" holds. */
  effectiveSubjects: number;
  /** Windows per subject, most first (ties by subject name), for tracing subject-bound clusters. */
  bySubject: { subject: string; windows: number }[];
}

/**
 * Subject composition of each cluster. `subject` is the table's subject column (text or numeric);
 * without one, every window counts under the subject ''. Missing subject cells count under ''.
 */
export function clusterComposition(labels: Int32Array, k: number, subject: Column | undefined): ClusterComposition[] {
  const counts: Map<string, number>[] = Array.from({ length: k }, () => new Map());
  for (let i = 0; i < labels.length; i++) {
    const c = labels[i];
    if (c < 0 || c >= k) continue;
    const s = subjectText(subject, i);
    counts[c].set(s, (counts[c].get(s) ?? 0) + 1);
  }
  return counts.map((m, id) => {
    const bySubject = [...m.entries()]
      .map(([s, windows]) => ({ subject: s, windows }))
      .sort((a, b) => b.windows - a.windows || (a.subject < b.subject ? -1 : a.subject > b.subject ? 1 : 0));
    const size = bySubject.reduce((acc, e) => acc + e.windows, 0);
    let entropy = 0;
    for (const e of bySubject) {
      const p = e.windows / size;
      entropy -= p * Math.log(p);
    }
    return {
      id,
      size,
      topSubject: bySubject[0]?.subject ?? '',
      topSubjectShare: size > 0 ? bySubject[0].windows / size : 0,
      subjects: bySubject.length,
      effectiveSubjects: size > 0 ? Math.exp(entropy) : 0,
      bySubject,
    };
  });
}

function subjectText(column: Column | undefined, row: number): string {
  if (!column) return '';
  if (column.kind === 'numeric') {
    const v = column.values[row];
    return Number.isNaN(v) ? '' : String(v);
  }
  const code = column.codes[row];
  return code < 0 ? '' : column.dictionary[code];
}
