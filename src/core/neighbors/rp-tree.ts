import type { Random } from '../random';

/** The leaves of one random-projection tree: row ids grouped leaf by leaf. */
export interface RpLeaves {
  /** A permutation of 0..n−1; leaf t holds order[starts[t] .. starts[t + 1]). */
  order: Int32Array;
  /** Leaf boundaries into `order`, length leaves + 1. */
  starts: Int32Array;
}

/**
 * One random-projection tree over the rows of x (n × d, row-major): each node draws two distinct
 * rows, splits its rows by the hyperplane halfway between them (perpendicular to their
 * difference) and recurses until a node holds at most `leafSize` rows. Rows on the hyperplane,
 * and nodes whose rows all fall on one side, are split at random. Rows close together tend to
 * share a leaf, which makes the leaves a cheap first guess at each row's neighbours.
 */
export function rpTreeLeaves(x: Float64Array, n: number, d: number, leafSize: number, random: Random): RpLeaves {
  const steps = rpTreeSteps(x, n, d, leafSize, random);
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
  }
}

/** Rows partitioned between the yields of rpTreeSteps (a slice of work between checkpoints). */
const ROWS_PER_YIELD = 16_384;

/** rpTreeLeaves awaiting `checkpoint` between slices of its work (the same leaves). */
export async function rpTreeLeavesAsync(
  x: Float64Array, n: number, d: number, leafSize: number, random: Random, checkpoint: () => Promise<void>,
): Promise<RpLeaves> {
  const steps = rpTreeSteps(x, n, d, leafSize, random);
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
    await checkpoint();
  }
}

/** The tree built node by node, yielding once about ROWS_PER_YIELD rows have been partitioned. */
function* rpTreeSteps(x: Float64Array, n: number, d: number, leafSize: number, random: Random): Generator<void, RpLeaves> {
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const side = new Uint8Array(n);
  const normal = new Float64Array(d);
  const starts: number[] = [];
  let work = 0;
  // Explicit stack of [lo, hi) ranges; pushed right first so leaves come out left to right.
  const stack: number[] = [0, n];
  while (stack.length > 0) {
    const hi = stack.pop() as number;
    const lo = stack.pop() as number;
    if (hi - lo <= leafSize) {
      starts.push(lo);
      continue;
    }
    const mid = splitRange(x, d, order, lo, hi, side, normal, random);
    stack.push(mid, hi, lo, mid);
    work += hi - lo;
    if (work >= ROWS_PER_YIELD) {
      work = 0;
      yield;
    }
  }
  starts.sort((a, b) => a - b);
  starts.push(n);
  return { order, starts: Int32Array.from(starts) };
}

/** Partitions order[lo..hi) in place by a random hyperplane; returns the first index of the right part. */
function splitRange(
  x: Float64Array, d: number, order: Int32Array, lo: number, hi: number,
  side: Uint8Array, normal: Float64Array, random: Random,
): number {
  const size = hi - lo;
  const a = order[lo + Math.floor(random() * size)];
  let b = order[lo + Math.floor(random() * (size - 1))];
  if (b === a) b = order[hi - 1];
  let offset = 0;
  for (let t = 0; t < d; t++) {
    const xa = x[a * d + t];
    const xb = x[b * d + t];
    normal[t] = xa - xb;
    offset -= normal[t] * (xa + xb) * 0.5;
  }
  let left = 0;
  for (let p = lo; p < hi; p++) {
    const o = order[p] * d;
    let margin = offset;
    for (let t = 0; t < d; t++) margin += normal[t] * x[o + t];
    const s = margin > 0 ? 0 : margin < 0 ? 1 : random() < 0.5 ? 0 : 1;
    side[p - lo] = s;
    if (s === 0) left++;
  }
  if (left === 0 || left === size) {
    // Degenerate split (duplicate rows, or a and b identical): halve the node at random.
    left = 0;
    for (let p = 0; p < size; p++) {
      side[p] = random() < 0.5 ? 0 : 1;
      if (side[p] === 0) left++;
    }
    if (left === 0 || left === size) {
      for (let p = 0; p < size; p++) side[p] = p < size >> 1 ? 0 : 1;
      left = size >> 1;
    }
  }
  // Stable two-way partition through a scratch copy of the range.
  const scratch = order.slice(lo, hi);
  let l = lo;
  let r = lo + left;
  for (let p = 0; p < size; p++) {
    if (side[p] === 0) order[l++] = scratch[p];
    else order[r++] = scratch[p];
  }
  return lo + left;
}
