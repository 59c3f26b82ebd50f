import type { Recipe, RecipeStep } from '../../core/recipe/recipe.types';

/** The per-subject variant of a recipe: every scaling step becomes a z-score within each subject. */
export function subjectScaledRecipe(recipe: Recipe | undefined): Recipe {
  const scaling = new Set(['zscore', 'robust', 'minmax', 'subject-zscore']);
  const base: RecipeStep[] = recipe?.steps.slice() ?? [{ type: 'zscore' }, { type: 'impute', method: 'mean', scope: 'global' }];
  let replaced = false;
  const steps = base.flatMap((s): RecipeStep[] => {
    if (!scaling.has(s.type)) return [s];
    if (replaced) return [];
    replaced = true;
    return [{ type: 'subject-zscore' }];
  });
  if (!replaced) steps.unshift({ type: 'subject-zscore' });
  return { version: 1, steps };
}

/** The recipe in a few words, e.g. "z-score → impute (mean)". */
export function recipeText(recipe: Recipe | undefined): string {
  const steps = recipe?.steps ?? [{ type: 'zscore' }, { type: 'impute', method: 'mean', scope: 'global' }];
  return steps.map((s) => {
    switch (s.type) {
      case 'zscore': return 'z-score';
      case 'subject-zscore': return 'per-subject z-score';
      case 'impute': return `impute (${s.method}${s.scope === 'subject' ? ', per subject' : ''})`;
      default: return s.type;
    }
  }).join(' → ');
}
