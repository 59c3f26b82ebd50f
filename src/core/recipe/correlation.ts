/**
 * Pearson correlation of every pair of columns, d × d row-major. Missing values count as the
 * column mean (they add nothing to the cross products), so with missing data r is shrunk toward 0.
 * A column with zero spread correlates 0 with everything (and 1 with itself). Costs n·d²/2
 * multiply-adds: meant for d up to a few hundred.
 */
export function correlationMatrix(data: Float64Array, n: number, d: number): Float64Array {
  const mean = new Float64Array(d);
  const count = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) {
      const x = data[i * d + j];
      if (x === x) { mean[j] += x; count[j]++; }
    }
  }
  for (let j = 0; j < d; j++) mean[j] = count[j] > 0 ? mean[j] / count[j] : 0;
  const cross = new Float64Array(d * d);
  const row = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) {
      const x = data[i * d + j];
      row[j] = x === x ? x - mean[j] : 0;
    }
    for (let a = 0; a < d; a++) {
      const ra = row[a];
      if (ra === 0) continue;
      const o = a * d;
      for (let b = a; b < d; b++) cross[o + b] += ra * row[b];
    }
  }
  const r = new Float64Array(d * d);
  for (let a = 0; a < d; a++) {
    r[a * d + a] = 1;
    for (let b = a + 1; b < d; b++) {
      const den = Math.sqrt(cross[a * d + a] * cross[b * d + b]);
      const v = den > 0 ? Math.max(-1, Math.min(1, cross[a * d + b] / den)) : 0;
      r[a * d + b] = v;
      r[b * d + a] = v;
    }
  }
  return r;
}
