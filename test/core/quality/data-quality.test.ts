import { describe, expect, it } from 'vitest';
import { dataQuality } from '../../../src/core/quality/data-quality';
import { correlationMatrix } from '../../../src/core/recipe/correlation';
import { seededRandom } from '../../../src/core/random';

describe('correlationMatrix(data, n, d)', () => {
  it('gives Pearson r: x = [1..5], y = [2,4,5,4,5] -> 6 / sqrt(60) (computed by hand)', () => {
    const x = [1, 2, 3, 4, 5];
    const y = [2, 4, 5, 4, 5];
    const r = correlationMatrix(Float64Array.from(x.flatMap((v, i) => [v, y[i]])), 5, 2);
    expect(r[1]).toBeCloseTo(6 / Math.sqrt(60), 12);
    expect(r[2]).toBe(r[1]);
    expect([r[0], r[3]]).toEqual([1, 1]);
  });
});

describe('dataQuality(matrix, subjectCodes, subjectNames)', () => {
  // 200 windows, 4 subjects (50 each), features: a (noise), copy (= 3a - 1), flat (0 in 98% of
  // windows), gappy (missing for all of subject S3 and 2 more windows), spiky (noise + 3 huge values).
  const n = 200;
  const d = 5;
  const random = seededRandom(11);
  const data = new Float64Array(n * d);
  const subjects = Int32Array.from({ length: n }, (_, i) => Math.floor(i / 50));
  for (let i = 0; i < n; i++) {
    const a = random() * 2 - 1;
    data.set([a, 3 * a - 1, i < 196 ? 0 : 1, subjects[i] === 3 || i < 2 ? NaN : random(), random() * 2 - 1], i * d);
  }
  for (const i of [10, 70, 130]) data[i * d + 4] = 1000;
  const q = dataQuality({ data, n, d, featureNames: ['a', 'copy', 'flat', 'gappy', 'spiky'] }, subjects, ['S0', 'S1', 'S2', 'S3']);

  it('reports missingness per feature and per subject × feature, with a fix', () => {
    expect(q.missing.perFeature[3]).toBeCloseTo(52 / 200, 12);
    expect(q.missing.subjects).toEqual(['S0', 'S1', 'S2', 'S3']);
    expect(q.missing.perSubject[0 * d + 3]).toBeCloseTo(2 / 50, 12);
    expect(q.missing.perSubject[3 * d + 3]).toBe(1);
    expect(q.missing.perSubject[3 * d + 0]).toBe(0);
    expect(q.missing.total).toBe(52);
    expect(q.missing.issues).toEqual([
      expect.objectContaining({ feature: 'gappy', fix: { type: 'impute', method: 'median', scope: 'subject' } }),
    ]);
  });

  it('finds the near-constant feature, the correlated pair and the extreme values', () => {
    expect(q.nearConstant.map((f) => f.feature)).toEqual(['flat']);
    expect(q.nearConstant[0].modeShare).toBeCloseTo(0.98, 12);
    expect(q.nearConstant[0].fix.type).toBe('prune-constant');
    expect(q.correlated.map((p) => [p.a, p.b])).toEqual([['a', 'copy']]);
    expect(q.correlated[0].r).toBeCloseTo(1, 12);
    expect(q.correlated[0].fix).toEqual({ type: 'prune-correlated', threshold: 0.95 });
    const spiky = q.extremes.find((e) => e.feature === 'spiky');
    expect(spiky?.count).toBe(3);
    expect(spiky?.fix).toEqual({ type: 'clip', lower: 1, upper: 99 });
    // "flat" is handled as near-constant: its MAD and IQR are 0, so no value counts as extreme.
    expect(q.extremes.some((e) => e.feature === 'flat')).toBe(false);
  });

  it('proposes dropping a feature missing in most windows, and log1p for a one-sided tail', () => {
    const m = 100;
    const x = new Float64Array(m * 2);
    const r = seededRandom(5);
    for (let i = 0; i < m; i++) x.set([i < 70 ? NaN : r(), i === 0 ? 500 : r()], i * 2);
    const q2 = dataQuality({ data: x, n: m, d: 2, featureNames: ['rare', 'energy'] });
    expect(q2.missing.issues[0]).toMatchObject({ feature: 'rare', fix: { type: 'drop-missing', axis: 'features', threshold: 0.5 } });
    expect(q2.missing.subjects).toEqual([]);
    expect(q2.extremes[0]).toMatchObject({ feature: 'energy', count: 1, fix: { type: 'log', mode: 'log1p', features: ['energy'] } });
  });
});
