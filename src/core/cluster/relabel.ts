export interface Relabelled {
  labels: Int32Array;
  centres: Float64Array;
  sizes: Int32Array;
}

/**
 * Renumbers clusters by decreasing size, ties by the first window that belongs to them, so that
 * cluster ids do not depend on seeding order. Centres are permuted to match.
 */
export function relabelBySize(labels: Int32Array, centres: Float64Array, k: number, d: number): Relabelled {
  const counts = new Int32Array(k);
  const first = new Int32Array(k).fill(labels.length);
  for (let i = 0; i < labels.length; i++) {
    const c = labels[i];
    counts[c]++;
    if (first[c] > i) first[c] = i;
  }
  const order = Array.from({ length: k }, (_, c) => c).sort((a, b) => counts[b] - counts[a] || first[a] - first[b] || a - b);
  const newId = new Int32Array(k);
  order.forEach((old, id) => { newId[old] = id; });
  const out = new Int32Array(labels.length);
  for (let i = 0; i < labels.length; i++) out[i] = newId[labels[i]];
  const sorted = new Float64Array(k * d);
  const sizes = new Int32Array(k);
  order.forEach((old, id) => {
    sorted.set(centres.subarray(old * d, old * d + d), id * d);
    sizes[id] = counts[old];
  });
  return { labels: out, centres: sorted, sizes };
}
