import type { MapQuality } from '../analysis.types';
import { sampledNeighbourhoodPreservation } from '../metrics/neighbourhood';
import { sampledTrustworthiness } from '../metrics/trustworthiness';
import type { Metric } from '../neighbors/knn.types';
import { seededRandom } from '../random';

/** Neighbours for both quality figures (k = 10, common practice for map quality). */
export const QUALITY_K = 10;
/** Windows in the seeded quality sample. */
export const QUALITY_SAMPLE = 5000;
/** Seed offset of the quality sample (its own stream, so it never shifts clustering). */
const QUALITY_SEED = 0x7a11;

/**
 * Trustworthiness and neighbourhood preservation at k = 10 of the map against the scaled features
 * (in `metric`), on one seeded sample of up to 5,000 windows (the same sample for both). NaN when
 * there are too few windows (k must stay below half the sample).
 */
export function mapQuality(
  data: Float64Array, n: number, d: number, coords: Float32Array, seed: number, metric: Metric = 'euclidean',
): MapQuality {
  const size = Math.min(n, QUALITY_SAMPLE);
  if (size <= 2 * QUALITY_K) return { trustworthiness: NaN, neighbourhoodPreservation: NaN, qualitySampleSize: size };
  const options = (): { sample: number; random: () => number; metric: Metric } => ({ sample: QUALITY_SAMPLE, random: seededRandom(seed + QUALITY_SEED), metric });
  return {
    trustworthiness: sampledTrustworthiness(data, n, d, coords, 2, QUALITY_K, options()),
    neighbourhoodPreservation: sampledNeighbourhoodPreservation(data, n, d, coords, 2, QUALITY_K, options()),
    qualitySampleSize: size,
  };
}
