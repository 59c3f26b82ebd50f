import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams, type ClusterChoice, type ClusterSpace, type EmbedChoice } from '../../core/analysis.types';
import type { Linkage } from '../../core/cluster/hierarchy/merge-tree';
import { TSNE_DEFAULTS } from '../../core/embed/tsne/options';
import { UMAP_DEFAULTS } from '../../core/embed/umap/options';
import { OptionError } from '../../core/errors';
import type { Metric } from '../../core/neighbors/knn.types';
import { DEFAULT_SAMPLE_ABOVE } from '../../core/pipeline/choices';

/** Limits the UI accepts; the core validates again at its own edge. */
export const PARAM_LIMITS = {
  k: { min: 2, max: 50 },
  restarts: { min: 1, max: 1000 },
  seed: { min: 0, max: 2 ** 31 - 1 },
  perplexity: { min: 2, max: 200 },
  iterations: { min: 250, max: 10_000 },
  neighbors: { min: 2, max: 200 },
  minDist: { min: 0, max: 1 },
  cutHeight: { min: 0, max: 1e9 },
  sampleAbove: { min: 1000, max: 10_000_000 },
} as const;

export type EmbedMethod = EmbedChoice['method'];
export type ClusterMethod = 'kmeans' | Linkage;

/** The run parameters the user edits in the side panel (defaults shared with the CLI). */
export class RunParams {
  k = $state(DEFAULT_ANALYSIS_PARAMS.k);
  seed = $state(DEFAULT_ANALYSIS_PARAMS.seed);
  restarts = $state(DEFAULT_ANALYSIS_PARAMS.restarts);
  embed = $state<EmbedMethod>('pca');
  perplexity = $state(TSNE_DEFAULTS.perplexity);
  iterations = $state(TSNE_DEFAULTS.iterations);
  neighbors = $state<number>(UMAP_DEFAULTS.neighbors);
  minDist = $state<number>(UMAP_DEFAULTS.minDist);
  metric = $state<Metric>('euclidean');
  cluster = $state<ClusterMethod>('kmeans');
  /** For a tree: cut into k clusters, or at a height. */
  cutBy = $state<'k' | 'height'>('k');
  cutHeight = $state(10);
  space = $state<ClusterSpace>('features');
  sampleAbove = $state(DEFAULT_SAMPLE_ABOVE);

  /** The full parameter set for a run; throws OptionError naming the bad field. */
  toParams(): AnalysisParams {
    check('seed', this.seed, PARAM_LIMITS.seed);
    const params: AnalysisParams = { ...DEFAULT_ANALYSIS_PARAMS, seed: this.seed, quality: true };
    const embed = this.embedChoice();
    if (embed.method !== 'pca') {
      params.embed = embed;
      check('sample above (windows)', this.sampleAbove, PARAM_LIMITS.sampleAbove);
      params.sampleAbove = this.sampleAbove;
    }
    if (this.cluster === 'kmeans' || this.cutBy === 'k') {
      check('k (clusters)', this.k, PARAM_LIMITS.k);
      params.k = this.k;
    }
    if (this.cluster === 'kmeans') {
      check('restarts', this.restarts, PARAM_LIMITS.restarts);
      params.restarts = this.restarts;
    } else {
      params.cluster = this.clusterChoice(this.cluster);
    }
    if (this.space !== 'features') params.space = this.space;
    return params;
  }

  private embedChoice(): EmbedChoice {
    if (this.embed === 'tsne') {
      checkNumber('perplexity', this.perplexity, PARAM_LIMITS.perplexity);
      check('iterations', this.iterations, PARAM_LIMITS.iterations);
      return { method: 'tsne', perplexity: this.perplexity, iterations: this.iterations };
    }
    if (this.embed === 'umap') {
      check('neighbours', this.neighbors, PARAM_LIMITS.neighbors);
      checkNumber('min. distance', this.minDist, PARAM_LIMITS.minDist);
      return { method: 'umap', neighbors: this.neighbors, minDist: this.minDist, metric: this.metric };
    }
    return { method: 'pca' };
  }

  private clusterChoice(linkage: Linkage): ClusterChoice {
    if (this.cutBy === 'k') return { method: linkage, k: this.k };
    checkNumber('cut height', this.cutHeight, PARAM_LIMITS.cutHeight);
    return { method: linkage, cutHeight: this.cutHeight };
  }
}

function check(name: string, value: number, limits: { min: number; max: number }): void {
  if (!Number.isInteger(value) || value < limits.min || value > limits.max) {
    throw new OptionError(name, value, `a whole number from ${limits.min} to ${limits.max}`);
  }
}

function checkNumber(name: string, value: number, limits: { min: number; max: number }): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < limits.min || value > limits.max) {
    throw new OptionError(name, value, `a number from ${limits.min} to ${limits.max}`);
  }
}
