import { describe, expect, it } from 'vitest';
import type { FeatureMatrix } from '../../../src/core/analysis.types';
import { applyRecipe } from '../../../src/core/recipe/apply';
import { missingByFeature, recipeNotices } from '../../../src/core/recipe/notices';
import { parseRecipe } from '../../../src/core/recipe/parse-recipe';
import { DEFAULT_RECIPE } from '../../../src/core/recipe/recipe.types';
import { seededRandom } from '../../../src/core/random';

/**
 * A generated matrix with the quirks of a real feature set: one constant feature (a sensor
 * channel that never moved), one feature that is nearly always at one value, and missing cells
 * spread over the others at seeded places. The expected counts are taken from the matrix itself.
 */
function quirky(n = 120): { matrix: FeatureMatrix; missing: number[] } {
  const random = seededRandom(615);
  const names = ['a', 'b', 'constant', 'mostly0', 'c'];
  const d = names.length;
  const data = new Float64Array(n * d);
  const missing = new Array<number>(d).fill(0);
  for (let i = 0; i < n; i++) {
    data[i * d] = random() * 4;
    data[i * d + 1] = random() * 2 + data[i * d] * 0.1;
    data[i * d + 2] = 9.81;
    data[i * d + 3] = i < 3 ? i + 1 : 0;
    data[i * d + 4] = random();
    for (const j of [0, 1, 4]) {
      if (random() < 0.1) {
        data[i * d + j] = NaN;
        missing[j]++;
      }
    }
  }
  return { matrix: { data, n, d, featureNames: names }, missing };
}

describe('recipeNotices: every automatic decision of a recipe, told', () => {
  it('the default recipe: the constant feature set to 0 and the cells filled in each feature', async () => {
    const { matrix, missing } = quirky();
    const before = missingByFeature(matrix);
    const r = await applyRecipe(matrix, {}, DEFAULT_RECIPE);
    const notices = recipeNotices('har.csv', before, r.records);
    const fills = notices.filter((x) => x.kind === 'cells-filled');
    expect(fills.map((x) => [x.column, x.count])).toEqual([['a', missing[0]], ['b', missing[1]], ['c', missing[4]]]);
    // The counts told add up to what the impute step recorded (and so to summary.json's figure).
    expect(fills.reduce((s, x) => s + (x.count ?? 0), 0)).toBe(r.records[1].effect.filled);
    expect(fills[0].message).toBe(`har.csv, feature "a": ${missing[0]} missing cells filled with the feature mean (0 after scaling) by recipe step 2 (impute)`);
    expect(notices.filter((x) => x.kind === 'feature-constant').map((x) => x.message)).toEqual([
      'har.csv, feature "constant": constant; recipe step 1 (zscore) set it to 0 in every window',
    ]);
  });

  it('near-constant features dropped, windows dropped, per-subject fills: one notice each, in step order', async () => {
    const { matrix, missing } = quirky();
    const before = missingByFeature(matrix);
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'prune-constant' }, { type: 'drop-missing', axis: 'windows', threshold: 0 }, { type: 'zscore' }] });
    const r = await applyRecipe(matrix, {}, recipe);
    const notices = recipeNotices('m.csv', before, r.records);
    expect(notices.map((x) => [x.kind, x.column ?? null])).toEqual([
      ['feature-dropped', 'constant'], ['feature-dropped', 'mostly0'], ['rows-dropped', null],
    ]);
    expect(notices[1].message).toMatch(/^m\.csv, feature "mostly0": near-constant \(variance [0-9.e-]+, 98% of windows at one value\); recipe step 1 \(prune-constant\) dropped it$/);
    const dropped = matrix.n - r.n;
    expect(dropped).toBeGreaterThan(0);
    expect(notices[2]).toMatchObject({ count: dropped, message: `m.csv: recipe step 2 (drop-missing) dropped ${dropped} windows with missing values (${r.n} kept)` });
    // Nothing filled: no fill notice; the missing cells went with their windows.
    expect(missing.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
  });

  it('tells the total alone when the per-feature counts cannot be followed (a step changed which cells are missing)', async () => {
    const { matrix } = quirky();
    const before = missingByFeature(matrix);
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'drop-missing', axis: 'windows', threshold: 0.5 }, { type: 'impute', method: 'median', scope: 'global' }] });
    const r = await applyRecipe(matrix, {}, recipe);
    const fills = recipeNotices('t.csv', before, r.records).filter((x) => x.kind === 'cells-filled');
    // With 3 of 5 features complete no window passes 50% missing, so the cells survive: told per feature.
    expect(fills.map((x) => x.column)).toEqual(['a', 'b', 'c']);
    // A record whose total disagrees with the followed counts (as after a step that moved cells) gets one line.
    const odd = r.records.map((x) => (x.step === 'impute' ? { ...x, effect: { filled: 5 } } : x));
    expect(recipeNotices('t.csv', before, odd).filter((x) => x.kind === 'cells-filled').map((x) => x.message)).toEqual([
      't.csv: 5 missing cells filled with the feature\'s median by recipe step 2 (impute)',
    ]);
  });
});
