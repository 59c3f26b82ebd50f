/**
 * Shannon entropy, in nats, of a distribution given as counts (zeros ignored). 0 for an empty
 * or single-valued distribution.
 */
export function entropyOfCounts(counts: ArrayLike<number>): number {
  let total = 0;
  for (let i = 0; i < counts.length; i++) total += counts[i];
  if (total <= 0) return 0;
  let h = 0;
  for (let i = 0; i < counts.length; i++) {
    const c = counts[i];
    if (c > 0) h -= (c / total) * Math.log(c / total);
  }
  return h > 0 ? h : 0;
}

/** Shannon entropy, in nats, of a labelling (the distribution of its values). */
export function labelEntropy(labels: ArrayLike<number>): number {
  const counts = new Map<number, number>();
  for (let i = 0; i < labels.length; i++) counts.set(labels[i], (counts.get(labels[i]) ?? 0) + 1);
  return entropyOfCounts([...counts.values()]);
}

/** Row and column sums of a contingency table, and its total. */
export function margins(counts: readonly (readonly number[])[]): { rows: number[]; cols: number[]; total: number } {
  const rows = counts.map((r) => r.reduce((s, v) => s + v, 0));
  const cols = new Array<number>(counts[0]?.length ?? 0).fill(0);
  for (const r of counts) r.forEach((v, j) => { cols[j] += v; });
  return { rows, cols, total: rows.reduce((s, v) => s + v, 0) };
}
