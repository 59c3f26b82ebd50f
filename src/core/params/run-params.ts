import type { AnalysisParams, ClusterChoice, EmbedChoice } from '../analysis.types';
import { OptionError } from '../errors';
import type { Metric } from '../neighbors/knn.types';
import { neighborsLimit, PARAMS, perplexityLimit, type ClusterMethod, type ClusterSpace, type EmbedMethod } from './analysis-params';

/** The run parameters as flat values, as a user sets them (flags, the run panel). */
export interface RunValues {
  k: number;
  seed: number;
  restarts: number;
  embed: EmbedMethod;
  perplexity: number;
  iterations: number;
  neighbors: number;
  minDist: number;
  metric: Metric;
  /** Absent: the core's default threshold. */
  sampleAbove?: number;
  cluster: ClusterMethod;
  /** For a tree: cut at this height; absent = cut into k clusters. */
  cutHeight?: number;
  /** HDBSCAN's minimum cluster size (used with cluster 'hdbscan'). */
  minClusterSize: number;
  /** HDBSCAN's minimum samples; absent = the minimum cluster size. */
  minSamples?: number;
  space: ClusterSpace;
}

/** The defaults the schema gives. */
export const DEFAULT_RUN_VALUES: RunValues = {
  k: PARAMS.k.default, seed: PARAMS.seed.default, restarts: PARAMS.restarts.default, embed: PARAMS.embed.default,
  perplexity: PARAMS.perplexity.default, iterations: PARAMS.iterations.default, neighbors: PARAMS.neighbors.default,
  minDist: PARAMS.minDist.default, metric: PARAMS.metric.default, cluster: PARAMS.cluster.default, space: PARAMS.space.default,
  minClusterSize: PARAMS.minClusterSize.default,
};

/** The map the values ask for. */
export function embedChoiceOf(v: RunValues): EmbedChoice {
  if (v.embed === 'tsne') return { method: 'tsne', perplexity: v.perplexity, iterations: v.iterations };
  if (v.embed === 'umap') return { method: 'umap', neighbors: v.neighbors, minDist: v.minDist, metric: v.metric };
  return { method: 'pca' };
}

/** The clusters the values ask for: k-means with k and restarts, or a tree cut into k or at a height. */
export function clusterChoiceOf(v: RunValues): ClusterChoice {
  if (v.cluster === 'kmeans') return { method: 'kmeans', k: v.k, restarts: v.restarts, maxIterations: PARAMS.maxIterations.default };
  if (v.cluster === 'hdbscan') return { method: 'hdbscan', minClusterSize: v.minClusterSize, ...(v.minSamples !== undefined ? { minSamples: v.minSamples } : {}) };
  return v.cutHeight !== undefined ? { method: v.cluster, cutHeight: v.cutHeight } : { method: v.cluster, k: v.k };
}

/**
 * The AnalysisParams of a run from flat values: the one place the CLI (`analyze`) and the app's run
 * panel turn parameters into a run. Fields the run does not use keep their defaults, and choices
 * that are the first slice's (PCA, k-means, feature space) are left out, so a default run's
 * parameters stay as they always were. `quality`: measure the map's quality for PCA too (the app).
 */
export function runParams(v: RunValues, how: { quality?: boolean } = {}): AnalysisParams {
  const kmeans = v.cluster === 'kmeans';
  const params: AnalysisParams = {
    k: kmeans || (v.cutHeight === undefined && v.cluster !== 'hdbscan') ? v.k : PARAMS.k.default,
    seed: v.seed,
    restarts: kmeans ? v.restarts : PARAMS.restarts.default,
    maxIterations: PARAMS.maxIterations.default,
    silhouetteSample: PARAMS.silhouetteSample.default,
    ...(how.quality ? { quality: true } : {}),
  };
  if (v.embed !== 'pca') {
    params.embed = embedChoiceOf(v);
    if (v.sampleAbove !== undefined) params.sampleAbove = v.sampleAbove;
  }
  if (!kmeans) params.cluster = clusterChoiceOf(v);
  if (v.space !== 'features') params.space = v.space;
  return params;
}

/**
 * Checks the parameters against the number of windows before the long run: the t-SNE perplexity
 * and the UMAP neighbourhood against the windows embedded (the sample, above the threshold).
 * `flag` names the parameter as the caller's user knows it.
 */
export function checkRunFits(params: AnalysisParams, n: number, flag: (name: 'perplexity' | 'neighbors') => string): void {
  const e = params.embed;
  if (!e || e.method === 'pca') return;
  const m = Math.min(n, params.sampleAbove ?? PARAMS.sampleAbove.default);
  if (e.method === 'tsne') {
    const limit = perplexityLimit(m);
    if (!limit.fits(e.perplexity)) throw new OptionError(flag('perplexity'), e.perplexity, limit.expected);
  } else {
    const limit = neighborsLimit(m);
    if (!limit.fits(e.neighbors)) throw new OptionError(flag('neighbors'), e.neighbors, limit.expected);
  }
}
