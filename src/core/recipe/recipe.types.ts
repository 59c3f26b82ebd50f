/**
 * The Recipe: ordered, JSON-serializable preprocessing steps applied to the feature matrix before
 * embedding and clustering. Each step type is one member of `RecipeStep`; `parseRecipe` fills
 * defaults and validates, so code past that edge can trust every field.
 */

/** Drop windows (rows) or features (columns) whose share of missing values is above `threshold`. */
export interface DropMissingStep {
  type: 'drop-missing';
  axis: 'windows' | 'features';
  /** Share in [0, 1); 0 drops anything with a missing value. */
  threshold: number;
}

/** Fill missing values with the feature mean or median, over all windows or within each subject. */
export interface ImputeStep {
  type: 'impute';
  method: 'mean' | 'median';
  /** 'subject' uses each subject's own statistic (the global one where a subject has no value). */
  scope: 'global' | 'subject';
}

/** (x - mean) / sd per feature, ddof 0, missing values left out and kept missing. */
export interface ZScoreStep {
  type: 'zscore';
}

/** z-score within each subject (removes between-subject offsets and spreads). */
export interface SubjectZScoreStep {
  type: 'subject-zscore';
}

/** (x - median) / (q_hi - q_lo) per feature; percentiles linearly interpolated. */
export interface RobustStep {
  type: 'robust';
  /** Percentiles bounding the spread, default [25, 75] (the IQR). */
  quantileRange: [number, number];
}

/** (x - min) / (max - min) per feature, to [0, 1]. */
export interface MinMaxStep {
  type: 'minmax';
}

/** ln(1 + x) ('log1p', for non-negative features) or sign(x) ln(1 + |x|) ('signed-log'). */
export interface LogStep {
  type: 'log';
  mode: 'log1p' | 'signed-log';
  /** Feature names to transform; an empty list means every feature. */
  features: string[];
}

/** Drop constant and near-constant features. */
export interface PruneConstantStep {
  type: 'prune-constant';
  /** Drop a feature whose variance (ddof 0) is at or below this. */
  minVariance: number;
  /** Drop a feature whose most frequent value covers at least this share of its windows. */
  maxModeShare: number;
}

/** Of each pair of features with |Pearson r| above `threshold`, keep the earlier and drop the later. */
export interface PruneCorrelatedStep {
  type: 'prune-correlated';
  threshold: number;
}

/** Clip each feature to its `lower` and `upper` percentiles (0..100). */
export interface ClipStep {
  type: 'clip';
  lower: number;
  upper: number;
}

export type RecipeStep =
  | DropMissingStep
  | ImputeStep
  | ZScoreStep
  | SubjectZScoreStep
  | RobustStep
  | MinMaxStep
  | LogStep
  | PruneConstantStep
  | PruneCorrelatedStep
  | ClipStep;

export type RecipeStepType = RecipeStep['type'];

export interface Recipe {
  version: 1;
  steps: RecipeStep[];
}

/**
 * The baseline: z-score, then missing values to the feature mean (0 after z-scoring). Runs with
 * no recipe given use it, so their outputs stay as they were.
 */
export const DEFAULT_RECIPE: Readonly<Recipe> = {
  version: 1,
  steps: [{ type: 'zscore' }, { type: 'impute', method: 'mean', scope: 'global' }],
};
