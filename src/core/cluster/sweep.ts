import { OptionError } from '../errors';
import type { JobContext } from '../job';
import { quietContext } from '../job';
import { calinskiHarabasz } from '../metrics/calinski-harabasz';
import { daviesBouldin } from '../metrics/davies-bouldin';
import { sampleIndices } from '../metrics/sample';
import { mean, silhouetteSamples } from '../metrics/silhouette';
import { seededRandom } from '../random';
import { kmeans } from './kmeans';

export interface SweepOptions {
  kMin: number;
  kMax: number;
  seed: number;
  /** k-means restarts per k (best inertia kept). */
  restarts: number;
  /** Windows in the seeded silhouette sample (the same sample for every k); all when n is smaller. */
  silhouetteSample: number;
  /** k-means iteration cap per restart; default 300. */
  maxIterations?: number;
  /** Relative k-means tolerance; default 1e-4. */
  tol?: number;
}

export interface SweepRow {
  k: number;
  /** Within-cluster sum of squares (the elbow curve). */
  inertia: number;
  /** Mean silhouette on the sample (higher is better). */
  silhouette: number;
  /** Variance ratio on all windows (higher is better). */
  calinskiHarabasz: number;
  /** On all windows (lower is better). */
  daviesBouldin: number;
}

function isInt(v: unknown): v is number {
  return typeof v === 'number' && Number.isInteger(v);
}

export function validateSweep(n: number, o: SweepOptions): void {
  if (!isInt(o.kMin) || o.kMin < 2) throw new OptionError('kMin', o.kMin, 'an integer of at least 2');
  if (!isInt(o.kMax) || o.kMax < o.kMin) throw new OptionError('kMax', o.kMax, `an integer of at least kMin (${o.kMin})`);
  if (o.kMax >= n) throw new OptionError('kMax', o.kMax, `less than the number of windows (${n})`);
  if (typeof o.seed !== 'number' || !Number.isFinite(o.seed)) throw new OptionError('seed', o.seed, 'a finite number');
  if (!isInt(o.restarts) || o.restarts < 1) throw new OptionError('restarts', o.restarts, 'an integer of at least 1');
  if (!isInt(o.silhouetteSample) || o.silhouetteSample < 2) throw new OptionError('silhouetteSample', o.silhouetteSample, 'an integer of at least 2');
}

/** Seed of k's run: independent of the swept range, so a row does not change with kMin or kMax. */
function seedFor(seed: number, k: number): number {
  return ((Math.floor(seed) >>> 0) ^ Math.imul(k, 0x9e3779b1)) >>> 0;
}

/**
 * k-means for every k in kMin..kMax with inertia, sampled silhouette, Calinski–Harabasz and
 * Davies–Bouldin per k. Same data, options and seed give identical rows.
 */
export async function sweepK(
  data: Float64Array, n: number, d: number, options: SweepOptions, ctx: JobContext = quietContext,
): Promise<SweepRow[]> {
  validateSweep(n, options);
  const { kMin, kMax, seed, restarts, silhouetteSample } = options;
  const maxIterations = options.maxIterations ?? 300;
  const tol = options.tol ?? 1e-4;
  const sample = sampleIndices(n, silhouetteSample, seededRandom(seed));
  const m = sample.length;
  const sampled = new Float64Array(m * d);
  for (let s = 0; s < m; s++) sampled.set(data.subarray(sample[s] * d, sample[s] * d + d), s * d);
  const sampledLabels = new Int32Array(m);
  const rows: SweepRow[] = [];
  const steps = kMax - kMin + 1;
  for (let k = kMin; k <= kMax; k++) {
    const step = k - kMin;
    const report = (f: number) => ctx.progress(`k = ${k}`, (step + 0.9 * f) / steps);
    const km = await kmeans(data, n, d, { k, restarts, maxIterations, tol, random: seededRandom(seedFor(seed, k)) }, ctx, report);
    for (let s = 0; s < m; s++) sampledLabels[s] = km.labels[sample[s]];
    const silhouette = mean(silhouetteSamples({ data: sampled, n: m, d }, sampledLabels));
    rows.push({
      k,
      inertia: km.inertia,
      silhouette,
      calinskiHarabasz: calinskiHarabasz(data, n, d, km.labels),
      daviesBouldin: daviesBouldin(data, n, d, km.labels),
    });
    ctx.progress(`k = ${k}`, (step + 1) / steps);
    await ctx.checkpoint();
  }
  return rows;
}
