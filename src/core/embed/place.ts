import { OptionError } from '../errors';
import { quietContext, type JobContext } from '../job';
import type { Random } from '../random';
import { grouped } from '../progress/format';

/**
 * Sample then place, for studies too large to embed whole: embed a seeded sample stratified by
 * subject, then put every other window at the inverse-distance weighted mean of the map positions
 * of its k nearest sampled windows in feature space (k-nearest-neighbour regression of the
 * coordinates; common practice for out-of-sample points of a non-parametric map).
 */

/** Neighbours averaged to place a window (common practice: a handful to a dozen). */
export const PLACE_NEIGHBOURS = 10;
/** Windows placed between checkpoints. */
const ROWS_PER_SLICE = 256;

/**
 * m window indices (ascending) drawn without replacement, stratified by subject: each subject
 * contributes in proportion to its windows (largest-remainder rounding, at least one window per
 * subject while m allows), drawn uniformly within the subject. Windows without a subject (code -1)
 * form one stratum. All windows when m ≥ n.
 */
export function stratifiedSample(n: number, m: number, subjectCodes: Int32Array | undefined, random: Random): Int32Array {
  if (!Number.isInteger(m) || m < 1) throw new OptionError('sample size', m, 'an integer of at least 1');
  if (m >= n) return Int32Array.from({ length: n }, (_, i) => i);
  const strata = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const s = subjectCodes ? subjectCodes[i] : -1;
    let list = strata.get(s);
    if (!list) strata.set(s, (list = []));
    list.push(i);
  }
  const keys = [...strata.keys()].sort((a, b) => a - b);
  const quota = keys.map((key) => (strata.get(key)!.length * m) / n);
  const take = quota.map((q) => Math.floor(q));
  let left = m - take.reduce((a, b) => a + b, 0);
  // Every subject gets at least one window while the budget allows, then the largest remainders.
  for (let s = 0; s < keys.length && left > 0; s++) if (take[s] === 0) { take[s] = 1; left--; }
  const byRemainder = keys.map((_, s) => s).sort((a, b) => (quota[b] - take[b]) - (quota[a] - take[a]) || a - b);
  for (let t = 0; left > 0 && t < byRemainder.length; t++) {
    const s = byRemainder[t];
    if (take[s] < strata.get(keys[s])!.length) { take[s]++; left--; }
  }
  const out: number[] = [];
  keys.forEach((key, s) => {
    const pool = strata.get(key)!;
    for (let i = 0; i < take[s]; i++) {
      const j = i + Math.floor(random() * (pool.length - i));
      const t = pool[i]; pool[i] = pool[j]; pool[j] = t;
      out.push(pool[i]);
    }
  });
  return Int32Array.from(out).sort();
}

export interface PlaceOptions {
  /** Neighbours averaged; default PLACE_NEIGHBOURS. */
  k?: number;
  /** Progress is reported as (stage 'placing', fraction); checkpoints between slices. */
  ctx?: JobContext;
}

/**
 * Map positions of all n windows: sampled windows keep their embedded position (`sampleCoords`,
 * 2 per sampled window, in `sample` order); every other window gets the weighted mean of the
 * positions of its k nearest sampled windows in `data` (n × d, Euclidean), weights 1 / distance
 * (a window that coincides with a sampled one takes its position). Exact brute force,
 * O((n − m) · m · d). Returns the coordinates and the placed mask (1 = placed).
 */
export async function placeWindows(
  data: Float64Array, n: number, d: number, sample: Int32Array, sampleCoords: Float32Array, options: PlaceOptions = {},
): Promise<{ coords: Float32Array; placed: Uint8Array }> {
  const m = sample.length;
  const k = Math.min(options.k ?? PLACE_NEIGHBOURS, m);
  const ctx = options.ctx ?? quietContext;
  if (!Number.isInteger(k) || k < 1) throw new OptionError('place neighbours', options.k, 'an integer of at least 1');
  if (sampleCoords.length !== 2 * m) throw new Error(`placeWindows: ${sampleCoords.length / 2} sample positions for ${m} sampled windows`);
  const coords = new Float32Array(2 * n);
  const placed = new Uint8Array(n).fill(1);
  const ref = new Float64Array(m * d);
  for (let s = 0; s < m; s++) {
    const i = sample[s];
    placed[i] = 0;
    coords[2 * i] = sampleCoords[2 * s];
    coords[2 * i + 1] = sampleCoords[2 * s + 1];
    ref.set(data.subarray(i * d, i * d + d), s * d);
  }
  const bestD = new Float64Array(k);
  const bestI = new Int32Array(k);
  const todo = n - m;
  let done = 0;
  ctx.progress('placing', 0, `0 / ${grouped(todo)} windows`);
  for (let from = 0; from < n; from += ROWS_PER_SLICE) {
    const to = Math.min(n, from + ROWS_PER_SLICE);
    for (let i = from; i < to; i++) {
      if (!placed[i]) continue;
      nearest(data, i * d, ref, m, d, k, bestD, bestI);
      let wx = 0, wy = 0, wSum = 0;
      if (bestD[0] === 0) {
        wx = sampleCoords[2 * bestI[0]]; wy = sampleCoords[2 * bestI[0] + 1]; wSum = 1;
      } else {
        for (let t = 0; t < k; t++) {
          const w = 1 / Math.sqrt(bestD[t]);
          wx += w * sampleCoords[2 * bestI[t]];
          wy += w * sampleCoords[2 * bestI[t] + 1];
          wSum += w;
        }
      }
      coords[2 * i] = wx / wSum;
      coords[2 * i + 1] = wy / wSum;
      done++;
    }
    ctx.progress('placing', todo > 0 ? done / todo : 1, `${grouped(done)} / ${grouped(todo)} windows`);
    await ctx.checkpoint();
  }
  return { coords, placed };
}

/** The k nearest reference rows of the row at data[off..off+d) by squared distance (ties: lower index), ascending. */
function nearest(
  data: Float64Array, off: number, ref: Float64Array, m: number, d: number, k: number, bestD: Float64Array, bestI: Int32Array,
): void {
  bestD.fill(Infinity);
  bestI.fill(-1);
  for (let s = 0; s < m; s++) {
    let dist = 0;
    const r = s * d;
    for (let j = 0; j < d; j++) {
      const diff = data[off + j] - ref[r + j];
      dist += diff * diff;
    }
    if (dist >= bestD[k - 1]) continue;
    let t = k - 1;
    while (t > 0 && bestD[t - 1] > dist) {
      bestD[t] = bestD[t - 1];
      bestI[t] = bestI[t - 1];
      t--;
    }
    bestD[t] = dist;
    bestI[t] = s;
  }
}
