import type { AnalysisParams, FeatureMatrix } from '../core/analysis.types';
import { kmeans } from '../core/cluster/kmeans';
import { relabelBySize } from '../core/cluster/relabel';
import { OptionError } from '../core/errors';
import type { JobContext } from '../core/job';
import { seededRandom } from '../core/random';
import { applyRecipe } from '../core/recipe/apply';
import { parseRecipe } from '../core/recipe/parse-recipe';
import { DEFAULT_RECIPE } from '../core/recipe/recipe.types';

export interface SplitJob {
  /** The run's feature matrix (before its recipe) and parameters (recipe, seed, restarts). */
  matrix: FeatureMatrix;
  params: AnalysisParams;
  /** Analysed-window indices of the cluster to split, ascending. */
  members: Int32Array;
  /** Parts to split into. */
  k: number;
}

/** Relative k-means tolerance, as in analyze.ts (common practice). */
const KMEANS_TOL = 1e-4;

/**
 * Re-clusters one cluster: the run's recipe on the whole matrix (so windows are scaled as they were
 * clustered), then k-means on the cluster's windows, with the run's seed and restarts. Returns one
 * part index per member (0 = the largest part), for the curation 'split' action.
 */
export async function splitCluster(job: SplitJob, ctx: JobContext): Promise<Int32Array> {
  const { matrix, params, members, k } = job;
  if (!Number.isInteger(k) || k < 2) throw new OptionError('k', k, 'an integer of at least 2');
  if (members.length < k) throw new OptionError('k', k, `at most the cluster's ${members.length} windows`);
  const steps = params.recipe === undefined ? DEFAULT_RECIPE : parseRecipe(params.recipe);
  const prepared = await applyRecipe(matrix, { subjectCodes: matrix.subjectCodes }, steps);
  const { data, n, d } = prepared;
  const m = members.length;
  const sub = new Float64Array(m * d);
  for (let s = 0; s < m; s++) {
    const w = members[s];
    if (!(w >= 0 && w < n)) throw new OptionError('members', w, `analysed-window indices from 0 to ${n - 1}`);
    sub.set(data.subarray(w * d, w * d + d), s * d);
  }
  await ctx.checkpoint();
  const km = await kmeans(sub, m, d, { k, restarts: params.restarts, maxIterations: params.maxIterations, tol: KMEANS_TOL, random: seededRandom(params.seed) }, ctx, (f) => ctx.progress('splitting', f));
  return relabelBySize(km.labels, km.centres, k, d).labels;
}
