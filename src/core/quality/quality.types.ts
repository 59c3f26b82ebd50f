import type { RecipeStep } from '../recipe/recipe.types';

/** A problem found in the data, with the recipe step that addresses it. */
export interface QualityIssue {
  /** One line a user can read, e.g. `"gyro_z_sd" is missing in 62% of windows`. */
  message: string;
  fix: RecipeStep;
}

export interface MissingnessReport {
  /** Share of windows missing each feature (length d). */
  perFeature: Float64Array;
  /** Subject names, the rows of `perSubject` (absent without subjects). */
  subjects: string[];
  /** Share of each subject's windows missing each feature, row-major subjects × d. */
  perSubject: Float64Array;
  /** Windows with at least one missing feature. */
  windowsWithMissing: number;
  /** Missing values in all. */
  total: number;
  issues: (QualityIssue & { feature: string; share: number })[];
}

export interface NearConstantIssue extends QualityIssue {
  feature: string;
  variance: number;
  modeShare: number;
}

export interface CorrelatedIssue extends QualityIssue {
  a: string;
  b: string;
  r: number;
}

export interface ExtremeIssue extends QualityIssue {
  feature: string;
  /** Windows whose robust z-score is beyond the limit. */
  count: number;
  share: number;
  /** Largest |robust z| of the feature. */
  maxRobustZ: number;
}

export interface DataQuality {
  n: number;
  d: number;
  featureNames: string[];
  missing: MissingnessReport;
  nearConstant: NearConstantIssue[];
  correlated: CorrelatedIssue[];
  extremes: ExtremeIssue[];
}

export interface QualityOptions {
  /** A feature missing in more than this share of windows is proposed for dropping (else imputing). */
  dropFeatureAbove: number;
  /** Near-constant: variance at or below (ddof 0). */
  minVariance: number;
  /** Near-constant: the most frequent value covers at least this share. */
  maxModeShare: number;
  /** Highly correlated: |r| above. */
  correlation: number;
  /** Extreme: |x - median| / (1.4826 MAD) above. */
  robustZ: number;
  /** At most this many correlated pairs are listed (strongest first). */
  maxPairs: number;
}

export const DEFAULT_QUALITY_OPTIONS: QualityOptions = {
  dropFeatureAbove: 0.5,
  minVariance: 0,
  maxModeShare: 0.95,
  correlation: 0.95,
  robustZ: 5,
  maxPairs: 200,
};
