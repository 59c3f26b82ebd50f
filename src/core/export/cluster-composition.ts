import { boundRule, type BoundRule } from '../composition/bound-rule';
import { composeColumn, type ColumnComposition } from '../composition/compose-column';
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
  /** Shannon entropy of the subject shares / ln(subjects in the table): 1 = spread evenly over all. */
  subjectEntropy: number;
  /** Flagged by the subject-bound rule (see docs/subject-bound.md). */
  subjectBound: boolean;
  /** Why the cluster was or was not flagged, with the numbers the rule used. */
  subjectBoundReason: string;
  /** Windows per subject, most first (ties by subject name), for tracing subject-bound clusters. */
  bySubject: { subject: string; windows: number }[];
}

/** The whole-table view of clusters against subjects, for summaries and the Mix view. */
export interface SubjectComposition {
  clusters: ClusterComposition[];
  /** NMI between clusters and subjects (arithmetic-mean normalization): 0 = clusters ignore subjects. */
  subjectNMI: number;
  /** Cramér's V between clusters and subjects (NaN, written null, with one subject or one cluster). */
  cramersV: number;
  subjectChiSquare: ColumnComposition['chiSquare'];
  /** exp(entropy) of the subjects over all windows: the reference the subject-bound rule uses. */
  cohortEffectiveSubjects: number;
  subjectBoundRule: BoundRule;
}

/**
 * Subject composition of each cluster. `subject` is the table's subject column (text or numeric);
 * without one, every window counts under the subject ''. Missing subject cells count under ''.
 */
export function clusterComposition(
  labels: Int32Array, k: number, subject: Column | undefined, rule: Partial<BoundRule> = {},
): ClusterComposition[] {
  return subjectComposition(labels, k, subject, rule).clusters;
}

/** Per-cluster subject composition plus the overall cluster–subject association. */
export function subjectComposition(
  labels: Int32Array, k: number, subject: Column | undefined, rule: Partial<BoundRule> = {},
): SubjectComposition {
  const c = composeColumn(labels, k, subject, boundRule(rule), 'subject');
  return {
    clusters: c.clusters.map((m) => ({
      id: m.id,
      size: m.size,
      topSubject: m.top,
      topSubjectShare: m.topShare,
      subjects: m.values,
      effectiveSubjects: m.effectiveValues,
      subjectEntropy: m.entropy,
      subjectBound: m.bound,
      subjectBoundReason: m.boundReason,
      bySubject: m.byValue.map((e) => ({ subject: e.value, windows: e.windows })),
    })),
    subjectNMI: c.nmi,
    cramersV: c.cramersV,
    subjectChiSquare: c.chiSquare,
    cohortEffectiveSubjects: c.cohort.effectiveValues,
    subjectBoundRule: c.rule,
  };
}
