import type { FeatureMatrix, RecipeStepRecord } from '../analysis.types';
import type { JobContext } from '../job';
import { RecipeCache } from './recipe-cache';
import type { Recipe } from './recipe.types';
import { runStep } from './run-step';
import type { RecipeState } from './state';

export interface RecipeContext {
  /** Subject code per window (-1 = no subject), needed by subject-scoped steps. */
  subjectCodes?: Int32Array;
}

export interface RecipeResult {
  /** Row-major n × d, the recipe's output (missing values remain unless a step filled them). */
  data: Float64Array;
  n: number;
  d: number;
  featureNames: string[];
  /** For each output row, its window's row index in the input matrix (ascending). */
  windows: Int32Array;
  records: RecipeStepRecord[];
  /** How many leading steps were taken from the cache rather than recomputed. */
  reused: number;
}

/**
 * Applies a validated recipe (see parseRecipe) to the matrix, which is never modified. With a
 * cache, the result of every step prefix is kept, so a re-run after editing step k recomputes
 * only steps k and later. The same matrix, context and recipe always give the same result.
 */
export async function applyRecipe(matrix: FeatureMatrix, context: RecipeContext, recipe: Recipe, ctx?: JobContext, cache?: RecipeCache): Promise<RecipeResult> {
  const { n, d } = matrix;
  if (context.subjectCodes && context.subjectCodes.length !== n) {
    throw new Error(`subject codes do not fit the matrix: ${context.subjectCodes.length} codes for ${n} windows`);
  }
  const steps = recipe.steps;
  cache?.bind(matrix, context.subjectCodes);
  let start = 0;
  let state: RecipeState | undefined;
  const records: RecipeStepRecord[] = [];
  if (cache) {
    const hit = cache.longestPrefix(steps);
    start = hit.length;
    state = hit.state;
    records.push(...hit.records);
  }
  if (!state) {
    state = {
      data: Float64Array.from(matrix.data),
      n,
      d,
      featureNames: [...matrix.featureNames],
      windows: Int32Array.from({ length: n }, (_, i) => i),
      subjects: context.subjectCodes ? Int32Array.from(context.subjectCodes) : undefined,
      centred: false,
    };
  }
  for (let i = start; i < steps.length; i++) {
    ctx?.progress(`recipe step ${i + 1}: ${steps[i].type}`, steps.length ? i / steps.length : 1);
    // A cached state is shared: give the step a copy of it.
    const input = cache && (i > 0 || start > 0) ? { ...state, data: Float64Array.from(state.data) } : state;
    const out = runStep(input, steps[i], i);
    state = out.state;
    records.push(out.record);
    cache?.store(steps.slice(0, i + 1), state, out.record);
    if (ctx) await ctx.checkpoint();
  }
  cache?.keepOnly(steps);
  const data = cache ? Float64Array.from(state.data) : state.data;
  return { data, n: state.n, d: state.d, featureNames: state.featureNames, windows: state.windows, records, reused: start };
}
