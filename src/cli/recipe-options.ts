import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import type { FeatureMatrix } from '../core/analysis.types';
import { InputError, OptionError } from '../core/errors';
import { parseRecipe } from '../core/recipe/parse-recipe';
import type { Recipe, RecipeStep } from '../core/recipe/recipe.types';
import { subjectCodes } from '../core/recipe/subject-codes';
import type { Roles } from '../core/table/roles.types';
import { findColumn, type Table } from '../core/table/table';
import type { AnalyzeOptions } from './args';

/**
 * The recipe asked for on the command line: the --recipe file, or one built from --scale and
 * --impute (scale first, then fill in the scaled space, as the default does); undefined when
 * none of them is given, so the default recipe applies.
 */
export function recipeOption(opts: Pick<AnalyzeOptions, 'recipe' | 'scale' | 'impute'>): Recipe | undefined {
  if (opts.recipe !== undefined) return readRecipeFile(opts.recipe);
  if (opts.scale === undefined && opts.impute === undefined) return undefined;
  const scale = opts.scale ?? 'zscore';
  const impute = opts.impute ?? 'mean';
  const steps: RecipeStep[] = [];
  if (impute === 'drop') steps.push({ type: 'drop-missing', axis: 'windows', threshold: 0 });
  if (scale !== 'none') steps.push(scale === 'robust' ? { type: 'robust', quantileRange: [25, 75] } : { type: scale });
  if (impute !== 'drop') {
    steps.push(impute === 'subject-median' ? { type: 'impute', method: 'median', scope: 'subject' } : { type: 'impute', method: impute, scope: 'global' });
  }
  return parseRecipe({ version: 1, steps });
}

function readRecipeFile(path: string): Recipe {
  const text = readFileSync(path, 'utf8');
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    throw new InputError({ file: basename(path), expected: 'a recipe in JSON', found: err instanceof Error ? err.message : String(err) });
  }
  try {
    return parseRecipe(json);
  } catch (err) {
    if (err instanceof OptionError) err.message = `${basename(path)}: ${err.message}`;
    throw err;
  }
}

/** --subject: the named column becomes the subject; a column inferred as subject becomes metadata. */
export function useSubjectColumn(table: Table, roles: Roles, name: string | undefined): void {
  if (name === undefined) return;
  if (!findColumn(table, name)) {
    throw new InputError({ file: table.fileName, column: name, expected: `a column of this name for --subject (columns: ${table.columns.map((c) => c.name).join(', ')})` });
  }
  for (const r of roles) {
    if (r.name === name) { r.role = 'subject'; r.evidence = 'named by --subject'; }
    else if (r.role === 'subject') { r.role = 'metadata'; r.evidence = 'another column was named by --subject'; }
  }
}

/** Gives the matrix the subject code of each window, when the table has a subject column. */
export function attachSubjects(matrix: FeatureMatrix, table: Table, roles: Roles): void {
  const entry = roles.find((r) => r.role === 'subject');
  const column = entry ? findColumn(table, entry.name) : undefined;
  if (column) matrix.subjectCodes = subjectCodes(column).codes;
}
