import type { AnalysisParams, FeatureMatrix } from '../core/analysis.types';
import { applyRecipe } from '../core/recipe/apply';
import { parseRecipe } from '../core/recipe/parse-recipe';
import { DEFAULT_RECIPE } from '../core/recipe/recipe.types';

/** The run's recipe applied to its matrix: the scaled features the run clustered (analysed windows only). */
export async function recipeData(matrix: FeatureMatrix, params: AnalysisParams): Promise<{ data: Float64Array; n: number; d: number }> {
  const steps = params.recipe === undefined ? DEFAULT_RECIPE : parseRecipe(params.recipe);
  const { data, n, d } = await applyRecipe(matrix, { subjectCodes: matrix.subjectCodes }, steps);
  return { data, n, d };
}
