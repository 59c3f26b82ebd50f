import type { Recipe, RecipeStep } from './recipe.types';

/** A share 0..1 as a percentage without trailing zeros ("5%", "99.5%"). */
const pct = (x: number) => `${Number((x * 100).toFixed(2))}%`;

/** A percentile 0..100 as an ordinal: 1st, 2nd, 3rd, 25th, 99th, 99.5th. */
function nth(p: number): string {
  if (!Number.isInteger(p)) return `${p}th`;
  const tens = p % 100, ones = p % 10;
  const suffix = tens >= 11 && tens <= 13 ? 'th' : ones === 1 ? 'st' : ones === 2 ? 'nd' : ones === 3 ? 'rd' : 'th';
  return `${p}${suffix}`;
}

/** One recipe step in words a reviewer can read, with its parameters. */
export function stepInWords(step: RecipeStep): string {
  switch (step.type) {
    case 'drop-missing': return `drop ${step.axis} with more than ${pct(step.threshold)} missing values`;
    case 'impute': return `fill missing values with the ${step.method}${step.scope === 'subject' ? ' of each subject' : ''}`;
    case 'zscore': return 'scale each feature to mean 0 and standard deviation 1 (z-score)';
    case 'subject-zscore': return 'z-score each feature within each subject';
    case 'robust': return `centre each feature on its median and divide by its ${nth(step.quantileRange[0])}–${nth(step.quantileRange[1])} percentile range`;
    case 'minmax': return 'scale each feature to the range 0–1';
    case 'log': return `${step.mode === 'log1p' ? 'log(1 + x)' : 'signed log'} of ${step.features.length === 0 ? 'no features' : step.features.join(', ')}`;
    case 'prune-constant': return `drop constant and near-constant features (variance below ${step.minVariance}, or one value in more than ${pct(step.maxModeShare)} of windows)`;
    case 'prune-correlated': return `drop the later feature of each pair correlated above |r| = ${step.threshold}`;
    case 'clip': return `clip each feature to its ${nth(step.lower)}–${nth(step.upper)} percentiles`;
  }
}

/** The recipe as numbered steps in words: "1. … 2. …". */
export function recipeInWords(recipe: Recipe): string {
  return recipe.steps.map((s, i) => `${i + 1}. ${stepInWords(s)}`).join(' ');
}
