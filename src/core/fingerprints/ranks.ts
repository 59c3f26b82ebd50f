export interface Ranks {
  /** 1-based ranks, ties given their average rank, in the input order. */
  ranks: Float64Array;
  /** Σ (t³ - t) over groups of t tied values, for tie corrections. */
  tieSum: number;
}

/** Average ranks of `values` (no NaN expected). */
export function averageRanks(values: ArrayLike<number>): Ranks {
  const n = values.length;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => values[a] - values[b] || a - b);
  const ranks = new Float64Array(n);
  let tieSum = 0;
  for (let i = 0; i < n;) {
    let j = i + 1;
    while (j < n && values[order[j]] === values[order[i]]) j++;
    const rank = (i + 1 + j) / 2;
    for (let t = i; t < j; t++) ranks[order[t]] = rank;
    const t = j - i;
    tieSum += t * t * t - t;
    i = j;
  }
  return { ranks, tieSum };
}
