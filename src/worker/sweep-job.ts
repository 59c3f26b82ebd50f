import type { AnalysisParams, FeatureMatrix } from '../core/analysis.types';
import { sweepK, type SweepRow } from '../core/cluster/sweep';
import type { JobContext } from '../core/job';
import { recipeData } from './recipe-data';

export interface SweepJob {
  /** The run's feature matrix (before its recipe) and parameters (recipe, seed, restarts, silhouette sample). */
  matrix: FeatureMatrix;
  params: AnalysisParams;
  kMin: number;
  kMax: number;
}

/** k-means for every k in kMin..kMax on the run's scaled features, with the four quality figures per k. */
export async function sweepJob(job: SweepJob, ctx: JobContext): Promise<SweepRow[]> {
  const { matrix, params, kMin, kMax } = job;
  ctx.progress('scaling', 0);
  const { data, n, d } = await recipeData(matrix, params);
  await ctx.checkpoint();
  return sweepK(data, n, d, { kMin, kMax, seed: params.seed, restarts: params.restarts, silhouetteSample: params.silhouetteSample, maxIterations: params.maxIterations }, ctx);
}
