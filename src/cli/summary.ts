import type { AnalysisParams, AnalysisResult } from '../core/analysis.types';
import { CAUTIONS } from '../core/cautions';
import type { ColumnComposition } from '../core/composition/compose-column';
import type { LabelAgreement } from '../core/composition/label-agreement';
import type { ClusterComposition, SubjectComposition } from '../core/export/cluster-composition';
import { exportedClusterRecord, identityRecord, type ClusterIdentity } from '../core/export/run-model';
import type { StabilityResult } from '../core/stability/stability';
import type { Notice } from '../core/table/notices';
import type { Roles } from '../core/table/roles.types';
import { stabilityFields, stabilityRule } from './stability-option';

export interface SummaryInput {
  input: { path: string; fileName: string; sha256: string; rows: number; features: number; featureNames: string[] };
  roles: Roles;
  params: AnalysisParams;
  result: AnalysisResult;
  /** Subject composition per cluster (with the subject-bound verdicts). */
  composition: ClusterComposition[];
  /** The clusters' numbers, names and flags (runIdentities), one per cluster index. */
  identities: readonly ClusterIdentity[];
  /** Overall cluster–subject association and the rule used; omitted in older callers. */
  subjects?: Omit<SubjectComposition, 'clusters'>;
  /** Mix of further categorical columns (--compose), in the order given. */
  compositions?: ColumnComposition[];
  /** Agreement with a partial label column, on its labelled windows only. */
  labelAgreement?: LabelAgreement | null;
  /** Stability across subjects (--stability), when asked for. */
  stability?: StabilityResult;
  /** Automatic decisions about the input, as printed on stderr. */
  notices?: Notice[];
  version: string;
}

/** In words, for readers of summary.json; the numbers come from `rule`. */
function ruleText(rule: SubjectComposition['subjectBoundRule']): string {
  return `a cluster of at least ${rule.minWindows} windows is subject-bound when its effective number of subjects ` +
    `(exp of the entropy of its subject shares) is at most ${rule.maxEffectiveShare} times the cohort's`;
}

/** One --compose column in summary.json: the same figures as for the subject. */
function composed(c: ColumnComposition): Record<string, unknown> {
  return {
    column: c.column,
    nmi: c.nmi,
    cramersV: c.cramersV,
    chiSquare: c.chiSquare,
    cohort: c.cohort,
    rule: c.rule,
    clusters: c.clusters.map((m) => ({
      number: m.id + 1, size: m.size, top: m.top, topShare: m.topShare, values: m.values,
      effectiveValues: m.effectiveValues, entropy: m.entropy, bound: m.bound, boundReason: m.boundReason, byValue: m.byValue,
    })),
  };
}

/**
 * The run's summary.json: enough to reproduce the run (input hash, recipe, algorithms, seed,
 * version) and to judge it (metrics, subject mix per cluster with the subject-bound flag, the
 * cluster–subject association, optional further columns and partial-label agreement), plus the
 * cautions. No wall-clock time, so two runs with the same input and seed write the same bytes.
 * NaN figures (undefined, e.g. Cramér's V with one subject) are written as null.
 */
export function buildSummary(s: SummaryInput): Record<string, unknown> {
  const { result, params, subjects } = s;
  const out: Record<string, unknown> = {
    kind: 'gleaner-cli-summary',
    version: s.version,
    input: s.input,
    roles: s.roles.map((r) => ({ column: r.name, role: r.role, evidence: r.evidence })),
    notices: s.notices ?? [],
    recipe: result.recipe,
    embed: result.embed,
    cluster: { ...exportedClusterRecord(result.cluster), seed: params.seed },
    seed: params.seed,
    metrics: {
      ...result.metrics,
      silhouetteSample: params.silhouetteSample,
      ...(subjects ? { subjectNMI: subjects.subjectNMI, cramersV: subjects.cramersV, subjectChiSquare: subjects.subjectChiSquare } : {}),
    },
  };
  if (subjects) {
    out.subjectBoundRule = {
      ...subjects.subjectBoundRule,
      cohortEffectiveSubjects: subjects.cohortEffectiveSubjects,
      text: ruleText(subjects.subjectBoundRule),
    };
  }
  const { stability } = s;
  if (stability) out.stabilityRule = stabilityRule(stability);
  out.clusters = s.composition.map(({ id, ...mix }) => ({
    ...identityRecord(s.identities[id]), ...mix, ...(stability ? stabilityFields(id, stability) : {}),
  }));
  if (s.compositions && s.compositions.length > 0) out.compositions = s.compositions.map(composed);
  if (s.labelAgreement) out.labelAgreement = s.labelAgreement;
  out.cautions = CAUTIONS;
  return out;
}
