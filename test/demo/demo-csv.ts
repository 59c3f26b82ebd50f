import { readFileSync } from 'node:fs';

/** Read one of the generator's own CSVs (no quoting, no commas inside fields) into header + rows. */
export function readDemoCsv(path: string): { header: string[]; rows: string[][] } {
  const lines = readFileSync(path, 'utf8').split('\n');
  if (lines.at(-1) === '') lines.pop();
  return { header: lines[0].split(','), rows: lines.slice(1).map((l) => l.split(',')) };
}

/** Adjusted Rand index of two labelings (Hubert & Arabie 1985), for checking the planted structure. */
export function adjustedRand(a: ArrayLike<number | string>, b: ArrayLike<number | string>): number {
  const n = a.length;
  const pairs = new Map<string, number>();
  const rowSums = new Map<string, number>();
  const colSums = new Map<string, number>();
  const add = (m: Map<string, number>, k: string) => m.set(k, (m.get(k) ?? 0) + 1);
  for (let i = 0; i < n; i++) {
    add(pairs, `${a[i]}\u0000${b[i]}`);
    add(rowSums, String(a[i]));
    add(colSums, String(b[i]));
  }
  const c2 = (x: number) => (x * (x - 1)) / 2;
  const sum = (m: Map<string, number>) => [...m.values()].reduce((s, v) => s + c2(v), 0);
  const index = sum(pairs);
  const sa = sum(rowSums);
  const sb = sum(colSums);
  const expected = (sa * sb) / c2(n);
  const max = (sa + sb) / 2;
  return max === expected ? 1 : (index - expected) / (max - expected);
}
