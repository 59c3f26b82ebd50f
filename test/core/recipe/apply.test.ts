import { describe, expect, it } from 'vitest';
import type { FeatureMatrix } from '../../../src/core/analysis.types';
import { OptionError } from '../../../src/core/errors';
import { applyRecipe } from '../../../src/core/recipe/apply';
import { baselineRecipe } from '../../../src/core/recipe/baseline';
import { parseRecipe } from '../../../src/core/recipe/parse-recipe';
import { RecipeCache } from '../../../src/core/recipe/recipe-cache';
import { DEFAULT_RECIPE } from '../../../src/core/recipe/recipe.types';
import { seededRandom } from '../../../src/core/random';

/** A seeded n × d matrix with some missing values, two subjects with different offsets. */
function planted(n = 60, d = 4): { matrix: FeatureMatrix; subjects: Int32Array } {
  const random = seededRandom(7);
  const data = new Float64Array(n * d);
  const subjects = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    subjects[i] = i % 2;
    for (let j = 0; j < d; j++) data[i * d + j] = random() * (j + 1) + (subjects[i] ? 10 : 0);
  }
  for (const c of [3, 17, 42, 101, 150]) data[c] = NaN;
  return { matrix: { data, n, d, featureNames: Array.from({ length: d }, (_, j) => `f${j}`) }, subjects };
}

describe('applyRecipe(matrix, context, recipe)', () => {
  it('DEFAULT_RECIPE gives exactly the baseline output and records', async () => {
    const { matrix } = planted();
    const before = Float64Array.from(matrix.data);
    const r = await applyRecipe(matrix, {}, DEFAULT_RECIPE);
    const b = baselineRecipe(matrix);
    expect(Array.from(r.data)).toEqual(Array.from(b.data));
    expect(r.records).toEqual(b.recipe);
    expect(Array.from(matrix.data)).toEqual(Array.from(before)); // input untouched (NaN equal in toEqual)
    expect(r.windows).toEqual(Int32Array.from({ length: 60 }, (_, i) => i));
  });

  it('matches scipy.stats.zscore (nan_policy="omit") through a one-step recipe', async () => {
    // SciPy scipy.stats.zscore docstring (the nan_policy="omit" example).
    const data = Float64Array.from([25.11, 30.1, NaN, 32.02, 43.15]);
    const r = await applyRecipe({ data, n: 5, d: 1, featureNames: ['x'] }, {}, parseRecipe({ version: 1, steps: [{ type: 'zscore' }] }));
    expect(r.data[2]).toBeNaN();
    [-1.13490897, -0.37830299, NaN, -0.08718406, 1.60039602].forEach((v, i) => { if (i !== 2) expect(r.data[i]).toBeCloseTo(v, 7); });
  });

  it('drops windows and features above the missing threshold and reports which input rows remain', async () => {
    const data = Float64Array.from([1, NaN, 3, 2, NaN, 4, 3, NaN, NaN, 4, NaN, 6]);
    const m: FeatureMatrix = { data, n: 4, d: 3, featureNames: ['a', 'b', 'c'] };
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'drop-missing', axis: 'features', threshold: 0.5 }, { type: 'drop-missing', axis: 'windows', threshold: 0 }] });
    const r = await applyRecipe(m, {}, recipe);
    expect(r.featureNames).toEqual(['a', 'c']);
    expect(Array.from(r.windows)).toEqual([0, 1, 3]);
    expect(Array.from(r.data)).toEqual([1, 3, 2, 4, 4, 6]);
    expect(r.records[0].effect).toEqual({ dropped: [{ feature: 'b', missingShare: 1 }] });
    expect(r.records[1].effect).toEqual({ dropped: 1, kept: 3 });
  });

  it('per-subject z-score wraps the subjectZscore kernel and needs subjects', async () => {
    const { matrix, subjects } = planted();
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'subject-zscore' }, { type: 'impute', method: 'mean' }] });
    const r = await applyRecipe(matrix, { subjectCodes: subjects }, recipe);
    // Within each subject, each feature has mean 0 and sd 1 (ddof 0) over its present values
    // (the imputed zeros leave the mean at 0).
    for (const s of [0, 1]) {
      let sum = 0;
      for (let i = s; i < 60; i += 2) sum += r.data[i * 4 + 1];
      expect(Math.abs(sum)).toBeLessThan(1e-9);
    }
    expect(r.records[1].params).toEqual({ method: 'mean', value: 0, space: 'scaled' });
    await expect(applyRecipe(matrix, {}, recipe)).rejects.toThrow(/recipe step 1 \(subject-zscore\) scope.*subject column/);
  });

  it('prunes a copy of a feature and a constant feature', async () => {
    const random = seededRandom(3);
    const n = 50;
    const data = new Float64Array(n * 4);
    for (let i = 0; i < n; i++) {
      const a = random();
      data.set([a, 2 * a + 1, 7, random()], i * 4);
    }
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'prune-constant' }, { type: 'prune-correlated', threshold: 0.9 }] });
    const r = await applyRecipe({ data, n, d: 4, featureNames: ['a', 'twice_a', 'seven', 'b'] }, {}, recipe);
    expect(r.featureNames).toEqual(['a', 'b']);
    const dropped = r.records[1].effect.dropped as { feature: string; keptInstead: string; r: number }[];
    expect(dropped).toHaveLength(1);
    expect(dropped[0]).toMatchObject({ feature: 'twice_a', keptInstead: 'a' });
    expect(dropped[0].r).toBeCloseTo(1, 12);
  });

  it('names the step and field when a step cannot run', async () => {
    const { matrix } = planted();
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'zscore' }, { type: 'log', features: ['nope'] }] });
    const err = await applyRecipe(matrix, {}, recipe).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(OptionError);
    expect((err as Error).message).toMatch(/^invalid recipe step 2 \(log\) features: "nope"/);
    const all = parseRecipe({ version: 1, steps: [{ type: 'drop-missing', axis: 'windows', threshold: 0 }] });
    const holes: FeatureMatrix = { data: Float64Array.from([NaN, 1, 2, NaN]), n: 2, d: 2, featureNames: ['a', 'b'] };
    await expect(applyRecipe(holes, {}, all)).rejects.toThrow(/keeps at least 2 windows \(it keeps 0 of 2\)/);
  });
});

