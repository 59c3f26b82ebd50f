/** Positions of windows (rows) whose share of missing features is at most `threshold`. */
export function windowsToKeep(data: Float64Array, n: number, d: number, threshold: number): number[] {
  const keep: number[] = [];
  for (let i = 0; i < n; i++) {
    let missing = 0;
    for (let j = 0; j < d; j++) if (data[i * d + j] !== data[i * d + j]) missing++;
    if (!(missing / d > threshold)) keep.push(i);
  }
  return keep;
}

/** Indices of features whose share of missing windows is at most `threshold`. */
export function featuresToKeep(data: Float64Array, n: number, d: number, threshold: number): number[] {
  const missing = new Int32Array(d);
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) if (data[i * d + j] !== data[i * d + j]) missing[j]++;
  const keep: number[] = [];
  for (let j = 0; j < d; j++) if (!(missing[j] / n > threshold)) keep.push(j);
  return keep;
}
