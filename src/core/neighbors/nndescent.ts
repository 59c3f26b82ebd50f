import { OptionError } from '../errors';
import { quietContext, type JobContext } from '../job';
import type { Random } from '../random';
import { clearHeaps, createHeaps, heapHas, heapPush, sortHeaps, type FlatHeaps } from './heap';
import type { Knn, Metric } from './knn.types';
import { metricRows, toMetricDistances } from './rows';
import { rpTreeLeavesAsync } from './rp-tree';

export interface ApproximateKnnOptions {
  metric: Metric;
  random: Random;
  ctx?: JobContext;
  /** Random-projection trees for the starting graph; default 5 + round(n^0.25), at most 32. */
  trees?: number;
  /** Upper bound on NN-descent rounds; default max(5, round(log2 n)). */
  maxIterations?: number;
  /** Stop when a round improves fewer than delta · n · k entries; default 0.001. */
  delta?: number;
  /** Candidates (new and old each) joined per row and round; default min(60, searched k). */
  maxCandidates?: number;
}

/** Up to this many rows the search is done exactly by brute force (cheaper than building trees). */
const BRUTE_FORCE_MAX_N = 1024;
/**
 * Rows per slice of work between checkpoints (tree leaves, candidate sampling, local join, final
 * sort), so a cancel is seen within a slice: a local join of 1,024 rows at k = 46, d = 50 is well
 * under 0.1 s of CPU.
 */
const ROWS_PER_SLICE = 1024;

/**
 * Approximate k nearest neighbours (self excluded, nearest first) by NN-descent: a starting graph
 * from the leaves of a forest of random-projection trees, then rounds of "local joins" in which
 * the neighbours (and reverse neighbours) of each row are compared with one another, since a
 * neighbour of a neighbour is likely a neighbour. Works on squared Euclidean distance (on unit rows
 * for cosine), converted to the metric at the end. Seeded through `random`: the same input and
 * seed give the same graph. Awaits ctx.checkpoint() between slices and reports
 * progress('neighbours', fraction).
 */
export async function approximateKnn(
  data: Float64Array, n: number, d: number, k: number, options: ApproximateKnnOptions,
): Promise<Knn> {
  validate(data, n, d, k, options);
  const ctx = options.ctx ?? quietContext;
  const x = metricRows(data, n, d, options.metric);
  // Search a few more neighbours than asked: the extra slots carry good candidates between rounds.
  const kk = Math.min(n - 1, Math.max(k, Math.ceil(k * 1.34)));
  const heaps = createHeaps(n, kk);
  if (n <= BRUTE_FORCE_MAX_N) {
    bruteForce(x, n, d, heaps);
  } else {
    const trees = options.trees ?? Math.min(32, 5 + Math.round(n ** 0.25));
    const leafSize = Math.max(10, kk);
    for (let t = 0; t < trees; t++) {
      await ctx.checkpoint();
      const leaves = await rpTreeLeavesAsync(x, n, d, leafSize, options.random, () => ctx.checkpoint());
      const { order, starts } = leaves;
      // Slices of whole leaves holding about ROWS_PER_SLICE rows each, a checkpoint before each.
      for (let leaf = 0; leaf + 1 < starts.length;) {
        let end = leaf + 1;
        while (end + 1 < starts.length && starts[end] - starts[leaf] < ROWS_PER_SLICE) end++;
        await ctx.checkpoint();
        joinLeaves(x, d, heaps, order, starts, leaf, end);
        leaf = end;
      }
      ctx.progress('neighbours', (0.3 * (t + 1)) / trees);
    }
    fillRandom(x, n, d, heaps, options.random);
    const rounds = options.maxIterations ?? Math.max(5, Math.round(Math.log2(n)));
    const delta = options.delta ?? 0.001;
    const maxCandidates = options.maxCandidates ?? Math.min(60, kk);
    const fresh = createHeaps(n, maxCandidates);
    const old = createHeaps(n, maxCandidates);
    for (let round = 0; round < rounds; round++) {
      clearHeaps(fresh);
      clearHeaps(old);
      for (let from = 0; from < n; from += ROWS_PER_SLICE) {
        await ctx.checkpoint();
        sampleCandidates(heaps, fresh, old, options.random, from, Math.min(n, from + ROWS_PER_SLICE));
      }
      for (let from = 0; from < n; from += ROWS_PER_SLICE) {
        await ctx.checkpoint();
        markUsed(heaps, fresh, from, Math.min(n, from + ROWS_PER_SLICE));
      }
      let updates = 0;
      for (let from = 0; from < n; from += ROWS_PER_SLICE) {
        await ctx.checkpoint();
        updates += localJoin(x, d, heaps, fresh, old, from, Math.min(n, from + ROWS_PER_SLICE));
      }
      ctx.progress('neighbours', 0.3 + (0.7 * (round + 1)) / rounds);
      if (updates <= delta * n * kk) break;
    }
  }
  for (let from = 0; from < n; from += ROWS_PER_SLICE) {
    await ctx.checkpoint();
    sortHeaps(heaps, from, Math.min(n, from + ROWS_PER_SLICE));
  }
  ctx.progress('neighbours', 1);
  return toKnn(heaps, k, options.metric);
}

