import type { ClusterChoice, ClusterSpace, EmbedChoice } from '../core/analysis.types';
import { LINKAGES, type Linkage } from '../core/cluster/hierarchy/merge-tree';
import { TSNE_DEFAULTS } from '../core/embed/tsne/options';
import { UMAP_DEFAULTS } from '../core/embed/umap/options';
import { OptionError } from '../core/errors';
import { DEFAULT_SAMPLE_ABOVE } from '../core/pipeline/choices';

/** The value flags of `analyze` that choose the embedding, the clustering and where to cluster. */
export const PIPELINE_FLAGS = ['embed', 'perplexity', 'iterations', 'neighbors', 'min-dist', 'metric', 'sample-above', 'cluster', 'cut-height', 'space'] as const;
export type PipelineFlag = (typeof PIPELINE_FLAGS)[number];

export const EMBED_CHOICES = ['pca', 'tsne', 'umap'] as const;
export const CLUSTER_CHOICES = ['kmeans', ...LINKAGES] as const;
export const METRIC_CHOICES = ['euclidean', 'cosine'] as const;
export const SPACE_CHOICES = ['features', 'map'] as const;

/** What the pipeline flags add to the analyze options (absent = the first slice's PCA + k-means). */
export interface PipelineOptions {
  embed?: EmbedChoice;
  /** A hierarchical clustering; k-means keeps using --k and --restarts. */
  linkage?: Linkage;
  /** With a linkage: cut at this height instead of into --k clusters. */
  cutHeight?: number;
  space?: ClusterSpace;
  sampleAbove?: number;
}

export const PIPELINE_USAGE = `  --embed <how>      the map: pca (default), tsne or umap
  --perplexity <p>   t-SNE perplexity, a number > 0 and below the number of windows (default ${TSNE_DEFAULTS.perplexity})
  --iterations <n>   t-SNE iterations, an integer >= 1 (default ${TSNE_DEFAULTS.iterations})
  --neighbors <k>    UMAP neighbourhood size, an integer >= 2 (default ${UMAP_DEFAULTS.neighbors})
  --min-dist <d>     UMAP smallest distance between points in the map, >= 0 (default ${UMAP_DEFAULTS.minDist})
  --metric <m>       UMAP distance in feature space: euclidean (default) or cosine
  --sample-above <n> t-SNE and UMAP embed a subject-stratified sample of n windows and place the
                     others from their 10 nearest sampled windows above n windows (default ${DEFAULT_SAMPLE_ABOVE});
                     windows.csv then gains a "placed" column (1 = placed)
  --cluster <how>    kmeans (default), or a tree: ward, average, complete or single linkage
  --cut-height <h>   cut the tree at this merge height instead of into --k clusters
  --space <where>    cluster in features (scaled features after the recipe, default) or map space`;

type Values = Partial<Record<string, string>>;

/** Reads and cross-checks the pipeline flags; throws OptionError (exit 2) naming the flag. */
export function pipelineOptions(values: Values): PipelineOptions {
  const out: PipelineOptions = {};
  const embed = choice('embed', values.embed, EMBED_CHOICES) ?? 'pca';
  only(values, ['perplexity', 'iterations'], embed === 'tsne', '--embed tsne');
  only(values, ['neighbors', 'min-dist', 'metric'], embed === 'umap', '--embed umap');
  only(values, ['sample-above'], embed !== 'pca', '--embed tsne or umap');
  if (embed === 'tsne') {
    out.embed = {
      method: 'tsne',
      perplexity: number('perplexity', values.perplexity, TSNE_DEFAULTS.perplexity, 0, false),
      iterations: integer('iterations', values.iterations, TSNE_DEFAULTS.iterations, 1),
    };
  } else if (embed === 'umap') {
    out.embed = {
      method: 'umap',
      neighbors: integer('neighbors', values.neighbors, UMAP_DEFAULTS.neighbors, 2),
      minDist: number('min-dist', values['min-dist'], UMAP_DEFAULTS.minDist, 0, true),
      metric: choice('metric', values.metric, METRIC_CHOICES) ?? 'euclidean',
    };
  }
  if (values['sample-above'] !== undefined) out.sampleAbove = integer('sample-above', values['sample-above'], DEFAULT_SAMPLE_ABOVE, 100);
  const cluster = choice('cluster', values.cluster, CLUSTER_CHOICES) ?? 'kmeans';
  if (cluster !== 'kmeans') out.linkage = cluster;
  only(values, ['cut-height'], cluster !== 'kmeans', '--cluster ward, average, complete or single');
  if (cluster !== 'kmeans' && values.restarts !== undefined) throw new OptionError('--restarts', values.restarts, 'no --restarts with a tree (they apply to --cluster kmeans)');
  if (values['cut-height'] !== undefined) {
    if (values.k !== undefined) throw new OptionError('--cut-height', values['cut-height'], 'either --k or --cut-height, not both');
    out.cutHeight = number('cut-height', values['cut-height'], 0, 0, true);
  }
  const space = choice('space', values.space, SPACE_CHOICES);
  if (space !== undefined) out.space = space;
  return out;
}

