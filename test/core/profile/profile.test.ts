import { describe, expect, it } from 'vitest';
import { featureHistograms } from '../../../src/core/profile/histograms';
import { profileRun } from '../../../src/core/profile/profile';

describe('profileRun', () => {
  // Two clusters of 4 windows, two features: feature 0 separates them, feature 1 does not.
  const data = Float64Array.from([0, 1, 0.1, 2, 0.2, 1, 0.3, 2, 5, 1, 5.1, 2, 5.2, 1, 5.3, 2]);
  const labels = Int32Array.from([0, 0, 0, 0, 1, 1, 1, 1]);

  it('orders the separating feature first and gives each cluster its distinguishing features', () => {
    const p = profileRun({ data, n: 8, d: 2, featureNames: ['a', 'b'], labels, k: 2 });
    expect(Array.from(p.order)).toEqual([0, 1]);
    expect(p.distinguishing[0][0].name).toBe('a');
    expect(p.distinguishing[0][0].cohensD).toBeLessThan(0);
    expect(p.distinguishing[1][0].cohensD).toBeGreaterThan(0);
    expect(p.labelAgreement).toBeNull();
    expect(p.composition.clusters.map((c) => c.size)).toEqual([4, 4]);
  });

  it('leaves windows with cluster -1 out of every figure', () => {
    const l = Int32Array.from([0, 0, 0, 0, 1, 1, 1, -1]);
    const p = profileRun({ data, n: 8, d: 2, featureNames: ['a', 'b'], labels: l, k: 2 });
    expect(p.composition.clusters.map((c) => c.size)).toEqual([4, 3]);
    const total = p.histograms.counts.reduce((s, v) => s + v, 0);
    expect(total).toBe(7 * 2);
  });
});

describe('profileRun with an index that has no window', () => {
  // A tree re-cut keeps cluster indices, so an index below the highest can be empty (as after a merge).
  const data = Float64Array.from([0, 1, 0.1, 2, 0.2, 1, 0.3, 2, 5, 1, 5.1, 2, 5.2, 1, 5.3, 2]);
  it('gives the live clusters the figures they have without the gap, and the empty one none', () => {
    const compact = profileRun({ data, n: 8, d: 2, featureNames: ['a', 'b'], labels: Int32Array.from([0, 0, 0, 0, 1, 1, 1, 1]), k: 2 });
    const gapped = profileRun({ data, n: 8, d: 2, featureNames: ['a', 'b'], labels: Int32Array.from([0, 0, 0, 0, 2, 2, 2, 2]), k: 3 });
    expect(gapped.composition.clusters.map((c) => c.size)).toEqual([4, 0, 4]);
    expect(Array.from(gapped.order)).toEqual(Array.from(compact.order));
    expect(gapped.distinguishing[0].map((f) => f.name)).toEqual(compact.distinguishing[0].map((f) => f.name));
    expect(gapped.distinguishing[2][0].cohensD).toBeCloseTo(compact.distinguishing[1][0].cohensD, 12);
    expect(Array.from(gapped.standardizedMeans.subarray(0, 2))).toEqual(Array.from(compact.standardizedMeans.subarray(0, 2)));
    expect(Array.from(gapped.standardizedMeans.subarray(4, 6))).toEqual(Array.from(compact.standardizedMeans.subarray(2, 4)));
    expect(Array.from(gapped.standardizedMeans.subarray(2, 4)).every(Number.isNaN)).toBe(true);
  });
});

describe('featureHistograms', () => {
  it('bins over the 1st–99th percentile and clamps values outside into the end bins', () => {
    const values = Float64Array.from({ length: 101 }, (_, i) => i);
    const h = featureHistograms(values, 101, 1, new Int32Array(101), 1, 10);
    expect(h.lo[0]).toBe(1);
    expect(h.hi[0]).toBe(99);
    expect(h.counts.reduce((s, v) => s + v, 0)).toBe(101);
    expect(h.counts[0]).toBeGreaterThanOrEqual(2); // 0 and 1 fall in the first bin
  });
});
