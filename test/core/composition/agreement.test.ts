import { describe, expect, it } from 'vitest';
import { labelAgreement } from '../../../src/core/composition/label-agreement';
import { compareRuns } from '../../../src/core/composition/run-comparison';
import { adjustedRandIndex } from '../../../src/core/metrics/ari';
import type { CategoricalColumn } from '../../../src/core/table/table';

describe('labelAgreement(clusters, label)', () => {
  // Introduction to Information Retrieval (Manning, Raghavan & Schütze), section 16.3, Figure 16.4,
  // purity 0.71 and NMI 0.36 in the book (0.70588 and 0.36456 computed from its counts). Here the 17 labelled windows sit among 9 unlabelled ones, which must not count.
  const classes = ['x', 'x', 'x', 'x', 'x', 'x', 'x', 'x', 'o', 'o', 'o', 'o', 'o', 'd', 'd', 'd', 'd'];
  const clusters = [1, 1, 1, 1, 1, 2, 3, 3, 1, 2, 2, 2, 2, 2, 3, 3, 3];
  const labelled = classes.map((c, i) => ({ c, k: clusters[i] }));
  const rows = [...labelled.slice(0, 6), { c: null, k: 1 }, { c: null, k: 2 }, ...labelled.slice(6), ...Array(7).fill({ c: null, k: 3 })] as { c: string | null; k: number }[];
  const dictionary = ['x', 'o', 'd'];
  const label: CategoricalColumn = {
    kind: 'categorical', name: 'activity_label', dictionary,
    codes: Int32Array.from(rows, (r) => (r.c === null ? -1 : dictionary.indexOf(r.c))),
  };
  const a = labelAgreement(Int32Array.from(rows, (r) => r.k), label)!;

  it('uses only the labelled windows and says so', () => {
    expect(a.labelledWindows).toBe(17);
    expect(a.totalWindows).toBe(26);
    expect(a.note).toBe('computed on the 17 of 26 windows that carry a label in "activity_label"');
  });

  it('gives the book\'s purity and NMI, and a contingency of clusters by labels', () => {
    expect(a.purity).toBeCloseTo(0.70588, 5);
    expect(a.nmi).toBeCloseTo(0.36456, 5);
    expect(a.ari).toBeCloseTo(adjustedRandIndex(clusters, classes.map((c) => dictionary.indexOf(c))), 14);
    expect(a.contingency).toEqual({ clusters: [1, 2, 3], labels: ['x', 'o', 'd'], counts: [[5, 1, 0], [1, 4, 1], [2, 0, 3]] });
    // NMI with arithmetic normalization equals the V-measure (Becker 2011; scikit-learn documents
    // the identity in its user guide, common practice).
    expect(a.vMeasure).toBeCloseTo(a.nmi, 12);
    expect(a.homogeneity > 0 && a.completeness > 0).toBe(true);
  });

  it('is null when no window carries a label', () => {
    const empty: CategoricalColumn = { kind: 'categorical', name: 'l', dictionary: [], codes: Int32Array.from([-1, -1]) };
    expect(labelAgreement([0, 1], empty)).toBeNull();
  });
});

describe('compareRuns(a, b)', () => {
  it('matches the Clustering.jl randindex example and maps each cluster to its main successor', () => {
    // JuliaStats/Clustering.jl test/randindex.jl: ARI 0.403669.
    const r = compareRuns([1, 1, 1, 2, 2, 2, 3, 3, 3, 3], [1, 1, 1, 1, 2, 2, 2, 2, 2, 2]);
    expect(Math.abs(r.ari - 0.403669)).toBeLessThan(1e-6);
    expect(r.windows).toBe(10);
    expect(r.contingency).toEqual({ a: [1, 2, 3], b: [1, 2], counts: [[3, 0], [1, 2], [0, 4]] });
    expect(r.matches).toEqual([
      { a: 1, size: 3, b: 1, share: 1 },
      { a: 2, size: 3, b: 2, share: 2 / 3 },
      { a: 3, size: 4, b: 2, share: 1 },
    ]);
    // scikit-learn normalized_mutual_info_score docstring: 0.8.
    expect(compareRuns([0, 0, 1, 2], [0, 0, 1, 1]).nmi).toBeCloseTo(0.8, 12);
    expect(() => compareRuns([0], [0, 1])).toThrow(/different numbers of windows/);
  });
});
