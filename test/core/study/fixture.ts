import type { AnalysisResult } from '../../../src/core/analysis.types';
import type { Study } from '../../../src/core/study/study.types';

/** A small hand-made study: one input, one run of 6 windows in 2 clusters, some curation. */
export function smallStudy(): Study {
  const result: AnalysisResult = {
    recipe: [{ step: 'zscore', params: {}, effect: { features: 2 } }],
    embed: { method: 'pca', components: 2, explainedVarianceRatio: [0.8, 0.2] },
    coords: Float32Array.from([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11]),
    cluster: { method: 'kmeans', k: 2, restarts: 2, maxIterations: 10, init: 'k-means++', iterations: 3, inertia: 1.25, converged: true },
    labels: Int32Array.from([0, 0, 1, 1, 0, 1]),
    confidence: Float32Array.from([0.9, 0.5, 0.25, 1, 0.125, 0.75]),
    centroids: Float64Array.from([0.1, 0.2, -0.1, -0.2]),
    sizes: Int32Array.from([3, 3]),
    metrics: { silhouette: NaN, silhouetteSampleSize: 6 },
  };
  return {
    schemaVersion: 1,
    app: { name: 'Gleaner', version: '0.0.0-test' },
    inputs: [{ fileName: 'w.csv', path: 'data/w.csv', sha256: 'ab'.repeat(32), rows: 6 }],
    runs: [{
      id: 'run-1',
      input: 0,
      roles: [{ name: 'f1', role: 'feature', evidence: '' }],
      params: { k: 2, seed: 3, restarts: 2, maxIterations: 10, silhouetteSample: 2000 },
      result,
      curation: {
        actions: [
          { type: 'promote', cluster: 0, className: 'walking' },
          { type: 'move', windows: Int32Array.from([5]), to: 0 },
          { type: 'split', cluster: 1, k: 2, parts: Int32Array.from([0, 1]) },
        ],
        undone: [{ type: 'colour', cluster: 1, colour: '#0072b2' }],
      },
      flags: [{ cluster: 1, flag: 'subject-bound' }],
      createdAt: '2026-01-02T03:04:05.000Z',
    }],
    activeRun: 0,
    notes: 'first look, "quotes" and ünïcode',
    view: { colourBy: 'cluster', transform: { x: 0.5, y: -1, scale: Infinity } },
  };
}
