import type { Random } from '../random';

/** m distinct indices of 0..n-1 drawn without replacement (partial Fisher–Yates), ascending. */
export function sampleIndices(n: number, m: number, random: Random): Int32Array {
  const take = Math.min(n, m);
  const pool = new Int32Array(n);
  for (let i = 0; i < n; i++) pool[i] = i;
  if (take === n) return pool;
  for (let i = 0; i < take; i++) {
    const j = i + Math.floor(random() * (n - i));
    const t = pool[i];
    pool[i] = pool[j];
    pool[j] = t;
  }
  return pool.slice(0, take).sort();
}
