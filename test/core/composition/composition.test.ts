import { describe, expect, it } from 'vitest';
import { boundRule, judgeBound } from '../../../src/core/composition/bound-rule';
import { categoriesOf, withMissingAsValue } from '../../../src/core/composition/categories';
import { clusterMix } from '../../../src/core/composition/cluster-mix';
import { composeColumn } from '../../../src/core/composition/compose-column';
import { OptionError } from '../../../src/core/errors';
import type { CategoricalColumn, NumericColumn } from '../../../src/core/table/table';

function text(name: string, values: (string | null)[]): CategoricalColumn {
  const dictionary = [...new Set(values.filter((v): v is string => v !== null))];
  return { kind: 'categorical', name, dictionary, codes: Int32Array.from(values, (v) => (v === null ? -1 : dictionary.indexOf(v))) };
}

describe('categoriesOf(column, n)', () => {
  it('reads text and numeric columns as categories, missing as -1', () => {
    const t = categoriesOf(text('pid', ['b', 'a', null, 'b']), 4);
    expect(t.names).toEqual(['b', 'a']);
    expect(Array.from(t.codes)).toEqual([0, 1, -1, 0]);
    const num: NumericColumn = { kind: 'numeric', name: 'pid', values: Float64Array.from([12, 3, NaN, 12]) };
    const c = categoriesOf(num, 4);
    expect(c.names).toEqual(['3', '12']);
    expect(Array.from(c.codes)).toEqual([1, 0, -1, 1]);
    expect(Array.from(withMissingAsValue(c).codes)).toEqual([1, 0, 2, 1]);
    expect(withMissingAsValue(c).names).toEqual(['3', '12', '']);
    expect(categoriesOf(undefined, 2)).toEqual({ codes: new Int32Array(2), names: [''] });
  });
});

describe('clusterMix(labels, k, categories)', () => {
  it('gives top share, effective values (exp entropy) and entropy normalized by ln(cohort values)', () => {
    const cats = categoriesOf(text('pid', ['S1', 'S1', 'S2', 'S2', 'S2', 'S3', 'S3', 'S1']), 8);
    const mix = clusterMix([0, 0, 0, 1, 1, 1, 2, 9], 3, cats);
    expect(mix.cohort).toMatchObject({ windows: 7, values: 3 });
    const c0 = mix.clusters[0];
    expect(c0).toMatchObject({ id: 0, size: 3, top: 'S1', values: 2, byValue: [{ value: 'S1', windows: 2 }, { value: 'S2', windows: 1 }] });
    expect(c0.topShare).toBeCloseTo(2 / 3, 14);
    // Shares (2/3, 1/3): H = 0.636514 nats, exp(H) = 1.889882, H / ln 3 = 0.579380 (computed by hand).
    expect(c0.effectiveValues).toBeCloseTo(1.8898816, 6);
    expect(c0.entropy).toBeCloseTo(0.6365142 / Math.log(3), 6);
    expect(mix.clusters[2]).toMatchObject({ size: 1, top: 'S3', topShare: 1, effectiveValues: 1, entropy: 0 });
    expect(mix.counts).toEqual([[2, 1, 0], [0, 2, 1], [0, 0, 1]]);
  });

  it('reports an empty cluster as size 0 with no top value', () => {
    const mix = clusterMix([0, 0], 2, categoriesOf(undefined, 2));
    expect(mix.clusters[1]).toMatchObject({ size: 0, top: '', topShare: 0, values: 0, effectiveValues: 0, entropy: 0 });
  });
});

