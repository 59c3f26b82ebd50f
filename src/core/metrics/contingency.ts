export interface Contingency {
  /** Distinct values of the first labelling, ascending (the rows). */
  rows: number[];
  /** Distinct values of the second labelling, ascending (the columns). */
  cols: number[];
  /** counts[r][c]: windows with a = rows[r] and b = cols[c]. */
  counts: number[][];
}

/** Cross-tabulates two labellings of the same windows. */
export function contingency(a: ArrayLike<number>, b: ArrayLike<number>): Contingency {
  if (a.length !== b.length) throw new Error(`labellings differ in length: ${a.length} and ${b.length}`);
  const rows = [...new Set(Array.from(a))].sort((x, y) => x - y);
  const cols = [...new Set(Array.from(b))].sort((x, y) => x - y);
  const ri = new Map(rows.map((v, i) => [v, i]));
  const ci = new Map(cols.map((v, i) => [v, i]));
  const counts = rows.map(() => new Array<number>(cols.length).fill(0));
  for (let i = 0; i < a.length; i++) counts[ri.get(a[i])!][ci.get(b[i])!]++;
  return { rows, cols, counts };
}
