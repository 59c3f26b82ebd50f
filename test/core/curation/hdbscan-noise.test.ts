import { describe, expect, it } from 'vitest';
import type { ClusterRecord } from '../../../src/core/analysis.types';
import { initialCuration } from '../../../src/core/curation';

describe('the curation of an HDBSCAN run', () => {
  it('starts with the noise cluster set aside and the dense clusters as candidates', () => {
    const record: ClusterRecord = {
      method: 'hdbscan', minClusterSize: 2, minSamples: 2, k: 3, clusters: 2, noise: 1, noiseCluster: 2, stability: [1, 1], preReduced: null, space: 'features',
    };
    const state = initialCuration(Int32Array.from([0, 0, 1, 1, 2]), 3, record);
    expect(state.clusters.map((c) => c.setAside)).toEqual([false, false, true]);
    const clean = initialCuration(Int32Array.from([0, 1]), 2, { ...record, k: 2, noise: 0, noiseCluster: null });
    expect(clean.clusters.map((c) => c.setAside)).toEqual([false, false]);
  });
});
