export interface MinMaxEffect {
  mins: Float64Array;
  maxs: Float64Array;
  /** Features with max = min (or no values); they become 0. */
  constantFeatures: number[];
}

/** (x - min) / (max - min) per feature in place, to [0, 1]; missing values stay missing. */
export function minMaxInPlace(data: Float64Array, n: number, d: number): MinMaxEffect {
  const mins = new Float64Array(d).fill(Infinity);
  const maxs = new Float64Array(d).fill(-Infinity);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x < mins[j]) mins[j] = x;
      if (x > maxs[j]) maxs[j] = x;
    }
  }
  const constantFeatures: number[] = [];
  const inv = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    if (maxs[j] > mins[j]) inv[j] = 1 / (maxs[j] - mins[j]);
    else constantFeatures.push(j);
  }
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) data[o + j] = inv[j] === 0 ? 0 : Math.min(1, (x - mins[j]) * inv[j]);
    }
  }
  return { mins, maxs, constantFeatures };
}
