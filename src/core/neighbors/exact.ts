import { OptionError } from '../errors';
import { quietContext, type JobContext } from '../job';
import type { Knn, Metric } from './knn.types';

/** Query rows handled together: their features stay in cache while every row streams past once. */
const BLOCK = 32;
/** Rows between checkpoints of the asynchronous search. */
const ROWS_PER_SLICE = 512;

/**
 * Exact k nearest neighbours by blocked brute force (O(n² d)). Asynchronous: awaits
 * ctx.checkpoint() every 512 query rows so a job can be cancelled, and reports nothing itself.
 * Ties in distance go to the lower index, so the result is fully deterministic.
 */
export async function exactKnn(
  data: Float64Array, n: number, d: number, k: number, metric: Metric, ctx: JobContext = quietContext,
): Promise<Knn> {
  const search = exactKnnSearch(data, n, d, k, metric);
  for (let from = 0; from < n; from += ROWS_PER_SLICE) {
    await ctx.checkpoint();
    search.rows(from, Math.min(n, from + ROWS_PER_SLICE));
  }
  return search.finish();
}

/** The same search without checkpoints, for small inputs and tests. */
export function exactKnnSync(data: Float64Array, n: number, d: number, k: number, metric: Metric): Knn {
  const search = exactKnnSearch(data, n, d, k, metric);
  search.rows(0, n);
  return search.finish();
}

export interface KnnSearch {
  rows(from: number, to: number): void;
  finish(): Knn;
}

/** A search that fills rows [from, to) per call, so that a driver can slice the work. */
export function exactKnnSearch(data: Float64Array, n: number, d: number, k: number, metric: Metric): KnnSearch {
  if (!Number.isInteger(k) || k < 1 || k > n - 1) throw new OptionError('k', k, `an integer from 1 to n - 1 = ${n - 1}`);
  if (metric !== 'euclidean' && metric !== 'cosine') throw new OptionError('metric', metric, '"euclidean" or "cosine"');
  if (data.length < n * d) throw new OptionError('data length', data.length, `at least n × d = ${n * d}`);
  const x = metric === 'cosine' ? unitRows(data, n, d) : data;
  const indices = new Int32Array(n * k);
  // Squared Euclidean distances while searching (on unit rows for cosine); converted in finish().
  const distances = new Float64Array(n * k);
  const heapD = new Float64Array(BLOCK * k);
  const heapI = new Int32Array(BLOCK * k);
  const size = new Int32Array(BLOCK);
  return {
    rows(from, to) {
      for (let b0 = from; b0 < to; b0 += BLOCK) {
        const b1 = Math.min(to, b0 + BLOCK);
        size.fill(0);
        for (let j = 0; j < n; j++) {
          const oj = j * d;
          for (let q = b0; q < b1; q++) {
            if (q === j) continue;
            const h = q - b0;
            const worst = size[h] === k ? heapD[h * k] : Infinity;
            const oq = q * d;
            let s = 0;
            for (let t = 0; t < d; t++) { const diff = x[oq + t] - x[oj + t]; s += diff * diff; }
            // Rows are visited in index order, so an equal distance never displaces an earlier index.
            if (s < worst) size[h] = heapPush(heapD, heapI, h * k, size[h], k, s, j);
          }
        }
        for (let q = b0; q < b1; q++) heapDrain(heapD, heapI, (q - b0) * k, k, distances, indices, q * k);
      }
    },
    finish() {
      for (let t = 0; t < distances.length; t++) {
        distances[t] = metric === 'cosine' ? distances[t] / 2 : Math.sqrt(distances[t]);
      }
      return { n, k, indices, distances };
    },
  };
}

/** Rows scaled to unit length (a zero row stays zero): squared distance / 2 = 1 − cos. */
function unitRows(data: Float64Array, n: number, d: number): Float64Array {
  const out = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let t = 0; t < d; t++) s += data[i * d + t] ** 2;
    const inv = s > 0 ? 1 / Math.sqrt(s) : 0;
    for (let t = 0; t < d; t++) out[i * d + t] = data[i * d + t] * inv;
  }
  return out;
}

/**
 * Max-heap on (distance, index) at heap offset o with `size` entries, capacity k. Pushes (dist, idx)
 * when there is room, or replaces the root otherwise. Returns the new size.
 */
function heapPush(hd: Float64Array, hi: Int32Array, o: number, size: number, k: number, dist: number, idx: number): number {
  let pos: number;
  if (size < k) {
    pos = size++;
    while (pos > 0) {
      const parent = (pos - 1) >> 1;
      if (!after(hd[o + parent], hi[o + parent], dist, idx)) {
        hd[o + pos] = hd[o + parent]; hi[o + pos] = hi[o + parent]; pos = parent;
      } else break;
    }
  } else {
    pos = 0;
    for (;;) {
      let c = 2 * pos + 1;
      if (c >= size) break;
      if (c + 1 < size && after(hd[o + c + 1], hi[o + c + 1], hd[o + c], hi[o + c])) c++;
      if (after(hd[o + c], hi[o + c], dist, idx)) { hd[o + pos] = hd[o + c]; hi[o + pos] = hi[o + c]; pos = c; } else break;
    }
  }
  hd[o + pos] = dist; hi[o + pos] = idx;
  return size;
}

/** True when (d1, i1) ranks after (d2, i2): farther, or equally far with a higher index. */
function after(d1: number, i1: number, d2: number, i2: number): boolean {
  return d1 > d2 || (d1 === d2 && i1 > i2);
}

/** Writes a full heap out nearest first. */
function heapDrain(
  hd: Float64Array, hi: Int32Array, o: number, k: number, outD: Float64Array, outI: Int32Array, oo: number,
): void {
  const order = Array.from({ length: k }, (_, t) => t);
  order.sort((a, b) => hd[o + a] - hd[o + b] || hi[o + a] - hi[o + b]);
  for (let t = 0; t < k; t++) { outD[oo + t] = hd[o + order[t]]; outI[oo + t] = hi[o + order[t]]; }
}
