import type { AnalysisParams, FeatureMatrix } from '../core/analysis.types';
import { centreConfidence } from '../core/cluster/confidence';
import { OptionError } from '../core/errors';
import type { JobContext } from '../core/job';
import { clusterMeans } from '../core/pipeline/cluster-stage';
import { recipeData } from './recipe-data';
import { labelsSilhouette } from './silhouette-job';

export interface RecutJob {
  /** The run's feature matrix (before its recipe) and parameters. */
  matrix: FeatureMatrix;
  params: AnalysisParams;
  /**
   * The new cut: cluster index per analysed window. A re-cut keeps identities, so some indices
   * below the highest may have no window (a cluster merged away); they are no centre.
   */
  labels: Int32Array;
  /** Map coordinates, used when the run clustered in map space. */
  coords: Float32Array;
}

export interface RecutResult {
  /** Mean silhouette of the new cut (the run's sample size, its own seeded sample). */
  silhouette: number;
  silhouetteSampleSize: number;
  confidence: Float32Array;
  /** k × d means of the scaled features (k = highest index + 1; a row of zeros for an index without windows). */
  centroids: Float64Array;
}

/**
 * What a new cut of the tree changes besides the labels: per-window confidence (1 − d1/d2 to the
 * cluster means in the clustered space, as the run computes it), the cluster means and the mean
 * silhouette of the new cut.
 */
export async function recutJob(job: RecutJob, ctx: JobContext): Promise<RecutResult> {
  const { matrix, params, labels, coords } = job;
  ctx.progress('scaling', 0);
  const { data, n, d } = await recipeData(matrix, params);
  if (labels.length !== n) throw new OptionError('labels', labels.length, `one label per analysed window (${n})`);
  let k = 0;
  for (let i = 0; i < n; i++) if (labels[i] + 1 > k) k = labels[i] + 1;
  await ctx.checkpoint();
  ctx.progress('confidence', 0.5);
  const map = params.space === 'map';
  const x = map ? Float64Array.from(coords) : data;
  const dx = map ? 2 : d;
  const centroids = clusterMeans(data, n, d, labels, k);
  // Confidence against the centres of clusters that have windows only (an empty index has no centre).
  const live = new Int32Array(k).fill(-1);
  let m = 0;
  for (let i = 0; i < n; i++) if (live[labels[i]] < 0) live[labels[i]] = m++;
  const compact = m === k ? labels : Int32Array.from(labels, (c) => live[c]);
  const centres = m === k && !map ? centroids : clusterMeans(x, n, dx, compact, m);
  const confidence = centreConfidence(x, n, dx, centres, m);
  ctx.progress('silhouette', 0.75);
  return { confidence, centroids, ...labelsSilhouette(data, n, d, labels, params) };
}
