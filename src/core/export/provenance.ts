import type { AnalysisParams, AnalysisResult } from '../analysis.types';
import { CAUTIONS } from '../cautions';
import { DEFAULT_RECIPE } from '../recipe/recipe.types';
import type { Roles } from '../table/roles.types';
import { exportedClusterRecord, identityRecord, type ClusterIdentity } from './run-model';

export const PROVENANCE_SCHEMA_VERSION = 1;

export interface ProvenanceInput {
  input: {
    /** File name (no directories) of the windows table. */
    fileName: string;
    /** Hex SHA-256 of the file's bytes, computed by the caller. */
    sha256: string;
    rows: number;
    /** Number of feature columns used. */
    features: number;
  };
  roles: Roles;
  params: AnalysisParams;
  result: AnalysisResult;
  /** The curated clusters (clusterIdentities): number, name, class, size, flags. */
  identities: readonly ClusterIdentity[];
  appVersion: string;
  /** ISO 8601 time of the export, supplied by the caller (the core has no clock). */
  createdAt: string;
}

/**
 * What a weak-label export was made from and how: the input file's hash, the column roles, the
 * recipe as applied, the embedding and clustering algorithms with their parameters and seed, the
 * app version, the export time and the cautions. Plain JSON-ready data.
 */
export function buildProvenance(p: ProvenanceInput): Record<string, unknown> {
  const { result, params } = p;
  return {
    kind: 'gleaner-weak-label-provenance',
    schemaVersion: PROVENANCE_SCHEMA_VERSION,
    app: { name: 'Gleaner', version: p.appVersion },
    createdAt: p.createdAt,
    input: { ...p.input },
    roles: p.roles.map((r) => ({ column: r.name, role: r.role })),
    recipe: result.recipe.map((s) => ({ step: s.step, params: s.params, effect: s.effect })),
    // The recipe as the user wrote it ({ version, steps }), which `gleaner analyze --recipe` reads back.
    recipeSpec: params.recipe ?? DEFAULT_RECIPE,
    embed: { ...result.embed, seed: params.seed },
    cluster: { space: 'features', ...exportedClusterRecord(result.cluster), seed: params.seed, silhouetteSample: params.silhouetteSample },
    ...(result.placed ? { placedWindows: result.placed.reduce((s, v) => s + v, 0) } : {}),
    seed: params.seed,
    metrics: { ...result.metrics },
    clusters: p.identities.map(identityRecord),
    cautions: [...CAUTIONS],
  };
}
