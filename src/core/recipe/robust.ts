import { medianSorted, percentileSorted, sortedColumn } from './column-stats';

export interface RobustEffect {
  centres: Float64Array;
  scales: Float64Array;
  /** Features whose spread was 0; they are centred but not divided (scale 1). */
  zeroSpreadFeatures: number[];
}

/**
 * Robust scaling in place, as scikit-learn's RobustScaler: (x - median) / (q_hi - q_lo) with
 * linearly interpolated percentiles over present values; a zero spread is replaced by 1.
 * Missing values stay missing.
 */
export function robustScaleInPlace(data: Float64Array, n: number, d: number, range: [number, number] = [25, 75]): RobustEffect {
  const centres = new Float64Array(d);
  const scales = new Float64Array(d);
  const zeroSpreadFeatures: number[] = [];
  for (let j = 0; j < d; j++) {
    const sorted = sortedColumn(data, n, d, j);
    centres[j] = medianSorted(sorted);
    const spread = percentileSorted(sorted, range[1]) - percentileSorted(sorted, range[0]);
    if (spread > 0) scales[j] = spread;
    else { scales[j] = 1; zeroSpreadFeatures.push(j); }
  }
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) data[o + j] = (x - centres[j]) / scales[j];
    }
  }
  return { centres, scales, zeroSpreadFeatures };
}
