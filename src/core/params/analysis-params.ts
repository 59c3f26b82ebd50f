import type { Linkage } from '../cluster/hierarchy/merge-tree';
import type { Metric } from '../neighbors/knn.types';
import type { ParamSpec } from './param-spec';

/** The map's method (EmbedChoice['method'] of analysis.types.ts). */
export type EmbedMethod = 'pca' | 'tsne' | 'umap';
/** Where to cluster: the scaled feature space after the recipe (default) or the 2-D map. */
export type ClusterSpace = 'features' | 'map';
/** k-means, a tree with one of the linkages of cluster/hierarchy/merge-tree.ts (a test keeps the lists equal), or HDBSCAN. */
export type ClusterMethod = 'kmeans' | Linkage | 'hdbscan';

/**
 * The parameters of one analysis run (the map, the clusters, the seed), each defined once. The
 * CLI's `analyze` and `sweep` flags, the app's run panel and the core's checks read them.
 */
export const PARAMS = {
  k: {
    name: 'k', flag: 'k', meta: '<k>', label: 'Clusters (k)', kind: 'integer', min: 2, default: 8,
    help: ['number of clusters, an integer >= 2 (default {default})'], panel: { min: 2, max: 50 },
  } satisfies ParamSpec<number>,
  seed: {
    name: 'seed', flag: 'seed', meta: '<n>', label: 'Seed', kind: 'integer', min: 0, max: 0xffffffff, default: 1,
    help: ['seed for every random step, an integer >= 0 (default {default})'], panel: { min: 0, max: 2 ** 31 - 1 },
  } satisfies ParamSpec<number>,
  restarts: {
    name: 'restarts', flag: 'restarts', meta: '<n>', label: 'Restarts', kind: 'integer', min: 1, default: 10,
    help: ['k-means restarts, an integer >= 1 (default {default})'], panel: { min: 1, max: 1000 },
  } satisfies ParamSpec<number>,
  /** k-means iteration cap per restart (no flag yet). */
  maxIterations: {
    name: 'maxIterations', flag: 'max-iterations', meta: '<n>', kind: 'integer', min: 1, default: 300,
    help: ['k-means iterations per restart at most (default {default})'],
  } satisfies ParamSpec<number>,
  silhouetteSample: {
    name: 'silhouetteSample', flag: 'silhouette-sample', meta: '<n>', kind: 'integer', min: 2, default: 2000,
    help: ['windows in the silhouette sample (default {default})'],
  } satisfies ParamSpec<number>,
  embed: {
    name: 'embed', flag: 'embed', meta: '<how>', label: 'Embedding', kind: 'choice', default: 'pca' as EmbedMethod,
    choices: [{ value: 'pca', label: 'PCA' }, { value: 'tsne', label: 't-SNE' }, { value: 'umap', label: 'UMAP' }],
    help: ['the map: pca (default), tsne or umap'],
  } satisfies ParamSpec<EmbedMethod>,
  perplexity: {
    name: 'perplexity', flag: 'perplexity', meta: '<p>', label: 'Perplexity', kind: 'number', min: 0, exclusiveMin: true, default: 30,
    help: ['t-SNE perplexity, a number > 0 and below the number of windows (default {default})'], panel: { min: 2, max: 200 },
  } satisfies ParamSpec<number>,
  iterations: {
    name: 'iterations', flag: 'iterations', meta: '<n>', label: 'Iterations', kind: 'integer', min: 1, default: 750,
    help: ['t-SNE iterations, an integer >= 1 (default {default})'], panel: { min: 250, max: 10_000, step: 50 },
  } satisfies ParamSpec<number>,
  neighbors: {
    name: 'neighbors', flag: 'neighbors', meta: '<k>', label: 'Neighbours', kind: 'integer', min: 2, default: 15,
    help: ['UMAP neighbourhood size, an integer >= 2 (default {default})'], panel: { min: 2, max: 200 },
  } satisfies ParamSpec<number>,
  minDist: {
    name: 'minDist', flag: 'min-dist', meta: '<d>', label: 'Min. distance', kind: 'number', min: 0, default: 0.1,
    help: ['UMAP smallest distance between points in the map, >= 0 (default {default})'], panel: { min: 0, max: 1, step: 0.05 },
  } satisfies ParamSpec<number>,
  metric: {
    name: 'metric', flag: 'metric', meta: '<m>', label: 'Distance', kind: 'choice', default: 'euclidean' as Metric,
    choices: [{ value: 'euclidean', label: 'Euclidean' }, { value: 'cosine', label: 'cosine' }],
    help: ['UMAP distance in feature space: euclidean (default) or cosine'],
  } satisfies ParamSpec<Metric>,
  sampleAbove: {
    name: 'sampleAbove', flag: 'sample-above', meta: '<n>', label: 'Sample above', kind: 'integer', min: 100, default: 50_000,
    help: [
      't-SNE and UMAP embed a subject-stratified sample of n windows and place the',
      'others from their 10 nearest sampled windows above n windows (default {default});',
      'windows.csv then gains a "placed" column (1 = placed)',
    ],
    panel: { min: 1000, max: 10_000_000, step: 1000, title: 'Above this many windows, embed a sample and place the rest' },
  } satisfies ParamSpec<number>,
  cluster: {
    name: 'cluster', flag: 'cluster', meta: '<how>', label: 'Method', kind: 'choice', default: 'kmeans' as ClusterMethod,
    choices: [
      { value: 'kmeans', label: 'k-means' }, { value: 'ward', label: 'tree: Ward' }, { value: 'average', label: 'tree: average' },
      { value: 'complete', label: 'tree: complete' }, { value: 'single', label: 'tree: single' },
      { value: 'hdbscan', label: 'HDBSCAN (no k)' },
    ],
    help: [
      'kmeans (default), a tree: ward, average, complete or single linkage, or hdbscan',
      '(density clusters without k; windows in none are set aside as noise)',
    ],
  } satisfies ParamSpec<ClusterMethod>,
  cutHeight: {
    name: 'cutHeight', flag: 'cut-height', meta: '<h>', label: 'Cut height', kind: 'number', min: 0, default: 10,
    help: ['cut the tree at this merge height instead of into --k clusters'], panel: { min: 0, max: 1e9, step: 0.5 },
  } satisfies ParamSpec<number>,
  minClusterSize: {
    name: 'minClusterSize', flag: 'min-cluster-size', meta: '<m>', label: 'Min. cluster size', kind: 'integer', min: 2, default: 50,
    help: ['HDBSCAN: fewest windows a cluster may hold, an integer >= 2 (default {default})'], panel: { min: 2, max: 100_000 },
  } satisfies ParamSpec<number>,
  minSamples: {
    name: 'minSamples', flag: 'min-samples', meta: '<m>', label: 'Min. samples', kind: 'integer', min: 1, default: 50,
    help: ['HDBSCAN: windows (itself included) that make a neighbourhood dense (default: --min-cluster-size)'], panel: { min: 1, max: 100_000 },
  } satisfies ParamSpec<number>,
  space: {
    name: 'space', flag: 'space', meta: '<where>', label: 'Cluster in', kind: 'choice', default: 'features' as ClusterSpace,
    choices: [{ value: 'features', label: 'features' }, { value: 'map', label: 'the map' }],
    help: ['cluster in features (scaled features after the recipe, default) or map space'],
  } satisfies ParamSpec<ClusterSpace>,
} as const;

export type ParamName = keyof typeof PARAMS;

/** The parameters the run panel shows, in its order (the test walks them against the panel). */
export const PANEL_PARAMS: readonly ParamName[] = [
  'embed', 'perplexity', 'iterations', 'neighbors', 'minDist', 'metric', 'sampleAbove', 'cluster', 'k', 'cutHeight', 'minClusterSize', 'minSamples', 'restarts', 'space', 'seed',
];

/** Windows a t-SNE perplexity must stay below, and the phrase an error gives. */
export function perplexityLimit(embedded: number): { fits(p: number): boolean; expected: string } {
  return { fits: (p) => p < embedded, expected: `less than the number of windows embedded (${embedded})` };
}

/** A UMAP neighbourhood must leave out at least one of the windows embedded. */
export function neighborsLimit(embedded: number): { fits(k: number): boolean; expected: string } {
  return { fits: (k) => k <= embedded - 1, expected: `at most the number of windows embedded minus one (${embedded - 1})` };
}
