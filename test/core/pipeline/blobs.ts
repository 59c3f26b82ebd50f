import type { FeatureMatrix } from '../../../src/core/analysis.types';
import { normal, seededRandom } from '../../../src/core/random';

/** Seeded Gaussian blobs: `perBlob` windows around each of `blobs` centres 8 apart, in d features; subjects cycle 0..3. */
export function blobs(blobCount: number, perBlob: number, d: number, seed = 7): FeatureMatrix & { truth: Int32Array } {
  const random = seededRandom(seed);
  const n = blobCount * perBlob;
  const data = new Float64Array(n * d);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const b = i % blobCount;
    truth[i] = b;
    for (let j = 0; j < d; j++) data[i * d + j] = (j % blobCount === b ? 8 : 0) + normal(random);
  }
  const subjectCodes = Int32Array.from({ length: n }, (_, i) => Math.floor(i / 7) % 4);
  return { data, n, d, featureNames: Array.from({ length: d }, (_, j) => `f${j}`), subjectCodes, truth };
}
