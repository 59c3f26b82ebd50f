import { describe, expect, it } from 'vitest';
import { clusterInWords, embedInWords, reportMetrics } from '../../../src/core/export/report-facts';
import { thousands } from '../../../src/core/export/csv';

describe('the report in words', () => {
  it('writes thousands separators whatever the locale', () => {
    expect([0, 999, 1000, 4851, 1234567, 10000000].map(thousands)).toEqual(['0', '999', '1,000', '4,851', '1,234,567', '10,000,000']);
  });

  it('says how the map and the clusters were made', () => {
    expect(embedInWords({ method: 'pca', components: 2, explainedVarianceRatio: [0.354, 0.19] })).toBe('PCA: x = PC1 (35% of variance), y = PC2 (19%)');
    expect(clusterInWords({ method: 'kmeans', k: 7, restarts: 10, maxIterations: 100, init: 'k-means++', iterations: 9, inertia: 1, converged: true }))
      .toBe('k-means, k = 7, 10 restarts (k-means++ start)');
    expect(clusterInWords({ method: 'hierarchical', linkage: 'ward', k: 8, path: 'exact', space: 'features' })).toBe('ward linkage tree, cut into 8 clusters');
  });

  it('rounds the silhouette, says what it measures and on which clusters', () => {
    const m = reportMetrics({
      windows: 4851, clusters: 7, setAside: 1,
      silhouette: { value: 0.3595366, sampleSize: 2000, curated: true },
      embed: { method: 'pca', components: 2, explainedVarianceRatio: [0.5, 0.2], trustworthiness: 0.95512 },
    });
    expect(m.map((x) => [x.name, x.value])).toEqual([['Windows', '4,851'], ['Clusters', '7'], ['Mean silhouette', '0.36'], ['Map trustworthiness', '0.955']]);
    expect(m[1].meaning).toContain('1 of them set aside');
    expect(m[2].meaning).toContain('the curated clusters, a seeded sample of 2,000 windows');
  });
});
