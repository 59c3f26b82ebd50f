/**
 * The frozen recipe: fitted on a study's matrix it gives exactly what the analysis's own recipe
 * gives there (applyRecipe), applied again to that matrix it gives the same bits, applied to new
 * windows it uses the study's statistics (checked against the arithmetic written out here), and
 * applied to whole-subject parts it gives the rows of the whole.
 */
import { describe, expect, it } from 'vitest';
import { applyFrozen, fitRecipe, SplitSubjectError } from '../../../src/core/apply/frozen-recipe';
import { applyRecipe } from '../../../src/core/recipe/apply';
import { parseRecipe } from '../../../src/core/recipe/parse-recipe';
import { seededRandom } from '../../../src/core/random';

const FEATURES = ['a', 'b', 'c', 'd', 'e'];

/** n windows of 5 features from `seed`: c is nearly b (for the correlation step), e is constant, some values missing. */
function matrix(n: number, seed: number, subjectsOf = (i: number) => Math.floor(i / 10)) {
  const random = seededRandom(seed);
  const d = FEATURES.length;
  const data = new Float64Array(n * d);
  const subjects = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const s = subjectsOf(i);
    subjects[i] = s;
    const b = random() * 4 - 1 + s;
    const row = [random() * 10, b, b * 2 + random() * 1e-3, Math.exp(random() * 3), 7];
    if (random() < 0.08) row[0] = NaN;
    if (random() < 0.05) row[3] = NaN;
    data.set(row, i * d);
  }
  return { data, n, d, subjects };
}

const RECIPES: Record<string, unknown[]> = {
  default: [{ type: 'zscore' }, { type: 'impute', method: 'mean', scope: 'global' }],
  'median then robust': [{ type: 'impute', method: 'median', scope: 'global' }, { type: 'robust', quantileRange: [10, 90] }],
  'log, clip, minmax': [{ type: 'log', mode: 'log1p', features: ['d'] }, { type: 'clip', lower: 5, upper: 95 }, { type: 'minmax' }, { type: 'impute', method: 'mean', scope: 'global' }],
  'drop windows, prune': [{ type: 'drop-missing', axis: 'windows', threshold: 0 }, { type: 'prune-constant', minVariance: 0, maxModeShare: 0.95 }, { type: 'prune-correlated', threshold: 0.95 }, { type: 'zscore' }],
  'drop features, signed log': [{ type: 'drop-missing', axis: 'features', threshold: 0.06 }, { type: 'log', mode: 'signed-log', features: [] }, { type: 'zscore' }, { type: 'impute', method: 'median', scope: 'global' }],
  'per subject': [{ type: 'subject-zscore' }, { type: 'impute', method: 'median', scope: 'subject' }],
  'per-subject mean, then z-score': [{ type: 'impute', method: 'mean', scope: 'subject' }, { type: 'zscore' }],
};

describe('fitRecipe and applyFrozen', () => {
  for (const [name, steps] of Object.entries(RECIPES)) {
    it(`${name}: the study's own matrix gives applyRecipe's bits; whole-subject parts give the whole's rows`, async () => {
      const recipe = parseRecipe({ version: 1, steps });
      const m = matrix(60, 3);
      const reference = await applyRecipe({ data: m.data, n: m.n, d: m.d, featureNames: FEATURES, subjectCodes: m.subjects }, { subjectCodes: m.subjects }, recipe);
      const fitted = fitRecipe(m.data, m.n, FEATURES, m.subjects, recipe);
      expect(Array.from(fitted.state.data)).toEqual(Array.from(reference.data));
      expect(fitted.frozen.outputFeatures).toEqual(reference.featureNames);
      const again = applyFrozen(fitted.frozen, m.data, m.n, m.subjects);
      expect(Array.from(again.data)).toEqual(Array.from(reference.data));
      expect(Array.from(again.windows)).toEqual(Array.from(reference.windows));

      // New windows: parts of whole subjects (10 windows each), then the whole, row for row.
      const fresh = matrix(80, 9);
      const whole = applyFrozen(fitted.frozen, fresh.data, fresh.n, fresh.subjects);
      const rows: number[][] = [];
      const kept: number[] = [];
      for (const [from, to] of [[0, 30], [30, 40], [40, 80]]) {
        const part = applyFrozen(fitted.frozen, fresh.data.slice(from * m.d, to * m.d), to - from, fresh.subjects.slice(from, to));
        for (let i = 0; i < part.n; i++) rows.push(Array.from(part.data.subarray(i * part.d, (i + 1) * part.d)));
        kept.push(...Array.from(part.windows, (w) => w + from));
      }
      expect(kept).toEqual(Array.from(whole.windows));
      expect(rows).toEqual(Array.from({ length: whole.n }, (_, i) => Array.from(whole.data.subarray(i * whole.d, (i + 1) * whole.d))));
    });
  }

  it('z-scores new windows with the study\'s mean and deviation (ddof 0), not their own', () => {
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'zscore' }] });
    // Study column: 1, 2, 3, 4 (mean 2.5, population sd sqrt(1.25)); a constant second column.
    const study = Float64Array.from([1, 5, 2, 5, 3, 5, 4, 5]);
    const { frozen } = fitRecipe(study, 4, ['x', 'y'], undefined, recipe);
    const out = applyFrozen(frozen, Float64Array.from([10, 9, NaN, 5]), 2, undefined);
    expect(out.data[0]).toBeCloseTo((10 - 2.5) / Math.sqrt(1.25), 12);
    expect(out.data[1]).toBe(0); // constant in the study: 0, as the recipe sets it
    expect(out.data[2]).toBeNaN(); // missing stays missing
    expect(out.data[3]).toBe(0);
  });

  it('fills with the study\'s median and keeps the features the study kept', () => {
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'impute', method: 'median', scope: 'global' }, { type: 'prune-constant', minVariance: 0, maxModeShare: 1 }] });
    // Medians of the study: x 2 (of 1, 2, 9), y constant 4 (pruned).
    const { frozen } = fitRecipe(Float64Array.from([1, 4, 2, 4, 9, 4]), 3, ['x', 'y'], undefined, recipe);
    expect(frozen.outputFeatures).toEqual(['x']);
    const out = applyFrozen(frozen, Float64Array.from([NaN, 1, 100, 2]), 2, undefined);
    expect(Array.from(out.data)).toEqual([2, 100]);
  });

  it('refuses a per-subject z-score on a subject with a single window', () => {
    const recipe = parseRecipe({ version: 1, steps: [{ type: 'subject-zscore' }] });
    const m = matrix(40, 5);
    const { frozen } = fitRecipe(m.data, m.n, FEATURES, m.subjects, recipe);
    const part = matrix(11, 6); // subject 0 has 10 windows, subject 1 one
    expect(() => applyFrozen(frozen, part.data, part.n, part.subjects)).toThrow(SplitSubjectError);
    try {
      applyFrozen(frozen, part.data, part.n, part.subjects);
    } catch (err) {
      expect(err).toMatchObject({ subject: 1, windows: 1, needed: 2, step: 1 });
    }
    expect(() => applyFrozen(frozen, part.data, part.n, undefined)).toThrow(/needs the subject/);
  });
});
