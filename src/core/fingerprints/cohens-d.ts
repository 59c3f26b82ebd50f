/** Count, mean and sum of squared deviations of one sample. */
export interface Moments {
  n: number;
  mean: number;
  /** Σ (x - mean)². */
  ss: number;
}

/**
 * Cohen's d of sample a against sample b: (mean a - mean b) / pooled standard deviation, the
 * pooled variance being (ss a + ss b) / (n a + n b - 2). NaN when either sample is empty or the
 * pooled spread is 0 (and the means differ); 0 when both means and spreads agree.
 */
export function cohensD(a: Moments, b: Moments): number {
  if (a.n < 1 || b.n < 1 || a.n + b.n < 3) return NaN;
  const diff = a.mean - b.mean;
  const pooled = Math.sqrt((a.ss + b.ss) / (a.n + b.n - 2));
  if (pooled > 0) return diff / pooled;
  return diff === 0 ? 0 : NaN;
}

/** Moments of a plain sample (NaN values left out). */
export function momentsOf(xs: ArrayLike<number>): Moments {
  let n = 0;
  let sum = 0;
  for (let i = 0; i < xs.length; i++) if (xs[i] === xs[i]) { n++; sum += xs[i]; }
  const mean = n > 0 ? sum / n : NaN;
  let ss = 0;
  for (let i = 0; i < xs.length; i++) if (xs[i] === xs[i]) ss += (xs[i] - mean) ** 2;
  return { n, mean, ss };
}
