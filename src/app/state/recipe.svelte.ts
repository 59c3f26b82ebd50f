import type { FeatureMatrix } from '../../core/analysis.types';
import { parseRecipe, parseStep, STEP_TYPES } from '../../core/recipe/parse-recipe';
import { DEFAULT_RECIPE, type Recipe, type RecipeStep, type RecipeStepType } from '../../core/recipe/recipe.types';
import { subjectCodes } from '../../core/recipe/subject-codes';
import { featureMatrix } from '../../core/table/matrix';
import type { Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';

export { STEP_TYPES };

/** Each step's title in the editor (its code name, used in recipe files, shows as the tooltip). */
export const STEP_TITLES: Record<RecipeStepType, string> = {
  'drop-missing': 'Drop mostly missing',
  impute: 'Fill missing values',
  zscore: 'Z-score',
  'subject-zscore': 'Z-score per subject',
  robust: 'Robust scaling',
  minmax: 'Scale to 0–1',
  log: 'Log transform',
  'prune-constant': 'Drop constant features',
  'prune-correlated': 'Drop correlated features',
  clip: 'Clip to percentiles',
};

/** What each step does, in a few words for the editor. */
export const STEP_HINTS: Record<RecipeStepType, string> = {
  'drop-missing': 'drop windows or features with too many missing values',
  impute: 'fill missing values with the mean or median',
  zscore: 'scale each feature to mean 0, sd 1',
  'subject-zscore': 'z-score within each subject',
  robust: 'centre on the median, divide by the inter-percentile range',
  minmax: 'scale each feature to [0, 1]',
  log: 'log transform (log1p or signed log)',
  'prune-constant': 'drop constant and near-constant features',
  'prune-correlated': 'drop the later feature of highly correlated pairs',
  clip: 'clip each feature to percentiles',
};

/**
 * The Recipe the user edits in the side panel: ordered steps, each validated by the core's
 * parseStep as it changes (the message names the step and field). Runs take `toRecipe()`; the
 * worker's RecipeCache then re-runs only the steps after the first changed one.
 */
export class RecipeState {
  steps = $state<RecipeStep[]>(DEFAULT_RECIPE.steps.map((s) => ({ ...s })));

  /** The first validation problem, or '' when every step is valid. */
  readonly error = $derived.by(() => {
    try {
      parseRecipe({ version: 1, steps: $state.snapshot(this.steps) });
      return '';
    } catch (err) {
      return err instanceof Error ? err.message : String(err);
    }
  });

  /** A validated copy for a run; throws OptionError naming the step and field. */
  toRecipe(): Recipe {
    return parseRecipe({ version: 1, steps: $state.snapshot(this.steps) });
  }

  /** Adds a step (defaults filled) at the end, or replaces an identical one already there. */
  add(step: Partial<RecipeStep> & { type: RecipeStepType }): void {
    const full = parseStep(step, this.steps.length);
    const same = this.steps.findIndex((s) => JSON.stringify(s) === JSON.stringify(full));
    if (same < 0) this.steps.push(full);
  }

  remove(index: number): void {
    this.steps.splice(index, 1);
  }

  move(index: number, by: -1 | 1): void {
    const to = index + by;
    if (to < 0 || to >= this.steps.length) return;
    const [s] = this.steps.splice(index, 1);
    this.steps.splice(to, 0, s);
  }

  /** Sets one field of a step; validation shows in `error` rather than throwing here. */
  set(index: number, field: string, value: unknown): void {
    const s = this.steps[index];
    if (s) this.steps[index] = { ...s, [field]: value } as RecipeStep;
  }

  reset(): void {
    this.steps = DEFAULT_RECIPE.steps.map((s) => ({ ...s }));
  }

  /** The recipe as a file to save beside the study. */
  toJson(): string {
    return `${JSON.stringify(this.toRecipe(), null, 2)}\n`;
  }
}

/**
 * The feature matrix a recipe runs on: the feature columns and, when a column has the role
 * "subject", the subject code of every window (for subject-scoped steps and the quality heat map).
 */
export function recipeInput(table: Table, roles: Roles): { matrix: FeatureMatrix; subjectNames?: string[] } {
  const matrix = featureMatrix(table, roles);
  const subjectRole = roles.find((r) => r.role === 'subject');
  const column = subjectRole ? table.columns.find((c) => c.name === subjectRole.name) : undefined;
  if (!column) return { matrix };
  const s = subjectCodes(column);
  return { matrix: { ...matrix, subjectCodes: s.codes }, subjectNames: s.names };
}

/** Names a matrix for the worker's RecipeCache: the file's hash and the column roles. */
export function matrixKey(sha256: string, roles: Roles): string {
  return `${sha256}|${JSON.stringify(roles.map((r) => [r.name, r.role]))}`;
}

/** How the editor shows each parameter of a step. */
export type StepField =
  | { field: string; label: string; kind: 'select'; options: string[] }
  | { field: string; label: string; kind: 'number'; step: number }
  | { field: string; label: string; kind: 'pair'; step: number }
  | { field: string; label: string; kind: 'names' };

export const STEP_FIELDS: Record<RecipeStepType, StepField[]> = {
  'drop-missing': [
    { field: 'axis', label: 'drop', kind: 'select', options: ['features', 'windows'] },
    { field: 'threshold', label: 'missing share above', kind: 'number', step: 0.05 },
  ],
  impute: [
    { field: 'method', label: 'with the', kind: 'select', options: ['median', 'mean'] },
    { field: 'scope', label: 'over', kind: 'select', options: ['global', 'subject'] },
  ],
  zscore: [],
  'subject-zscore': [],
  robust: [{ field: 'quantileRange', label: 'percentiles', kind: 'pair', step: 1 }],
  minmax: [],
  log: [
    { field: 'mode', label: 'mode', kind: 'select', options: ['signed-log', 'log1p'] },
    { field: 'features', label: 'features (empty: all)', kind: 'names' },
  ],
  'prune-constant': [
    { field: 'minVariance', label: 'variance at most', kind: 'number', step: 0.001 },
    { field: 'maxModeShare', label: 'one value in at least', kind: 'number', step: 0.01 },
  ],
  'prune-correlated': [{ field: 'threshold', label: '|r| above', kind: 'number', step: 0.01 }],
  clip: [
    { field: 'lower', label: 'lower percentile', kind: 'number', step: 0.5 },
    { field: 'upper', label: 'upper percentile', kind: 'number', step: 0.5 },
  ],
};
