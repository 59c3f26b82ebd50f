import type { Linkage, MergeTree } from './cluster/hierarchy/merge-tree';
import type { Metric } from './neighbors/knn.types';
import type { Recipe } from './recipe/recipe.types';
import { PARAMS, type ClusterSpace } from './params/analysis-params';

export type { ClusterSpace };

/**
 * The contract of one analysis run (load → recipe → embed → cluster → metrics), shared by the
 * worker job, the CLI and the app. Later steps extend these types; keep existing fields stable.
 */

/** A dense feature matrix, row-major: value of feature j in window i at data[i * d + j]. */
export interface FeatureMatrix {
  data: Float64Array;
  n: number;
  d: number;
  featureNames: string[];
  /** Subject code per window (-1 = none), for subject-scoped recipe steps; absent without a subject column. */
  subjectCodes?: Int32Array;
}

export interface AnalysisParams {
  /** Number of clusters for k-means. */
  k: number;
  /** Seed for every random step of the run. */
  seed: number;
  /** k-means restarts; the run with the lowest inertia wins. */
  restarts: number;
  /** k-means iteration cap per restart. */
  maxIterations: number;
  /** Windows sampled (seeded) for the silhouette; all windows when n is smaller. */
  silhouetteSample: number;
  /** Preprocessing steps (validated by parseRecipe); DEFAULT_RECIPE when absent. */
  recipe?: Recipe;
  /** How the map is made; PCA when absent. */
  embed?: EmbedChoice;
  /** How windows are clustered; k-means with the flat k, restarts and maxIterations above when absent. */
  cluster?: ClusterChoice;
  /** Where to cluster: the scaled feature space after the recipe (default) or the 2-D map. */
  space?: ClusterSpace;
  /** t-SNE and UMAP first project onto this many principal axes when there are more features (default 50). */
  preReduce?: number;
  /** Above this many windows t-SNE and UMAP embed a subject-stratified sample and place the rest (default 50,000). */
  sampleAbove?: number;
  /** Measure the map's quality for PCA maps too (t-SNE and UMAP maps are always measured). */
  quality?: boolean;
}

/** The map: PCA (2 axes), t-SNE or UMAP with their main parameters; unset fields take the method's defaults. */
export type EmbedChoice =
  | { method: 'pca' }
  | { method: 'tsne'; perplexity: number; iterations: number; learningRate?: 'auto' | number; theta?: number }
  | { method: 'umap'; neighbors: number; minDist: number; metric: Metric; epochs?: number | 'auto' };

/** Flat clusters: k-means, or an agglomerative tree cut into k clusters or at a height. */
export type ClusterChoice =
  | { method: 'kmeans'; k: number; restarts: number; maxIterations: number }
  | { method: Linkage; k: number; cutHeight?: undefined }
  | { method: Linkage; cutHeight: number; k?: undefined }
  | { method: 'hdbscan'; minClusterSize: number; minSamples?: number; k?: undefined; cutHeight?: undefined };

/** Map quality, measured against the scaled features on a seeded sample (k = 10). */
export interface MapQuality {
  /** Trustworthiness at k = 10 (1 = no false neighbours in the map). */
  trustworthiness: number;
  /** Mean fraction of each window's 10 nearest neighbours (features) kept among its 10 nearest in the map. */
  neighbourhoodPreservation: number;
  /** Windows in the quality sample. */
  qualitySampleSize: number;
}

/** How sample-then-place was done (present only when it was). */
export interface SamplingRecord {
  /** Windows above which sampling starts. */
  threshold: number;
  /** Windows embedded; the others were placed. */
  embedded: number;
  placed: number;
  /** Sampled neighbours averaged (inverse-distance weights) to place a window. */
  neighbours: number;
  stratifiedBy: 'subject' | 'none';
}

export type EmbedRecord =
  | ({
    method: 'pca';
    components: 2;
    /** Fraction of total variance each of the two map axes explains. */
    explainedVarianceRatio: number[];
  } & Partial<MapQuality>)
  | ({
    method: 'tsne';
    perplexity: number;
    iterations: number;
    learningRate: number;
    earlyExaggeration: number;
    exaggerationIterations: number;
    theta: number;
    init: string;
    /** Principal axes the features were projected onto first; null when they were used as they are. */
    preReduced: number | null;
    /** Windows the layout was computed on (all unless sampled). */
    sampleSize: number;
    sampling?: SamplingRecord;
    /** KL divergence at the end, when measured. */
    cost?: number;
  } & MapQuality)
  | ({
    method: 'umap';
    neighbors: number;
    minDist: number;
    metric: Metric;
    epochs: number;
    spread: number;
    negativeSampleRate: number;
    init: string;
    preReduced: number | null;
    sampleSize: number;
    sampling?: SamplingRecord;
  } & MapQuality);

