/** Rows per storage block of a growing column. */
export const BLOCK = 65536;

type Typed = Float32Array | Float64Array | Int32Array;

/** Joins equally sized blocks into one array of n values, dropping each block once copied. */
export function joinBlocks<T extends Typed>(blocks: T[], n: number, make: (n: number) => T): T {
  const out = make(n);
  let at = 0;
  for (let b = 0; b < blocks.length && at < n; b++) {
    const take = Math.min(BLOCK, n - at);
    out.set(take === BLOCK ? blocks[b] : blocks[b].subarray(0, take), at);
    at += take;
    (blocks as (T | null)[])[b] = null;
  }
  blocks.length = 0;
  return out;
}
