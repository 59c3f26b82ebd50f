import type { AnalysisParams, AnalysisResult, FeatureMatrix } from '../core/analysis.types';
import { analyze } from '../core/analyze';
import type { SweepRow } from '../core/cluster/sweep';
import type { BlobHasher } from '../core/hash/blob-hash';
import { parseInput, type ParseJob, type ParseResult } from '../core/input/parse-input';
import type { JobContext } from '../core/job';
import { profileRun, type ProfileInput, type RunProfile } from '../core/profile/profile';
import { dataQuality, type DataQuality } from '../core/quality';
import { RecipeCache } from '../core/recipe/recipe-cache';
import { tableStability, type StabilityOptions, type StabilityResult, type StabilityRun } from '../core/stability/stability';
import type { Roles } from '../core/table/roles.types';
import type { Table } from '../core/table/table';
import type { JobHandler } from './host';
import { silhouetteJob, type SilhouetteJob, type SilhouetteResult } from './silhouette-job';
import { recutJob, type RecutJob, type RecutResult } from './recut-job';
import { splitCluster, type SplitJob } from './split-cluster';
import { sweepJob, type SweepJob } from './sweep-job';

export type { ParseJob, ParseResult };

export interface AnalyzeJob {
  matrix: FeatureMatrix;
  params: AnalysisParams;
  /**
   * Names the matrix (the app: file hash + column roles). Runs with the key of the previous run
   * reuse its matrix and RecipeCache, so only the recipe steps after the first changed one run again.
   */
  cacheKey?: string;
}

export interface QualityJob {
  matrix: FeatureMatrix;
  /** Name of each subject code in matrix.subjectCodes. */
  subjectNames?: string[];
}

export interface StabilityJob {
  /** The table and roles the run was made from (before its recipe dropped any window). */
  table: Table;
  roles: Roles;
  params: AnalysisParams;
  run: StabilityRun;
  options: StabilityOptions;
}

export interface JobsDeps {
  /** Lets the parse job hash a Blob on another thread (the app's worker starts a nested worker). */
  blobHasher?: BlobHasher | null;
}

/**
 * The jobs a host serves, by name. Handlers are thin: all work is in the core. The table keeps one
 * RecipeCache, for the matrix of the latest keyed run; it is replaced (and the old one freed) when
 * a run comes with another key: another file, or changed column roles.
 */
export function createJobs(deps: JobsDeps = {}) {
  const blobHasher = deps.blobHasher ?? null;
  let recipeSlot: { key: string; matrix: FeatureMatrix; cache: RecipeCache } | null = null;
  return {
    parse: (payload: ParseJob, ctx: JobContext): Promise<ParseResult> => parseInput(payload, ctx, blobHasher),
    async analyze(payload: AnalyzeJob, ctx: JobContext): Promise<AnalysisResult> {
      const { cacheKey } = payload;
      if (cacheKey === undefined) return analyze(payload.matrix, payload.params, ctx);
      if (recipeSlot?.key !== cacheKey) recipeSlot = { key: cacheKey, matrix: payload.matrix, cache: new RecipeCache() };
      return analyze(recipeSlot.matrix, payload.params, ctx, recipeSlot.cache);
    },
    /** The data-quality report of a feature matrix (the Quality view). */
    async quality(payload: QualityJob): Promise<DataQuality> {
      return dataQuality(payload.matrix, payload.matrix.subjectCodes, payload.subjectNames);
    },
    /** Composition by a column, fingerprints and label agreement of one run (the Mix and Fingerprints views). */
    async profile(payload: ProfileInput): Promise<RunProfile> {
      return profileRun(payload);
    },
    /** Re-clusters one cluster's windows (curation: split). */
    async split(payload: SplitJob, ctx: JobContext): Promise<Int32Array> {
      return splitCluster(payload, ctx);
    },
    /** k-means over a range of k with inertia, silhouette, Calinski–Harabasz and Davies–Bouldin (the sweep view). */
    async sweep(payload: SweepJob, ctx: JobContext): Promise<SweepRow[]> {
      return sweepJob(payload, ctx);
    },
    /** Each cluster's stability across subjects: the run again on resamples that leave subjects out. */
    async stability(payload: StabilityJob, ctx: JobContext): Promise<StabilityResult> {
      return tableStability(payload.table, payload.roles, payload.params, payload.run, payload.options, ctx);
    },
    /** Mean silhouette of curated labels (after a merge, split or move). */
    async silhouette(payload: SilhouetteJob, ctx: JobContext): Promise<SilhouetteResult> {
      return silhouetteJob(payload, ctx);
    },
    /** Confidence and cluster means of a new cut of the tree (the Tree view's cut line). */
    async recut(payload: RecutJob, ctx: JobContext): Promise<RecutResult> {
      return recutJob(payload, ctx);
    },
  } satisfies Record<string, JobHandler>;
}

/** The jobs every host serves, with no Blob hashing thread (the CLI's worker thread, tests). */
export const jobs = createJobs();

/** The job table's type: each job's payload and result types come from its handler. */
export type Jobs = ReturnType<typeof createJobs>;
export type JobName = keyof Jobs;