/** The cluster choice of a run from the options (k-means uses --k and --restarts). */
export function clusterChoiceOf(p: PipelineOptions, k: number, restarts: number, maxIterations: number): ClusterChoice {
  if (!p.linkage) return { method: 'kmeans', k, restarts, maxIterations };
  return p.cutHeight !== undefined ? { method: p.linkage, cutHeight: p.cutHeight } : { method: p.linkage, k };
}

function only(values: Values, flags: string[], allowed: boolean, needs: string): void {
  if (allowed) return;
  for (const f of flags) if (values[f] !== undefined) throw new OptionError(`--${f}`, values[f], `no --${f} without ${needs}`);
}

function choice<T extends string>(name: string, text: string | undefined, allowed: readonly T[]): T | undefined {
  if (text === undefined) return undefined;
  if (!(allowed as readonly string[]).includes(text)) throw new OptionError(`--${name}`, text, `one of ${allowed.join(', ')}`);
  return text as T;
}

function integer(name: string, text: string | undefined, fallback: number, min: number): number {
  if (text === undefined) return fallback;
  const value = /^[+]?\d+$/.test(text) ? Number(text) : NaN;
  if (!Number.isSafeInteger(value) || value < min) throw new OptionError(`--${name}`, text, `an integer >= ${min}`);
  return value;
}

function number(name: string, text: string | undefined, fallback: number, min: number, inclusive: boolean): number {
  if (text === undefined) return fallback;
  const value = /^[+]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text) ? Number(text) : NaN;
  if (!Number.isFinite(value) || value < min || (!inclusive && value === min)) {
    throw new OptionError(`--${name}`, text, `a number ${inclusive ? '>=' : '>'} ${min}`);
  }
  return value;
}

/**
 * The AnalysisParams fields the pipeline flags set, checked against the study's size (n windows)
 * before the long run. Nothing is added for the defaults, so a default run's params are unchanged.
 */
export function pipelineParams(
  p: PipelineOptions, n: number, kmeans: { k: number; restarts: number; maxIterations: number },
): { embed?: EmbedChoice; cluster?: ClusterChoice; space?: ClusterSpace; sampleAbove?: number } {
  const out: ReturnType<typeof pipelineParams> = {};
  if (p.embed && p.embed.method !== 'pca') {
    const m = Math.min(n, p.sampleAbove ?? DEFAULT_SAMPLE_ABOVE);
    if (p.embed.method === 'tsne' && p.embed.perplexity >= m) {
      throw new OptionError('--perplexity', p.embed.perplexity, `less than the number of windows embedded (${m})`);
    }
    if (p.embed.method === 'umap' && p.embed.neighbors > m - 1) {
      throw new OptionError('--neighbors', p.embed.neighbors, `at most the number of windows embedded minus one (${m - 1})`);
    }
    out.embed = p.embed;
  }
  if (p.sampleAbove !== undefined) out.sampleAbove = p.sampleAbove;
  if (p.linkage) out.cluster = clusterChoiceOf(p, kmeans.k, kmeans.restarts, kmeans.maxIterations);
  if (p.space !== undefined && p.space !== 'features') out.space = p.space;
  return out;
}