export type ClusterRecord =
  | {
    method: 'kmeans';
    k: number;
    restarts: number;
    maxIterations: number;
    init: 'k-means++';
    iterations: number;
    inertia: number;
    converged: boolean;
    /**
     * Moves the refinement after the restarts accepted (split–merge rounds and single-window
     * transfers, src/core/cluster/refine.ts); absent in records written before it existed.
     */
    refinements?: number;
    /** Present when not the default 'features'. */
    space?: ClusterSpace;
  }
  | {
    method: 'hierarchical';
    linkage: Linkage;
    /** Clusters after the cut. */
    k: number;
    /** The height cut at, when cut by height (else the tree was cut into k clusters). */
    cutHeight?: number;
    /** 'two-stage': micro-clusters first (large studies); the tree's leaves are micro-clusters. */
    path: 'exact' | 'two-stage';
    space: ClusterSpace;
  }
  | {
    method: 'hdbscan';
    minClusterSize: number;
    minSamples: number;
    /** Clusters in the labels: the dense clusters found, plus one for noise when there is any. */
    k: number;
    /** Dense clusters found (numbered 0.. by size, largest first). */
    clusters: number;
    /** Windows in no dense cluster; they form the last cluster, set aside from the start. */
    noise: number;
    /** Index of the noise cluster (k − 1), or null when every window is in a dense cluster. */
    noiseCluster: number | null;
    /** Each dense cluster's stability (its excess of mass, in 1/distance × windows). */
    stability: number[];
    /** Principal axes the features were projected onto first; null when used as they are. */
    preReduced: number | null;
    space: ClusterSpace;
  };

/** What a running analysis offers as a partial result: the layout so far. */
export interface AnalysisPartial {
  kind: 'layout';
  /** Interleaved x, y of the windows being embedded (the sample, when sampling). */
  coords: Float32Array;
  /**
   * The input row (window of the feature matrix) of each point of `coords`, present only when they
   * are not simply rows 0..n−1 (the recipe dropped windows, or a sample is embedded).
   */
  windows?: Int32Array;
  /** 'iteration' (t-SNE) or 'epoch' (UMAP), its number and the planned total. */
  unit: 'iteration' | 'epoch';
  step: number;
  steps: number;
  /** KL divergence where known (t-SNE, every 50 iterations). */
  cost?: number;
}

/** The defaults of the parameter schema (params/analysis-params.ts), in the order runs record them. */
export const DEFAULT_ANALYSIS_PARAMS: AnalysisParams = {
  k: PARAMS.k.default,
  seed: PARAMS.seed.default,
  restarts: PARAMS.restarts.default,
  maxIterations: PARAMS.maxIterations.default,
  silhouetteSample: PARAMS.silhouetteSample.default,
};

/** One step of the recipe as it was applied, for provenance. */
export interface RecipeStepRecord {
  step: string;
  params: Record<string, unknown>;
  /** What the step did, e.g. how many missing values were filled. */
  effect: Record<string, unknown>;
}

export interface AnalysisResult {
  recipe: RecipeStepRecord[];
  /**
   * Present only when the recipe dropped windows: the input row index of each analysed window
   * (ascending). coords, labels and confidence then hold one entry per analysed window.
   */
  windows?: Int32Array;
  embed: EmbedRecord;
  /** Present only when sampling happened: 1 = placed from its sampled neighbours, 0 = embedded. */
  placed?: Uint8Array;
  /** Hierarchical runs: the merge tree (leaves are windows, or micro-clusters on the two-stage path). */
  tree?: MergeTree;
  /** Hierarchical runs: the tree leaf of every window. */
  treeLeafOf?: Int32Array;
  /** Map coordinates, interleaved x0, y0, x1, y1, ... (length 2n). */
  coords: Float32Array;
  cluster: ClusterRecord;
  /** Cluster index per window, 0..k-1. */
  labels: Int32Array;
  /**
   * Per-window confidence in [0, 1]: 1 - d1/d2, where d1 and d2 are the distances to the nearest
   * and second-nearest centre in the clustered space.
   */
  confidence: Float32Array;
  /** Centres (cluster means) in the scaled feature space, row-major k × d, whatever the clustered space. */
  centroids: Float64Array;
  /** Window count per cluster. */
  sizes: Int32Array;
  metrics: {
    /** Mean silhouette on a seeded sample of `silhouetteSampleSize` windows. */
    silhouette: number;
    silhouetteSampleSize: number;
  };
}
