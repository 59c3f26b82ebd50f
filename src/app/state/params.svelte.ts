import type { AnalysisParams } from '../../core/analysis.types';
import { checkParam, PARAMS, runParams, type ClusterMethod, type ClusterSpace, type EmbedMethod, type ParamSpec, type RunValues } from '../../core/params';
import type { Metric } from '../../core/neighbors/knn.types';

export type { ClusterMethod, EmbedMethod };

type NumberField = 'seed' | 'perplexity' | 'iterations' | 'neighbors' | 'minDist' | 'sampleAbove' | 'k' | 'restarts' | 'cutHeight' | 'minClusterSize' | 'minSamples';

/** The run parameters the user edits in the side panel; defaults, limits and labels from the core's schema. */
export class RunParams {
  k = $state(PARAMS.k.default);
  seed = $state(PARAMS.seed.default);
  restarts = $state(PARAMS.restarts.default);
  embed = $state<EmbedMethod>(PARAMS.embed.default);
  perplexity = $state(PARAMS.perplexity.default);
  iterations = $state(PARAMS.iterations.default);
  neighbors = $state<number>(PARAMS.neighbors.default);
  minDist = $state<number>(PARAMS.minDist.default);
  metric = $state<Metric>(PARAMS.metric.default);
  cluster = $state<ClusterMethod>(PARAMS.cluster.default);
  /** For a tree: cut into k clusters, or at a height. */
  cutBy = $state<'k' | 'height'>('k');
  cutHeight = $state(PARAMS.cutHeight.default);
  /** HDBSCAN: fewest windows per cluster, and the windows that make a neighbourhood dense (the same by default). */
  minClusterSize = $state(PARAMS.minClusterSize.default);
  minSamples = $state(PARAMS.minSamples.default);
  space = $state<ClusterSpace>(PARAMS.space.default);
  sampleAbove = $state(PARAMS.sampleAbove.default);

  /** The full parameter set for a run (the core's runParams); throws OptionError naming the field by its panel label. */
  toParams(): AnalysisParams {
    const tsne = this.embed === 'tsne', umap = this.embed === 'umap', density = this.cluster === 'hdbscan';
    const tree = this.cluster !== 'kmeans' && !density;
    const used: [NumberField, boolean][] = [
      ['seed', true], ['perplexity', tsne], ['iterations', tsne], ['neighbors', umap], ['minDist', umap],
      ['sampleAbove', tsne || umap], ['k', !density && (!tree || this.cutBy === 'k')], ['restarts', !tree && !density], ['cutHeight', tree && this.cutBy === 'height'],
      ['minClusterSize', density], ['minSamples', density],
    ];
    for (const [name, use] of used) {
      const spec: ParamSpec = PARAMS[name];
      if (use) checkParam(spec, this[name], { range: 'panel', shownAs: spec.label });
    }
    const values: RunValues = {
      k: this.k, seed: this.seed, restarts: this.restarts, embed: this.embed, perplexity: this.perplexity, iterations: this.iterations,
      neighbors: this.neighbors, minDist: this.minDist, metric: this.metric, sampleAbove: this.sampleAbove, cluster: this.cluster,
      cutHeight: tree && this.cutBy === 'height' ? this.cutHeight : undefined, space: this.space,
      minClusterSize: this.minClusterSize, minSamples: density && this.minSamples !== this.minClusterSize ? this.minSamples : undefined,
    };
    return runParams(values, { quality: true });
  }
}
