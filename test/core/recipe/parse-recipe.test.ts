import { describe, expect, it } from 'vitest';
import { OptionError } from '../../../src/core/errors';
import { parseRecipe } from '../../../src/core/recipe/parse-recipe';

describe('parseRecipe(json)', () => {
  it('fills defaults and round-trips through JSON', () => {
    const r = parseRecipe({ version: 1, steps: [{ type: 'robust' }, { type: 'clip', upper: 98 }, { type: 'impute', scope: 'subject' }] });
    expect(r.steps).toEqual([
      { type: 'robust', quantileRange: [25, 75] },
      { type: 'clip', lower: 1, upper: 98 },
      { type: 'impute', method: 'median', scope: 'subject' },
    ]);
    expect(parseRecipe(JSON.parse(JSON.stringify(r)))).toEqual(r);
  });

  it.each([
    [{ version: 2, steps: [] }, /invalid recipe version: 2/],
    [{ version: 1 }, /invalid recipe steps/],
    [{ version: 1, steps: [{ type: 'sharpen' }] }, /invalid recipe step 1 type: "sharpen" \(expected one of drop-missing, /],
    [{ version: 1, steps: [{ type: 'zscore' }, { type: 'clip', lower: 120 }] }, /invalid recipe step 2 \(clip\) lower: 120 \(expected a percentile from 0 to 100\)/],
    [{ version: 1, steps: [{ type: 'clip', lower: 50, upper: 40 }] }, /step 1 \(clip\) upper: 40 \(expected a percentile above lower \(50\)\)/],
    [{ version: 1, steps: [{ type: 'impute', method: 'mode' }] }, /step 1 \(impute\) method: "mode" \(expected one of mean, median\)/],
    [{ version: 1, steps: [{ type: 'drop-missing', threshold: 1 }] }, /step 1 \(drop-missing\) threshold: 1/],
    [{ version: 1, steps: [{ type: 'zscore', ddof: 1 }] }, /step 1 \(zscore\) field "ddof": 1 \(expected no fields for this step\)/],
    [{ version: 1, steps: [{ type: 'robust', quantileRange: [75, 25] }] }, /step 1 \(robust\) quantileRange/],
    [{ version: 1, steps: [{ type: 'log', features: 'a' }] }, /step 1 \(log\) features/],
  ])('rejects %j', (json, message) => {
    expect(() => parseRecipe(json)).toThrow(OptionError);
    expect(() => parseRecipe(json)).toThrow(message);
  });
});