function validate(data: Float64Array, n: number, d: number, k: number, options: ApproximateKnnOptions): void {
  if (!Number.isInteger(n) || n < 2) throw new OptionError('n', n, 'an integer of at least 2 rows');
  if (!Number.isInteger(d) || d < 1) throw new OptionError('d', d, 'an integer of at least 1 feature');
  if (!Number.isInteger(k) || k < 1 || k > n - 1) throw new OptionError('k', k, `an integer from 1 to n - 1 = ${n - 1}`);
  if (data.length < n * d) throw new OptionError('data length', data.length, `at least n × d = ${n * d}`);
  if (options.metric !== 'euclidean' && options.metric !== 'cosine') {
    throw new OptionError('metric', options.metric, '"euclidean" or "cosine"');
  }
  for (let i = 0; i < n * d; i++) {
    if (!Number.isFinite(data[i])) {
      throw new OptionError(`value at row ${Math.floor(i / d) + 1}, feature ${(i % d) + 1}`, data[i], 'a finite number (fill missing values first)');
    }
  }
}

function sqDist(x: Float64Array, a: number, b: number, d: number): number {
  const oa = a * d;
  const ob = b * d;
  let s = 0;
  for (let t = 0; t < d; t++) {
    const diff = x[oa + t] - x[ob + t];
    s += diff * diff;
  }
  return s;
}

function bruteForce(x: Float64Array, n: number, d: number, heaps: FlatHeaps): void {
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const s = sqDist(x, i, j, d);
      heapPush(heaps, i, s, j, 1);
      heapPush(heaps, j, s, i, 1);
    }
  }
}

/** Every pair of rows sharing a leaf (leaves firstLeaf..endLeaf−1) is offered to both rows' lists. */
function joinLeaves(
  x: Float64Array, d: number, heaps: FlatHeaps, order: Int32Array, starts: Int32Array, firstLeaf: number, endLeaf: number,
): void {
  const keys = heaps.keys;
  const k = heaps.k;
  for (let leaf = firstLeaf; leaf < endLeaf; leaf++) {
    const end = starts[leaf + 1];
    for (let p = starts[leaf]; p < end; p++) {
      const a = order[p];
      for (let q = p + 1; q < end; q++) {
        const b = order[q];
        const s = sqDist(x, a, b, d);
        if (s < keys[a * k]) heapPush(heaps, a, s, b, 1);
        if (s < keys[b * k]) heapPush(heaps, b, s, a, 1);
      }
    }
  }
}

/** Rows whose lists are not full yet (tiny leaves) get random rows. */
function fillRandom(x: Float64Array, n: number, d: number, heaps: FlatHeaps, random: Random): void {
  const k = heaps.k;
  for (let i = 0; i < n; i++) {
    let tries = 0;
    while (heaps.indices[i * k] < 0 && tries < 8 * k) {
      tries++;
      const j = Math.floor(random() * n);
      if (j !== i) heapPush(heaps, i, sqDist(x, i, j, d), j, 1);
    }
  }
}

/**
 * Offers the neighbours of rows from..to−1 to `fresh` and `old` (new and already joined ones apart),
 * each also as a reverse neighbour of the row it was found in, with a random priority: run over all
 * rows in order (after clearing both), each row keeps a random subset of at most their capacity.
 */
function sampleCandidates(heaps: FlatHeaps, fresh: FlatHeaps, old: FlatHeaps, random: Random, from: number, to: number): void {
  const { k, indices, flags } = heaps;
  for (let i = from; i < to; i++) {
    for (let t = 0; t < k; t++) {
      const j = indices[i * k + t];
      if (j < 0) continue;
      const priority = random();
      const target = flags[i * k + t] ? fresh : old;
      heapPush(target, i, priority, j, 0);
      heapPush(target, j, priority, i, 0);
    }
  }
}

/** Marks as used the new entries of rows from..to−1 that made it into their row's `fresh` list. */
function markUsed(heaps: FlatHeaps, fresh: FlatHeaps, from: number, to: number): void {
  const { k, indices, flags } = heaps;
  for (let i = from; i < to; i++) {
    for (let t = 0; t < k; t++) {
      const e = i * k + t;
      if (flags[e] && heapHas(fresh, i, indices[e])) flags[e] = 0;
    }
  }
}

/** Compares new candidates of rows from..to−1 with each other and with old ones. Returns the improvements. */
function localJoin(
  x: Float64Array, d: number, heaps: FlatHeaps, fresh: FlatHeaps, old: FlatHeaps, from: number, to: number,
): number {
  const c = fresh.k;
  const k = heaps.k;
  const keys = heaps.keys;
  let updates = 0;
  for (let i = from; i < to; i++) {
    const base = i * c;
    for (let p = 0; p < c; p++) {
      const a = fresh.indices[base + p];
      if (a < 0) continue;
      for (let q = p + 1; q < c; q++) {
        const b = fresh.indices[base + q];
        if (b < 0) continue;
        const s = sqDist(x, a, b, d);
        if (s < keys[a * k]) updates += heapPush(heaps, a, s, b, 1);
        if (s < keys[b * k]) updates += heapPush(heaps, b, s, a, 1);
      }
      for (let q = 0; q < c; q++) {
        const b = old.indices[base + q];
        if (b < 0 || b === a) continue;
        const s = sqDist(x, a, b, d);
        if (s < keys[a * k]) updates += heapPush(heaps, a, s, b, 1);
        if (s < keys[b * k]) updates += heapPush(heaps, b, s, a, 1);
      }
    }
  }
  return updates;
}

/** The first k entries of each sorted row, with distances in the metric. */
function toKnn(heaps: FlatHeaps, k: number, metric: Metric): Knn {
  const { n } = heaps;
  const kk = heaps.k;
  const indices = new Int32Array(n * k);
  const distances = new Float64Array(n * k);
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < k; t++) {
      indices[i * k + t] = heaps.indices[i * kk + t];
      distances[i * k + t] = heaps.keys[i * kk + t];
    }
  }
  toMetricDistances(distances, metric);
  return { n, k, indices, distances };
}
