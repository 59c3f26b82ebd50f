/**
 * n fixed-size max-heaps stored flat (row i occupies [i·k, i·k + k)): the root of each row holds
 * the largest key, so a new entry is kept only when it beats the root. Empty slots have index −1
 * and key +∞. Used for neighbour lists (key = distance) and candidate lists (key = random priority).
 */
export interface FlatHeaps {
  n: number;
  k: number;
  indices: Int32Array;
  keys: Float64Array;
  /** 1 = entry not yet used in a local join ("new"), 0 = already used. */
  flags: Uint8Array;
}

export function createHeaps(n: number, k: number): FlatHeaps {
  const heaps = { n, k, indices: new Int32Array(n * k), keys: new Float64Array(n * k), flags: new Uint8Array(n * k) };
  clearHeaps(heaps);
  return heaps;
}

export function clearHeaps(h: FlatHeaps): void {
  h.indices.fill(-1);
  h.keys.fill(Infinity);
  h.flags.fill(0);
}

/**
 * Offers (key, index) to row `row`. Returns 1 when it was stored (it beat the root and the row did
 * not already hold `index`), else 0.
 */
export function heapPush(h: FlatHeaps, row: number, key: number, index: number, flag: number): number {
  const k = h.k;
  const base = row * k;
  const keys = h.keys;
  const indices = h.indices;
  if (!(key < keys[base])) return 0;
  for (let t = 0; t < k; t++) if (indices[base + t] === index) return 0;
  // Replace the root and sift the new entry down.
  let pos = 0;
  for (;;) {
    const left = 2 * pos + 1;
    if (left >= k) break;
    const right = left + 1;
    let child = left;
    if (right < k && keys[base + right] > keys[base + left]) child = right;
    if (keys[base + child] > key) {
      keys[base + pos] = keys[base + child];
      indices[base + pos] = indices[base + child];
      h.flags[base + pos] = h.flags[base + child];
      pos = child;
    } else break;
  }
  keys[base + pos] = key;
  indices[base + pos] = index;
  h.flags[base + pos] = flag;
  return 1;
}

/** True when row `row` holds `index`. */
export function heapHas(h: FlatHeaps, row: number, index: number): boolean {
  const base = row * h.k;
  for (let t = 0; t < h.k; t++) if (h.indices[base + t] === index) return true;
  return false;
}

/** Sorts rows from..to−1 (default all) ascending by key (ties: lower index first); empty slots go last. */
export function sortHeaps(h: FlatHeaps, from = 0, to = h.n): void {
  const k = h.k;
  const order = new Int32Array(k);
  const keys = new Float64Array(k);
  const idx = new Int32Array(k);
  const cmp = (a: number, b: number) => keys[a] - keys[b] || idx[a] - idx[b];
  for (let i = from; i < to; i++) {
    const base = i * k;
    for (let t = 0; t < k; t++) {
      order[t] = t;
      keys[t] = h.keys[base + t];
      idx[t] = h.indices[base + t] < 0 ? 0x7fffffff : h.indices[base + t];
    }
    order.sort(cmp);
    for (let t = 0; t < k; t++) {
      h.keys[base + t] = keys[order[t]];
      h.indices[base + t] = idx[order[t]] === 0x7fffffff ? -1 : idx[order[t]];
    }
  }
}
