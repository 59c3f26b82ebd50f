import type { FeatureMatrix, RecipeStepRecord } from '../analysis.types';
import { fillMissingInPlace } from './fill';
import { zscoreInPlace } from './zscore';

export interface ScaledMatrix {
  /** Scaled copy of the features, row-major n × d, no missing values. */
  data: Float64Array;
  recipe: RecipeStepRecord[];
}

/**
 * The baseline recipe: z-score each feature (ddof 0, missing values left out), constant
 * features to 0, then missing values to 0 (the feature mean after scaling). The input matrix
 * is not modified.
 */
export function baselineRecipe(matrix: FeatureMatrix): ScaledMatrix {
  const { n, d, featureNames } = matrix;
  const data = Float64Array.from(matrix.data);
  let missingBefore = 0;
  for (let i = 0; i < data.length; i++) if (data[i] !== data[i]) missingBefore++;
  const z = zscoreInPlace(data, n, d);
  const filled = fillMissingInPlace(data, 0);
  return {
    data,
    recipe: [
      {
        step: 'zscore',
        params: { ddof: 0, missing: 'omit', constant: 'set to 0' },
        effect: {
          features: d,
          constantFeatures: z.constantFeatures.map((j) => featureNames[j]),
          missingValues: missingBefore,
        },
      },
      {
        step: 'impute',
        params: { method: 'mean', value: 0, space: 'scaled' },
        effect: { filled },
      },
    ],
  };
}
