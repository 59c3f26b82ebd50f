import { describe, expect, it } from 'vitest';
import { randIndex } from '../../../src/core/metrics/ari';
import { entropyOfCounts, labelEntropy } from '../../../src/core/metrics/entropy';
import { homogeneityCompleteness } from '../../../src/core/metrics/homogeneity';
import { mutualInfo } from '../../../src/core/metrics/mutual-info';
import { normalizedMutualInfo } from '../../../src/core/metrics/nmi';
import { purity } from '../../../src/core/metrics/purity';

// Values from scikit-learn sklearn/metrics/cluster/_supervised.py docstrings and the Introduction to
// Information Retrieval example (Manning, Raghavan & Schütze, section 16.3, Figure 16.4).

describe('entropyOfCounts and labelEntropy', () => {
  it('gives ln 2 for a fair split and 0 for one value (Shannon entropy in nats, common practice)', () => {
    expect(entropyOfCounts([3, 3])).toBeCloseTo(Math.LN2, 14);
    expect(entropyOfCounts([5, 0])).toBe(0);
    expect(entropyOfCounts([])).toBe(0);
    expect(labelEntropy([7, 7, 9, 9, 11, 11])).toBeCloseTo(Math.log(3), 14);
  });
});

describe('mutualInfo(a, b)', () => {
  it('matches the scikit-learn mutual_info_score docstring value', () => {
    // scikit-learn mutual_info_score docstring: 0.0566330 nats.
    expect(mutualInfo([0, 1, 1, 0, 1, 0], [0, 1, 0, 0, 1, 1])).toBeCloseTo(0.056633, 6);
  });
});

describe('normalizedMutualInfo(a, b)', () => {
  it('matches the scikit-learn normalized_mutual_info_score docstring values (arithmetic mean)', () => {
    expect(normalizedMutualInfo([0, 0, 1, 2], [0, 0, 1, 1])).toBeCloseTo(0.8, 12);
    expect(normalizedMutualInfo([0, 1, 2, 3], [0, 0, 1, 1])).toBeCloseTo(2 / 3, 12);
    expect(normalizedMutualInfo([0, 0, 0, 0], [0, 1, 2, 3])).toBe(0);
    expect(normalizedMutualInfo([0, 0, 0], [5, 5, 5])).toBe(1);
    expect(normalizedMutualInfo([0, 0, 1, 1], [1, 1, 0, 0])).toBeCloseTo(1, 12);
  });

  it('is symmetric', () => {
    const a = [0, 0, 1, 1, 2, 2, 2, 0];
    const b = [1, 0, 1, 1, 0, 2, 2, 2];
    expect(normalizedMutualInfo(a, b)).toBeCloseTo(normalizedMutualInfo(b, a), 14);
  });
});

describe('homogeneityCompleteness(classes, clusters)', () => {
  it('matches the scikit-learn homogeneity_completeness_v_measure docstring values', () => {
    // Quoted to two decimals ("0.71..", "0.77..", "0.73..").
    const s = homogeneityCompleteness([0, 0, 1, 1, 2, 2], [0, 0, 1, 2, 2, 2]);
    expect(Math.trunc(s.homogeneity * 100)).toBe(71);
    expect(Math.trunc(s.completeness * 100)).toBe(77);
    expect(Math.trunc(s.vMeasure * 100)).toBe(73);
  });

  it('scores a perfect clustering 1 on all three and one cluster for all 0 homogeneity', () => {
    expect(homogeneityCompleteness([0, 0, 1, 1], [5, 5, 3, 3])).toEqual({ homogeneity: 1, completeness: 1, vMeasure: 1 });
    // One cluster holding two classes: H(C|K) = H(C), homogeneity 0; completeness 1 (common practice).
    expect(homogeneityCompleteness([0, 0, 1, 1], [0, 0, 0, 0])).toMatchObject({ homogeneity: 0, completeness: 1 });
  });
});

describe('purity, NMI and Rand on the Introduction to Information Retrieval example', () => {
  // Manning, Raghavan & Schütze, Introduction to Information Retrieval, section 16.3, Figure 16.4:
  // classes x (8), o (5), ◇ (4); clusters as below. Published: purity 0.71, NMI 0.36, RI 0.68
  // (computed to more digits from the book's counts: 0.70588, 0.36456, 0.67647).
  const classes = [...Array(8).fill(1), ...Array(5).fill(2), ...Array(4).fill(3)] as number[];
  const clusters = [1, 1, 1, 1, 1, 2, 3, 3, 1, 2, 2, 2, 2, 2, 3, 3, 3];

  it('gives purity 0.70588 (12 / 17)', () => {
    expect(purity(clusters, classes)).toBeCloseTo(0.70588, 5);
    expect(purity(clusters, classes)).toBeCloseTo(12 / 17, 14);
  });

  it('gives NMI 0.36456 and Rand index 0.67647', () => {
    // The book normalizes by the arithmetic mean of the entropies, as scikit-learn does by default.
    expect(normalizedMutualInfo(clusters, classes)).toBeCloseTo(0.36456, 5);
    expect(randIndex(clusters, classes)).toBeCloseTo(0.67647, 5);
  });

  it('purity is 1 for singletons and NaN for no windows', () => {
    expect(purity([0, 1, 2], [0, 0, 0])).toBe(1);
    expect(purity([], [])).toBeNaN();
  });
});
