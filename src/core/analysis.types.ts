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
}

export const DEFAULT_ANALYSIS_PARAMS: AnalysisParams = {
  k: 8,
  seed: 1,
  restarts: 10,
  maxIterations: 300,
  silhouetteSample: 2000,
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
  embed: {
    method: 'pca';
    components: 2;
    /** Fraction of total variance each of the two map axes explains. */
    explainedVarianceRatio: number[];
  };
  /** Map coordinates, interleaved x0, y0, x1, y1, ... (length 2n). */
  coords: Float32Array;
  cluster: {
    method: 'kmeans';
    k: number;
    restarts: number;
    maxIterations: number;
    init: 'k-means++';
    iterations: number;
    inertia: number;
    converged: boolean;
  };
  /** Cluster index per window, 0..k-1. */
  labels: Int32Array;
  /**
   * Per-window confidence in [0, 1]: 1 - d1/d2, where d1 and d2 are the distances to the nearest
   * and second-nearest centre in the clustered space.
   */
  confidence: Float32Array;
  /** Centres in the scaled feature space, row-major k × d. */
  centroids: Float64Array;
  /** Window count per cluster. */
  sizes: Int32Array;
  metrics: {
    /** Mean silhouette on a seeded sample of `silhouetteSampleSize` windows. */
    silhouette: number;
    silhouetteSampleSize: number;
  };
}
