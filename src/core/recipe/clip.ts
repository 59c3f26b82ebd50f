import { percentileSorted, sortedColumn } from './column-stats';

export interface ClipEffect {
  lows: Float64Array;
  highs: Float64Array;
  clippedLow: number;
  clippedHigh: number;
}

/** Clips each feature in place to its `lower` and `upper` percentiles (linear interpolation). */
export function clipInPlace(data: Float64Array, n: number, d: number, lower: number, upper: number): ClipEffect {
  const lows = new Float64Array(d);
  const highs = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    const sorted = sortedColumn(data, n, d, j);
    lows[j] = percentileSorted(sorted, lower);
    highs[j] = percentileSorted(sorted, upper);
  }
  let clippedLow = 0;
  let clippedHigh = 0;
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x < lows[j]) { data[o + j] = lows[j]; clippedLow++; }
      else if (x > highs[j]) { data[o + j] = highs[j]; clippedHigh++; }
    }
  }
  return { lows, highs, clippedLow, clippedHigh };
}
