/** Symmetric sparse affinities P in compressed-row form; the entries of all rows sum to 1. */
export interface Affinities {
  n: number;
  /** n + 1 row starts into `columns` and `values`. */
  rowStart: Int32Array;
  columns: Int32Array;
  values: Float64Array;
}

/**
 * p_ij = (p(j|i) + p(i|j)) / (2n) from the n × k conditional probabilities over each window's
 * neighbours `indices`. Row i holds i's own neighbours (in their order) followed by the windows
 * that have i as a neighbour but are not among i's neighbours, in window order: deterministic.
 */
export function symmetrize(indices: Int32Array, conditional: Float64Array, n: number, k: number): Affinities {
  const steps = symmetrizeSteps(indices, conditional, n, k);
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
  }
}

/** Rows per slice of symmetrizeSteps between its yields. */
const SYM_ROWS = 16_384;

/** symmetrize in slices of rows, yielding the fraction done after each (the same result). */
export function* symmetrizeSteps(indices: Int32Array, conditional: Float64Array, n: number, k: number): Generator<number, Affinities> {
  // Per row: k own entries, plus one per reverse edge; duplicates are merged below.
  const count = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) {
    count[i] += k;
    for (let t = 0; t < k; t++) count[indices[i * k + t]] += 1;
  }
  const start = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) start[i + 1] = start[i] + count[i];
  const cols = new Int32Array(start[n]);
  const vals = new Float64Array(start[n]);
  const fill = start.slice(0, n);
  yield 0.1;
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < k; t++) {
      const j = indices[i * k + t];
      cols[fill[i]] = j; vals[fill[i]++] = conditional[i * k + t];
    }
  }
  yield 0.2;
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < k; t++) {
      const j = indices[i * k + t];
      cols[fill[j]] = i; vals[fill[j]++] = conditional[i * k + t];
    }
    if ((i + 1) % SYM_ROWS === 0) yield 0.2 + 0.4 * ((i + 1) / n);
  }
  // Merge duplicate columns in each row with a position map (-1 = not seen in this row).
  const seen = new Int32Array(n).fill(-1);
  const rowStart = new Int32Array(n + 1);
  const columns = new Int32Array(start[n]);
  const values = new Float64Array(start[n]);
  let w = 0;
  const scale = 1 / (2 * n);
  for (let i = 0; i < n; i++) {
    rowStart[i] = w;
    for (let e = start[i]; e < start[i + 1]; e++) {
      const j = cols[e];
      if (seen[j] >= rowStart[i]) { values[seen[j]] += vals[e] * scale; continue; }
      seen[j] = w; columns[w] = j; values[w++] = vals[e] * scale;
    }
    if ((i + 1) % SYM_ROWS === 0) yield 0.6 + 0.4 * ((i + 1) / n);
  }
  rowStart[n] = w;
  return { n, rowStart, columns: columns.slice(0, w), values: values.slice(0, w) };
}

/**
 * The entries of a symmetric P above the diagonal (column j > row i), in P's row order: each pair
 * once, so the attractive forces can be summed once per pair and applied to both windows.
 */
export function upperPairs(p: Affinities): Affinities {
  const { n, rowStart, columns, values } = p;
  let count = 0;
  for (let i = 0; i < n; i++) for (let e = rowStart[i]; e < rowStart[i + 1]; e++) if (columns[e] > i) count++;
  const start = new Int32Array(n + 1);
  const cols = new Int32Array(count);
  const vals = new Float64Array(count);
  let w = 0;
  for (let i = 0; i < n; i++) {
    start[i] = w;
    for (let e = rowStart[i]; e < rowStart[i + 1]; e++) {
      if (columns[e] > i) { cols[w] = columns[e]; vals[w++] = values[e]; }
    }
  }
  start[n] = w;
  return { n, rowStart: start, columns: cols, values: vals };
}
