export { applyRecipe, type RecipeContext, type RecipeResult } from './apply';
export { parseRecipe, parseStep, STEP_TYPES } from './parse-recipe';
export { RecipeCache } from './recipe-cache';
export { DEFAULT_RECIPE } from './recipe.types';
export type { Recipe, RecipeStep, RecipeStepType } from './recipe.types';
export { subjectCodes } from './subject-codes';
