import { describe, expect, it } from 'vitest';
import { cohensD, momentsOf } from '../../../src/core/fingerprints/cohens-d';
import { distinguishingFeatures, fingerprints } from '../../../src/core/fingerprints/fingerprints';
import { kruskalWallis } from '../../../src/core/fingerprints/kruskal-wallis';
import { averageRanks } from '../../../src/core/fingerprints/ranks';
import { irisMatrix } from '../iris';

const groupsOf = (...sizes: number[]) => Int32Array.from(sizes.flatMap((s, g) => Array<number>(s).fill(g)));

describe('averageRanks(values)', () => {
  it('gives tied values their average rank (scipy.stats.rankdata method="average", common practice)', () => {
    const r = averageRanks([10, 20, 10, 30, 20, 20]);
    expect(Array.from(r.ranks)).toEqual([1.5, 4, 1.5, 6, 4, 4]);
    expect(r.tieSum).toBe(6 + 24); // (2³ - 2) + (3³ - 3)
  });
});

describe('kruskalWallis(values, groups, k)', () => {
  it('matches the scipy.stats.kruskal docstring examples', () => {
    // SciPy 1.17.1 kruskal docstring: x = [1,3,5,7,9], y = [2,4,6,8,10] -> H 0.2727272727272734,
    // p 0.6015081344405895; x = [1,1,1], y = [2,2,2], z = [2,2] -> H 7.0, p 0.0301973834223185.
    const a = kruskalWallis([1, 3, 5, 7, 9, 2, 4, 6, 8, 10], groupsOf(5, 5), 2);
    expect(a.h).toBeCloseTo(0.2727272727272734, 12);
    expect(a.pValue).toBeCloseTo(0.6015081344405895, 12);
    const b = kruskalWallis([1, 1, 1, 2, 2, 2, 2, 2], groupsOf(3, 3, 2), 3);
    expect(b.h).toBeCloseTo(7, 12);
    expect(b.dof).toBe(2);
    expect(b.pValue).toBeCloseTo(0.0301973834223185, 12);
  });

  it('corrects for ties as scipy.stats.kruskal does and leaves out NaN values', () => {
    // scipy.stats.kruskal([1,2,2,3,5],[2,2,4,6,6,7],[3,3,3,8,9]), SciPy 1.17.1 (computed):
    // H 3.6221547799696485, p 0.16347791242297496.
    const values = [1, 2, 2, 3, 5, NaN, 2, 2, 4, 6, 6, 7, 3, 3, 3, 8, 9];
    const groups = [0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2];
    const r = kruskalWallis(values, groups, 3);
    expect(r.n).toBe(16);
    expect(r.h).toBeCloseTo(3.6221547799696485, 12);
    expect(r.pValue).toBeCloseTo(0.16347791242297496, 12);
  });

  it('is NaN when all values tie or only one group has values', () => {
    expect(kruskalWallis([4, 4, 4, 4], groupsOf(2, 2), 2).h).toBeNaN();
    expect(kruskalWallis([1, 2, 3], groupsOf(3), 2).h).toBeNaN();
  });
});

describe('cohensD(a, b)', () => {
  it('divides the mean difference by the pooled (ddof 1) standard deviation', () => {
    // Cohen (1988), d with pooled sd; value computed with NumPy 2.4.6:
    // a = [2,4,4,4,5,5,7,9], b = [1,2,3] -> 1.5434872662825796.
    expect(cohensD(momentsOf([2, 4, 4, 4, 5, 5, 7, 9]), momentsOf([1, 2, 3]))).toBeCloseTo(1.5434872662825796, 12);
    expect(cohensD(momentsOf([1, 2, 3]), momentsOf([2, 4, 4, 4, 5, 5, 7, 9]))).toBeCloseTo(-1.5434872662825796, 12);
    expect(cohensD(momentsOf([3, 3]), momentsOf([3, 3]))).toBe(0);
    expect(cohensD(momentsOf([]), momentsOf([1, 2]))).toBeNaN();
  });
});

describe('fingerprints on iris with the species as clusters', () => {
  const iris = irisMatrix();
  const fp = fingerprints(iris.data, iris.n, iris.d, iris.species, 3, iris.featureNames);

  it('gives the standardized class means of the R/Fisher iris data', () => {
    // Class means of the R/Fisher iris data (R datasets::iris: setosa 5.006, 3.428, 1.462, 0.246 ...),
    // overall means (5.843333, 3.057333, 3.758, 1.199333) and ddof-0 sds (0.8253013,
    // 0.4344110, 1.7594041, 0.7596926) computed with NumPy 2.4.6.
    const classMeans = [[5.006, 3.428, 1.462, 0.246], [5.936, 2.77, 4.26, 1.326], [6.588, 2.974, 5.552, 2.026]];
    const grand = [5.843333333, 3.057333333, 3.758, 1.199333333];
    const sd = [0.82530129, 0.43441097, 1.75940407, 0.75969263];
    for (let c = 0; c < 3; c++) {
      for (let j = 0; j < 4; j++) {
        expect(fp.moments.means[c * 4 + j]).toBeCloseTo(classMeans[c][j], 9);
        expect(fp.standardizedMeans[c * 4 + j]).toBeCloseTo((classMeans[c][j] - grand[j]) / sd[j], 6);
      }
    }
    // NumPy 2.4.6 (computed): setosa standardized petal length -1.30498732.
    expect(fp.standardizedMeans[2]).toBeCloseTo(-1.30498732, 7);
  });

  it('orders features by Kruskal–Wallis H: petal width, petal length, sepal length, sepal width', () => {
    // R kruskal.test(x ~ Species) on iris (from memory) and scipy.stats.kruskal, SciPy 1.17.1
    // (computed): sepal length 96.93743600064833, sepal width 63.571146104163795, petal length
    // 130.41104857977163, petal width 131.18537974024488.
    const h = [96.93743600064833, 63.571146104163795, 130.41104857977163, 131.18537974024488];
    fp.separation.forEach((s, j) => expect(s.h).toBeCloseTo(h[j], 8));
    expect(fp.order).toEqual([3, 2, 0, 1]);
    // SciPy 1.17.1 (computed): p for petal width 3.261795552421968e-29.
    expect(fp.separation[3].pValue / 3.261795552421968e-29).toBeCloseTo(1, 6);
    for (const s of fp.separation) expect(s.etaSquared > 0 && s.etaSquared < 1).toBe(true);
  });

  it('names petal measurements as what sets setosa apart, with Cohen\'s d against the rest', () => {
    const top = distinguishingFeatures(fp, 0, 2);
    expect(top.map((t) => t.name).sort()).toEqual(['petal_length', 'petal_width']);
    const petal = distinguishingFeatures(fp, 0, 4).find((t) => t.name === 'petal_length')!;
    // Setosa against versicolor + virginica, pooled ddof-1 sd: NumPy 2.4.6 (computed) -5.045609531325876.
    expect(petal.cohensD).toBeCloseTo(-5.045609531325876, 9);
    expect(petal.meanIn).toBeCloseTo(1.462, 9);
    expect(petal.meanOut).toBeCloseTo((4.26 + 5.552) / 2, 9);
    expect(() => distinguishingFeatures(fp, 3)).toThrow(/no cluster 3/);
  });
});
