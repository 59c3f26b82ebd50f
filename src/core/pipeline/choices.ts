import type { AnalysisParams, ClusterChoice, ClusterSpace, EmbedChoice } from '../analysis.types';
import { LINKAGES } from '../cluster/hierarchy/merge-tree';
import { OptionError } from '../errors';

/** Default principal axes t-SNE and UMAP see when there are more features (common practice: 50). */
export const DEFAULT_PRE_REDUCE = 50;
/** Default number of windows above which t-SNE and UMAP sample then place. */
export const DEFAULT_SAMPLE_ABOVE = 50_000;
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
function isNum(v: unknown): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

/**
 * Reads the pipeline choices of a parameter set (an edge: payloads come from the app, the CLI or a
 * job message). Absent choices keep the first slice's behaviour: PCA, k-means with the flat k,
 * restarts and maxIterations, clustering in feature space. Throws OptionError naming the field.
 */
export function pipelineChoices(params: AnalysisParams): PipelineChoices {
  const embed = embedChoice(params.embed ?? { method: 'pca' });
  const cluster = clusterChoice(params.cluster ?? { method: 'kmeans', k: params.k, restarts: params.restarts, maxIterations: params.maxIterations });
  const space = params.space ?? 'features';
  if (space !== 'features' && space !== 'map') throw new OptionError('space', space, '"features" or "map"');
  const preReduce = params.preReduce ?? DEFAULT_PRE_REDUCE;
  if (!isInt(preReduce) || preReduce < 2) throw new OptionError('preReduce', preReduce, 'an integer of at least 2');
  const sampleAbove = params.sampleAbove ?? DEFAULT_SAMPLE_ABOVE;
  if (!isInt(sampleAbove) || sampleAbove < 100) throw new OptionError('sampleAbove', sampleAbove, 'an integer of at least 100');
  return { embed, cluster, space, preReduce, sampleAbove, quality: params.quality === true || embed.method !== 'pca' };
}

function embedChoice(e: EmbedChoice): EmbedChoice {
  switch (e?.method) {
    case 'pca':
      return { method: 'pca' };
    case 'tsne':
      if (!isNum(e.perplexity) || e.perplexity <= 0) throw new OptionError('perplexity', e.perplexity, 'a number above 0');
      if (!isInt(e.iterations) || e.iterations < 1) throw new OptionError('iterations', e.iterations, 'an integer of at least 1');
      return e;
    case 'umap':
      if (!isInt(e.neighbors) || e.neighbors < 2) throw new OptionError('neighbors', e.neighbors, 'an integer of at least 2');
      if (!isNum(e.minDist) || e.minDist < 0) throw new OptionError('minDist', e.minDist, 'a number of at least 0');
      if (e.metric !== 'euclidean' && e.metric !== 'cosine') throw new OptionError('metric', e.metric, '"euclidean" or "cosine"');
      return e;
    default:
      throw new OptionError('embed', (e as { method?: unknown })?.method, '"pca", "tsne" or "umap"');
  }
}

function clusterChoice(c: ClusterChoice): ClusterChoice {
  if (c?.method === 'kmeans') {
    if (!isInt(c.k) || c.k < 2) throw new OptionError('k', c.k, 'an integer of at least 2');
    if (!isInt(c.restarts) || c.restarts < 1) throw new OptionError('restarts', c.restarts, 'an integer of at least 1');
    if (!isInt(c.maxIterations) || c.maxIterations < 1) throw new OptionError('maxIterations', c.maxIterations, 'an integer of at least 1');
    return c;
  }
  if (!(LINKAGES as readonly unknown[]).includes(c?.method)) {
    throw new OptionError('cluster', (c as { method?: unknown })?.method, `"kmeans" or a linkage (${LINKAGES.join(', ')})`);
  }
  const hasK = c.k !== undefined, hasH = c.cutHeight !== undefined;
  if (hasK === hasH) throw new OptionError('cluster', c.method, 'either k or cutHeight for a tree cut (not both)');
  if (hasK && (!isInt(c.k) || c.k < 2)) throw new OptionError('k', c.k, 'an integer of at least 2');
  if (hasH && (!isNum(c.cutHeight) || c.cutHeight < 0)) throw new OptionError('cutHeight', c.cutHeight, 'a number of at least 0');
  return c;
}

/** The number of clusters asked for up front (k-means, or a cut into k); undefined for a height cut. */
export function requestedK(c: ClusterChoice): number | undefined {
  return c.k;
}
