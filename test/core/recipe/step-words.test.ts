import { describe, expect, it } from 'vitest';
import { parseRecipe } from '../../../src/core/recipe/parse-recipe';
import { recipeInWords, stepInWords } from '../../../src/core/recipe/step-words';
import { STEP_TYPES } from '../../../src/core/recipe/parse-recipe';

describe('recipe steps in words', () => {
  it('says every step type in words with its parameters, never its code name', () => {
    const recipe = parseRecipe({ version: 1, steps: STEP_TYPES.map((type) => (type === 'log' ? { type, features: ['acc_x_mean'] } : { type })) });
    for (const step of recipe.steps) {
      const words = stepInWords(step);
      expect(words.length, step.type).toBeGreaterThan(10);
      expect(words, step.type).not.toContain(step.type.includes('-') ? step.type : '\u0000');
    }
  });

  it('writes the defaults as a reviewer reads them', () => {
    expect(recipeInWords(parseRecipe({ version: 1, steps: [{ type: 'zscore' }, { type: 'impute', method: 'median', scope: 'subject' }] })))
      .toBe('1. scale each feature to mean 0 and standard deviation 1 (z-score) 2. fill missing values with the median of each subject');
    expect(stepInWords(parseRecipe({ version: 1, steps: [{ type: 'robust' }] }).steps[0])).toBe('centre each feature on its median and divide by its 25th–75th percentile range');
    expect(stepInWords(parseRecipe({ version: 1, steps: [{ type: 'clip' }] }).steps[0])).toBe('clip each feature to its 1st–99th percentiles');
    expect(stepInWords(parseRecipe({ version: 1, steps: [{ type: 'prune-correlated', threshold: 0.95 }] }).steps[0])).toBe('drop the later feature of each pair correlated above |r| = 0.95');
  });
});
