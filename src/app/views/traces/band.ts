/**
 * Median and interquartile band of aligned traces, sample by sample. Quantiles by linear
 * interpolation between order statistics (Hyndman & Fan type 7, the default of R and NumPy);
 * NaN samples (gaps, edges of a recording) are left out; a column with no value gives NaN.
 */
export interface Band {
  q1: Float32Array;
  median: Float32Array;
  q3: Float32Array;
}

export function quantileSorted(sorted: ArrayLike<number>, count: number, p: number): number {
  if (count === 0) return NaN;
  const h = (count - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(count - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** `rows` are aligned traces of equal length (sample j of each is the same time from window start). */
export function bandOf(rows: readonly Float32Array[], length: number): Band {
  const q1 = new Float32Array(length), median = new Float32Array(length), q3 = new Float32Array(length);
  const column = new Float64Array(rows.length);
  for (let j = 0; j < length; j++) {
    let m = 0;
    for (const r of rows) {
      const v = r[j];
      if (!Number.isNaN(v)) column[m++] = v;
    }
    const sorted = column.subarray(0, m).sort();
    q1[j] = quantileSorted(sorted, m, 0.25);
    median[j] = quantileSorted(sorted, m, 0.5);
    q3[j] = quantileSorted(sorted, m, 0.75);
  }
  return { q1, median, q3 };
}
