import type { AnalysisParams, ClusterChoice, ClusterSpace, EmbedChoice } from '../analysis.types';
import { LINKAGES } from '../cluster/hierarchy/merge-tree';
import { OptionError } from '../errors';
import { PARAMS } from '../params/analysis-params';
import { checkParam } from '../params/param-spec';

/** Default principal axes t-SNE and UMAP see when there are more features (common practice: 50). */
export const DEFAULT_PRE_REDUCE = 50;
/** Default number of windows above which t-SNE and UMAP sample then place. */
export const DEFAULT_SAMPLE_ABOVE = PARAMS.sampleAbove.default;
/** A tree cut must leave between 2 and this many clusters. */
export const MAX_CUT_CLUSTERS = 1000;

/** The run's choices with every default filled in and every value checked. */
export interface PipelineChoices {
  embed: EmbedChoice;
  cluster: ClusterChoice;
  space: ClusterSpace;
  preReduce: number;
  sampleAbove: number;
  quality: boolean;
}

function isInt(v: unknown): v is number {
  return typeof v === 'number' && Number.isInteger(v);
}

/**
 * Reads the pipeline choices of a parameter set (an edge: payloads come from the app, the CLI or a
 * job message). Absent choices keep the first slice's behaviour: PCA, k-means with the flat k,
 * restarts and maxIterations, clustering in feature space. Throws OptionError naming the field.
 */
export function pipelineChoices(params: AnalysisParams): PipelineChoices {
  const embed = embedChoice(params.embed ?? { method: 'pca' });
  const cluster = clusterChoice(params.cluster ?? { method: 'kmeans', k: params.k, restarts: params.restarts, maxIterations: params.maxIterations });
  const space = checkParam(PARAMS.space, params.space ?? PARAMS.space.default);
  const preReduce = params.preReduce ?? DEFAULT_PRE_REDUCE;
  if (!isInt(preReduce) || preReduce < 2) throw new OptionError('preReduce', preReduce, 'an integer of at least 2');
  const sampleAbove = checkParam(PARAMS.sampleAbove, params.sampleAbove ?? PARAMS.sampleAbove.default);
  return { embed, cluster, space, preReduce, sampleAbove, quality: params.quality === true || embed.method !== 'pca' };
}

function embedChoice(e: EmbedChoice): EmbedChoice {
  switch (e?.method) {
    case 'pca':
      return { method: 'pca' };
    case 'tsne':
      checkParam(PARAMS.perplexity, e.perplexity);
      checkParam(PARAMS.iterations, e.iterations);
      return e;
    case 'umap':
      checkParam(PARAMS.neighbors, e.neighbors);
      checkParam(PARAMS.minDist, e.minDist);
      checkParam(PARAMS.metric, e.metric);
      return e;
    default:
      return checkParam(PARAMS.embed, (e as { method?: unknown })?.method) as never;
  }
}

function clusterChoice(c: ClusterChoice): ClusterChoice {
  checkParam(PARAMS.cluster, (c as { method?: unknown })?.method);
  if (c.method === 'kmeans') {
    checkParam(PARAMS.k, c.k);
    checkParam(PARAMS.restarts, c.restarts);
    checkParam(PARAMS.maxIterations, c.maxIterations);
    return c;
  }
  if (c.method === 'hdbscan') {
    checkParam(PARAMS.minClusterSize, c.minClusterSize);
    if (c.minSamples !== undefined) checkParam(PARAMS.minSamples, c.minSamples);
    return c;
  }
  if (!(LINKAGES as readonly unknown[]).includes(c.method)) throw new OptionError('cluster', c.method, `"kmeans", a linkage (${LINKAGES.join(', ')}) or "hdbscan"`);
  const hasK = c.k !== undefined, hasH = c.cutHeight !== undefined;
  if (hasK === hasH) throw new OptionError('cluster', c.method, 'either k or cutHeight for a tree cut (not both)');
  if (hasK) checkParam(PARAMS.k, c.k);
  if (hasH) checkParam(PARAMS.cutHeight, c.cutHeight);
  return c;
}

/** The number of clusters asked for up front (k-means, or a cut into k); undefined for a height cut. */
export function requestedK(c: ClusterChoice): number | undefined {
  return c.k;
}