describe('the subject-bound rule', () => {
  const cohort = { windows: 1000, values: 10, effectiveValues: 10 };
  const cluster = (byValue: [string, number][]) => {
    const size = byValue.reduce((s, [, w]) => s + w, 0);
    const h = -byValue.reduce((s, [, w]) => s + (w / size) * Math.log(w / size), 0);
    return {
      id: 0, size, top: byValue[0][0], topShare: byValue[0][1] / size, values: byValue.length,
      effectiveValues: Math.exp(h), entropy: h / Math.log(10), byValue: byValue.map(([value, windows]) => ({ value, windows })),
    };
  };

  it('flags a cluster whose effective subjects are at most 35% of the cohort\'s, and names its subjects', () => {
    const v = judgeBound(cluster([['S4', 60], ['S9', 38], ['S1', 2]]), cohort, boundRule());
    expect(v.bound).toBe(true);
    expect(v.effectiveShare).toBeLessThan(0.35);
    expect(v.reason).toMatch(/^2\.\d effective subjects against 10\.0 in the cohort \(2\d% ≤ 35%\); subjects S4, S9 hold 98% of its 100 windows$/);
  });

  it('does not flag a cluster spread over the cohort, and says why', () => {
    const v = judgeBound(cluster(Array.from({ length: 10 }, (_, i): [string, number] => [`S${i}`, 10])), cohort, boundRule());
    expect(v.bound).toBe(false);
    expect(v.effectiveShare).toBeCloseTo(1, 12);
    expect(v.reason).toBe('10.0 effective subjects against 10.0 in the cohort (100% > 35%)');
  });

  it('moves with its threshold setting and leaves small clusters unjudged', () => {
    const c = cluster([['S1', 25], ['S2', 25], ['S3', 25], ['S4', 25]]); // 4 of 10 effective
    expect(judgeBound(c, cohort, boundRule()).bound).toBe(false);
    expect(judgeBound(c, cohort, boundRule({ maxEffectiveShare: 0.5 })).bound).toBe(true);
    const small = judgeBound(cluster([['S1', 5]]), cohort, boundRule());
    expect(small).toMatchObject({ bound: false, reason: 'not judged: 5 windows, fewer than the 20 the rule needs' });
    expect(judgeBound(cluster([['S1', 50]]), { windows: 50, values: 1, effectiveValues: 1 }, boundRule()).bound).toBe(false);
  });

  it('rejects a threshold outside (0, 1) or a bad minimum size', () => {
    expect(() => boundRule({ maxEffectiveShare: 1.5 })).toThrow(OptionError);
    expect(() => boundRule({ maxEffectiveShare: 0 })).toThrow(/maxEffectiveShare/);
    expect(() => boundRule({ minWindows: 0.5 })).toThrow(/minWindows/);
  });
});

describe('composeColumn(labels, k, column)', () => {
  it('adds NMI, Cramér\'s V and the chi-square test between clusters and the column', () => {
    // Cluster 0 = S1 only; clusters 1 and 2 share S2 and S3 evenly: [[30, 0, 0], [0, 15, 15], [0, 15, 15]].
    const subjects: string[] = [];
    const labels: number[] = [];
    const add = (c: number, s: string, w: number) => { for (let i = 0; i < w; i++) { labels.push(c); subjects.push(s); } };
    add(0, 'S1', 30); add(1, 'S2', 15); add(1, 'S3', 15); add(2, 'S2', 15); add(2, 'S3', 15);
    const comp = composeColumn(labels, 3, text('pid', subjects), { minWindows: 10 }, 'subject');
    // scipy.stats.chi2_contingency([[30,0,0],[0,15,15],[0,15,15]]), SciPy 1.17.1 (computed):
    // statistic 90.0, dof 4, p 1.316758547052716e-18; association(method="cramer") 0.7071067811865476.
    expect(comp.chiSquare.statistic).toBeCloseTo(90, 10);
    expect(comp.chiSquare.dof).toBe(4);
    expect(comp.chiSquare.pValue / 1.316758547052716e-18).toBeCloseTo(1, 8);
    expect(comp.cramersV).toBeCloseTo(0.7071067811865476, 12);
    // Clusters and subjects each hold 30 + 30 + 30 windows: H = ln 3 on both sides; knowing the cluster
    // leaves 1 bit (ln 2) about the subject in two thirds of the windows: I = ln 3 - (2/3) ln 2; NMI =
    // I / mean(H), the arithmetic normalization of scikit-learn normalized_mutual_info_score (by hand).
    expect(comp.nmi).toBeCloseTo((Math.log(3) - (2 / 3) * Math.LN2) / Math.log(3), 12);
    expect(comp.column).toBe('pid');
    expect(comp.clusters[0]).toMatchObject({ top: 'S1', topShare: 1, effectiveValues: 1, bound: true });
    expect(comp.clusters[0].boundReason).toMatch(/subject S1 holds 100% of its 30 windows/);
    expect(comp.clusters[1].bound).toBe(false);
    expect(comp.rule).toEqual({ maxEffectiveShare: 0.35, minWindows: 10 });
  });

  it('counts missing cells as one value named "" and uses the given noun', () => {
    const comp = composeColumn([0, 0, 0, 1], 2, text('device', ['a', null, null, 'a']), { minWindows: 1 }, 'device');
    expect(comp.clusters[0].byValue).toEqual([{ value: '', windows: 2 }, { value: 'a', windows: 1 }]);
    expect(comp.clusters[1].boundReason).toMatch(/effective devices/);
  });
});
