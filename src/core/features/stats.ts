/**
 * Summary statistics over a slice of a flat array. Textbook definitions; the standard deviation is
 * the population one (divide by n, NumPy's default ddof = 0), so a window's SD does not depend on
 * treating the window as a sample of something larger.
 */

type Samples = ArrayLike<number>;

export function mean(x: Samples, start = 0, end = x.length): number {
  let s = 0;
  for (let i = start; i < end; i++) s += x[i];
  return s / (end - start);
}

/** Population standard deviation (ddof = 0), two-pass for accuracy. */
export function sdPopulation(x: Samples, start = 0, end = x.length): number {
  const m = mean(x, start, end);
  let ss = 0;
  for (let i = start; i < end; i++) {
    const d = x[i] - m;
    ss += d * d;
  }
  return Math.sqrt(ss / (end - start));
}

/** max − min. */
export function range(x: Samples, start = 0, end = x.length): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = start; i < end; i++) {
    const v = x[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  // A NaN sample makes both comparisons false; report it rather than a finite range.
  for (let i = start; i < end; i++) if (Number.isNaN(x[i])) return NaN;
  return hi - lo;
}

/**
 * Percentile `p` (0..100) of ascending-sorted values by linear interpolation between closest ranks
 * (position p/100 · (n − 1); NumPy's default method "linear").
 */
export function percentileSorted(sorted: Samples, p: number, n = sorted.length): number {
  const pos = (p / 100) * (n - 1);
  const lo = Math.floor(pos);
  const hi = Math.min(lo + 1, n - 1);
  const frac = pos - lo;
  return sorted[lo] + (sorted[hi] - sorted[lo]) * frac;
}

/**
 * Pearson correlation of x[start..end) and y[start..end). Undefined when either slice is constant;
 * we return 0 then (no linear association can be measured), so a still axis never yields NaN.
 */
export function pearson(x: Samples, y: Samples, start = 0, end = x.length): number {
  const mx = mean(x, start, end);
  const my = mean(y, start, end);
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = start; i < end; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  if (Number.isNaN(sxy)) return NaN;
  if (sxx === 0 || syy === 0) return 0;
  const r = sxy / Math.sqrt(sxx * syy);
  return Math.max(-1, Math.min(1, r));
}