describe('RecipeCache', () => {
  const steps = [
    { type: 'clip', lower: 5, upper: 95 },
    { type: 'robust' },
    { type: 'impute', method: 'median' },
    { type: 'prune-correlated', threshold: 0.99 },
  ];

  it('re-runs only the steps after the changed one, with results equal to a fresh run', async () => {
    const { matrix } = planted();
    const cache = new RecipeCache();
    const first = await applyRecipe(matrix, {}, parseRecipe({ version: 1, steps }), undefined, cache);
    expect(first.reused).toBe(0);
    const edited = parseRecipe({ version: 1, steps: [...steps.slice(0, 2), { type: 'impute', method: 'mean' }, steps[3]] });
    const second = await applyRecipe(matrix, {}, edited, undefined, cache);
    expect(second.reused).toBe(2);
    const fresh = await applyRecipe(matrix, {}, edited);
    expect(Array.from(second.data)).toEqual(Array.from(fresh.data));
    expect(second.records).toEqual(fresh.records);
    // Going back to the first recipe reuses the shared prefix and is not corrupted by the edit.
    const again = await applyRecipe(matrix, {}, parseRecipe({ version: 1, steps }), undefined, cache);
    expect(again.reused).toBe(2);
    expect(Array.from(again.data)).toEqual(Array.from(first.data));
    expect(cache.size).toBe(4);
    // The whole recipe unchanged: everything reused; mutating a result does not touch the cache.
    const same = await applyRecipe(matrix, {}, parseRecipe({ version: 1, steps }), undefined, cache);
    expect(same.reused).toBe(4);
    same.data.fill(0);
    const yetAgain = await applyRecipe(matrix, {}, parseRecipe({ version: 1, steps }), undefined, cache);
    expect(Array.from(yetAgain.data)).toEqual(Array.from(first.data));
  });

  it('starts over for another matrix', async () => {
    const cache = new RecipeCache();
    await applyRecipe(planted().matrix, {}, parseRecipe({ version: 1, steps }), undefined, cache);
    const other = await applyRecipe(planted(40).matrix, {}, parseRecipe({ version: 1, steps }), undefined, cache);
    expect(other.reused).toBe(0);
    expect(other.n).toBe(40);
  });
});
