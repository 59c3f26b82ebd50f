/** The matrix as it passes through the recipe: features may be dropped, windows may be dropped. */
export interface RecipeState {
  /** Row-major n × d values; NaN marks a missing value. */
  data: Float64Array;
  n: number;
  d: number;
  featureNames: string[];
  /** For each remaining window, its row index in the input matrix. */
  windows: Int32Array;
  /** Subject code per remaining window (-1 = no subject), when the study has a subject column. */
  subjects?: Int32Array;
  /**
   * True when every feature's mean over its present values is exactly 0 by construction (after a
   * z-score), so that mean imputation fills with 0 without rounding.
   */
  centred: boolean;
}

/** Keeps the listed feature columns (ascending indices); returns a new state with new data. */
export function keepFeatures(s: RecipeState, keep: number[]): RecipeState {
  const d = keep.length;
  const data = new Float64Array(s.n * d);
  for (let i = 0; i < s.n; i++) {
    const src = i * s.d;
    const dst = i * d;
    for (let c = 0; c < d; c++) data[dst + c] = s.data[src + keep[c]];
  }
  return { ...s, data, d, featureNames: keep.map((j) => s.featureNames[j]) };
}

/** Keeps the listed windows (ascending positions in the current state); returns a new state. */
export function keepWindows(s: RecipeState, keep: number[]): RecipeState {
  const n = keep.length;
  const data = new Float64Array(n * s.d);
  keep.forEach((i, r) => data.set(s.data.subarray(i * s.d, i * s.d + s.d), r * s.d));
  return {
    ...s,
    data,
    n,
    windows: Int32Array.from(keep, (i) => s.windows[i]),
    subjects: s.subjects ? Int32Array.from(keep, (i) => s.subjects![i]) : undefined,
    centred: false,
  };
}
