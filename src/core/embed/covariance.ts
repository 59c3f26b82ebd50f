/** Column means of a row-major n × d matrix. */
export function columnMeans(data: ArrayLike<number>, n: number, d: number): Float64Array {
  const m = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) m[j] += data[o + j];
  }
  for (let j = 0; j < d; j++) m[j] /= n;
  return m;
}

/**
 * Sample covariance (denominator n - 1) of a row-major n × d matrix around `means`, as a full
 * symmetric d × d matrix. One pass over the rows accumulating the upper triangle.
 */
export function covariance(data: ArrayLike<number>, n: number, d: number, means: Float64Array): Float64Array {
  const c = new Float64Array(d * d);
  addCovarianceRows(data, d, means, 0, n, c);
  return finishCovariance(c, d, n);
}

/**
 * Adds rows [from, to) to the upper triangle of `sums` (d × d, products of centred values). Callers
 * that must stay responsive feed the rows in slices, in order (the sums are then the same).
 */
export function addCovarianceRows(data: ArrayLike<number>, d: number, means: Float64Array, from: number, to: number, sums: Float64Array): void {
  // Four rows at a time: each sum is loaded and stored once per four rows (memory traffic on the
  // d × d sums, not arithmetic, bounds this loop).
  const r0 = new Float64Array(d), r1 = new Float64Array(d), r2 = new Float64Array(d), r3 = new Float64Array(d);
  let i = from;
  for (; i + 4 <= to; i += 4) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const m = means[j];
      r0[j] = data[o + j] - m;
      r1[j] = data[o + d + j] - m;
      r2[j] = data[o + 2 * d + j] - m;
      r3[j] = data[o + 3 * d + j] - m;
    }
    for (let a = 0; a < d; a++) {
      const x0 = r0[a], x1 = r1[a], x2 = r2[a], x3 = r3[a];
      const ca = a * d;
      for (let b = a; b < d; b++) sums[ca + b] += x0 * r0[b] + x1 * r1[b] + x2 * r2[b] + x3 * r3[b];
    }
  }
  for (; i < to; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) r0[j] = data[o + j] - means[j];
    for (let a = 0; a < d; a++) {
      const xa = r0[a];
      if (xa === 0) continue;
      const ca = a * d;
      for (let b = a; b < d; b++) sums[ca + b] += xa * r0[b];
    }
  }
}

/** Turns the upper-triangle sums of n rows into the full covariance matrix (in place). */
export function finishCovariance(sums: Float64Array, d: number, n: number): Float64Array {
  const denom = n > 1 ? n - 1 : 1;
  for (let a = 0; a < d; a++) {
    for (let b = a; b < d; b++) {
      const v = sums[a * d + b] / denom;
      sums[a * d + b] = v;
      sums[b * d + a] = v;
    }
  }
  return sums;
}
