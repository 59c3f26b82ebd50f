import type { AnalysisParams, FeatureMatrix } from '../core/analysis.types';
import { OptionError } from '../core/errors';
import type { JobContext } from '../core/job';
import { sampleIndices } from '../core/metrics/sample';
import { silhouetteOfSample } from '../core/metrics/silhouette';
import { seededRandom } from '../core/random';
import { recipeData } from './recipe-data';

export interface SilhouetteJob {
  /** The run's feature matrix (before its recipe) and parameters (recipe, seed, silhouette sample). */
  matrix: FeatureMatrix;
  params: AnalysisParams;
  /** Cluster per analysed window (curated, or a new cut); indices may leave gaps (emptied clusters). */
  labels: Int32Array;
}

export interface SilhouetteResult {
  silhouette: number;
  silhouetteSampleSize: number;
}

/**
 * Mean silhouette of labels other than the run's own (after curation or a new cut), on the scaled
 * features: a seeded sample of `params.silhouetteSample` windows drawn from the run's seed (its own
 * stream, so the figure depends only on the run and the labels).
 */
export function labelsSilhouette(data: Float64Array, n: number, d: number, labels: Int32Array, params: AnalysisParams): SilhouetteResult {
  if (labels.length !== n) throw new OptionError('labels', labels.length, `one label per analysed window (${n})`);
  const sample = sampleIndices(n, params.silhouetteSample, seededRandom(params.seed));
  return { silhouette: silhouetteOfSample(data, d, sample, labels), silhouetteSampleSize: sample.length };
}

export async function silhouetteJob(job: SilhouetteJob, ctx: JobContext): Promise<SilhouetteResult> {
  ctx.progress('scaling', 0);
  const { data, n, d } = await recipeData(job.matrix, job.params);
  await ctx.checkpoint();
  ctx.progress('silhouette', 0.5);
  return labelsSilhouette(data, n, d, job.labels, job.params);
}
