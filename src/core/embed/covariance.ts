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
  const row = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) row[j] = data[o + j] - means[j];
    for (let a = 0; a < d; a++) {
      const xa = row[a];
      if (xa === 0) continue;
      const ca = a * d;
      for (let b = a; b < d; b++) c[ca + b] += xa * row[b];
    }
  }
  const denom = n > 1 ? n - 1 : 1;
  for (let a = 0; a < d; a++) {
    for (let b = a; b < d; b++) {
      const v = c[a * d + b] / denom;
      c[a * d + b] = v;
      c[b * d + a] = v;
    }
  }
  return c;
}
