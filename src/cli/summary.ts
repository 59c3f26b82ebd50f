import type { AnalysisParams, AnalysisResult } from '../core/analysis.types';
import { CAUTIONS } from '../core/cautions';
import type { ClusterComposition } from '../core/export/cluster-composition';
import type { Roles } from '../core/table/roles.types';

export interface SummaryInput {
  input: { path: string; fileName: string; sha256: string; rows: number; features: number; featureNames: string[] };
  roles: Roles;
  params: AnalysisParams;
  result: AnalysisResult;
  composition: ClusterComposition[];
  version: string;
}

/**
 * The run's summary.json: enough to reproduce the run (input hash, recipe, algorithms, seed,
 * version) and to judge it (metrics, subject mix per cluster), plus the cautions. No wall-clock
 * time, so two runs with the same input and seed write the same bytes.
 */
export function buildSummary(s: SummaryInput): Record<string, unknown> {
  const { result, params } = s;
  return {
    kind: 'gleaner-cli-summary',
    version: s.version,
    input: s.input,
    roles: s.roles.map((r) => ({ column: r.name, role: r.role, evidence: r.evidence })),
    recipe: result.recipe,
    embed: result.embed,
    cluster: { ...result.cluster, seed: params.seed },
    seed: params.seed,
    metrics: { ...result.metrics, silhouetteSample: params.silhouetteSample },
    clusters: s.composition,
    cautions: CAUTIONS,
  };
}
