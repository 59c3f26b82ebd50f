import { normal, seededRandom } from '../src/core/random';

export interface Blobs {
  data: Float64Array;
  n: number;
  d: number;
  truth: Int32Array;
}

/**
 * Seeded Gaussian blobs: k centres drawn from N(0, spread²) per feature, unit-variance noise
 * around them, windows assigned to blobs in turn. With spread 0.5 at d = 40 the blobs touch a
 * little, so k-means has some work to do.
 */
export function gaussianBlobs(n: number, d: number, k: number, seed: number, spread = 0.5): Blobs {
  const random = seededRandom(seed);
  const centres = new Float64Array(k * d);
  for (let i = 0; i < centres.length; i++) centres[i] = spread * normal(random) * 4;
  const data = new Float64Array(n * d);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const c = Math.floor(random() * k);
    truth[i] = c;
    for (let j = 0; j < d; j++) data[i * d + j] = centres[c * d + j] + normal(random) * (1 + j / d);
  }
  return { data, n, d, truth };
}
