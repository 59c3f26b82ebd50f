import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS } from '../../src/core/analysis.types';
import { meanSilhouette } from '../../src/core/metrics/silhouette';
import { labelsSilhouette } from '../../src/worker/silhouette-job';

// Six points in two tight groups on a line, and one window moved by hand (curation) into the other group.
const data = Float64Array.from([0, 0.1, 0.2, 5, 5.1, 5.2]);
const params = { ...DEFAULT_ANALYSIS_PARAMS, silhouetteSample: 2000, seed: 7 };

describe('labelsSilhouette (the silhouette of curated labels)', () => {
  it('equals the mean silhouette of every window when the sample covers the table', () => {
    const labels = Int32Array.from([0, 0, 0, 1, 1, 1]);
    const r = labelsSilhouette(data, 6, 1, labels, params);
    expect(r.silhouetteSampleSize).toBe(6);
    // meanSilhouette is checked against scikit-learn in test/core/metrics/silhouette.test.ts.
    expect(r.silhouette).toBe(meanSilhouette({ data, n: 6, d: 1 }, labels));
    expect(r.silhouette).toBeGreaterThan(0.9);
  });

  it('follows the curation: a window moved to the wrong group lowers it; an emptied index changes nothing', () => {
    const moved = labelsSilhouette(data, 6, 1, Int32Array.from([0, 0, 1, 1, 1, 1]), params).silhouette;
    expect(moved).toBeLessThan(labelsSilhouette(data, 6, 1, Int32Array.from([0, 0, 0, 1, 1, 1]), params).silhouette);
    // Index 1 emptied by a merge: labels 0 and 2 are the same partition as 0 and 1.
    expect(labelsSilhouette(data, 6, 1, Int32Array.from([0, 0, 0, 2, 2, 2]), params).silhouette)
      .toBe(labelsSilhouette(data, 6, 1, Int32Array.from([0, 0, 0, 1, 1, 1]), params).silhouette);
  });

  it('samples with the run\'s seed: the same labels give the same figure', () => {
    const n = 300;
    const big = Float64Array.from({ length: n }, (_, i) => (i % 3) * 10 + (i % 7) * 0.1);
    const labels = Int32Array.from({ length: n }, (_, i) => i % 3);
    const small = { ...params, silhouetteSample: 50 };
    const a = labelsSilhouette(big, n, 1, labels, small);
    expect(a.silhouetteSampleSize).toBe(50);
    expect(labelsSilhouette(big, n, 1, labels, small)).toEqual(a);
  });

  it('refuses labels of another length', () => {
    expect(() => labelsSilhouette(data, 6, 1, new Int32Array(5), params)).toThrow(/one label per analysed window \(6\)/);
  });
});
